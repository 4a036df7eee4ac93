import request from 'supertest';
import { WaveFile } from 'wavefile';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectProblem } from './calculation-helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const FS = 48000;
const auth = (key?: string) => ({ Authorization: `Bearer ${key ?? ctx.keys.tuning}` });
const CALIBRATION = '"Invented test microphone"\n# Hz, dB, deg\n100, -2, 10\n1000, 0, 0\n10000, 3, -20\n';

function wav(samples: Float64Array): Buffer {
  const file = new WaveFile();
  file.fromScratch(
    1,
    FS,
    '24',
    Array.from(samples, (v) => Math.round(v * 8388607)),
  );
  return Buffer.from(file.toBuffer());
}
const sine = (hz: number, rmsDbfs: number, seconds: number) =>
  Float64Array.from(
    { length: seconds * FS },
    (_, i) => Math.SQRT2 * Math.pow(10, rmsDbfs / 20) * Math.sin((2 * Math.PI * hz * i) / FS),
  );
const impulse = (length: number, at: number, amplitude: number) => {
  const x = new Float64Array(length);
  x[at] = amplitude;
  return x;
};

async function createMic(body: object = {}, key?: string) {
  return request(ctx.app)
    .post('/v1/microphones')
    .set(auth(key))
    .send({
      name: 'Test mic',
      serial: 'T-1',
      calibrationText: CALIBRATION,
      calibrationFileName: 't-1.txt',
      ...body,
    });
}

describe('/v1/microphones', () => {
  it('stores a microphone with its parsed calibration; lists, reads, changes and deletes it', async () => {
    const created = await createMic({ sensitivity: { dbfsAt94DbSpl: -30 } });
    expect(created.status).toBe(201);
    expectToMatchContract('createMicrophone', 201, created.body);
    expect(created.headers.location).toBe(`/v1/microphones/${created.body.id}`);
    expect(created.body).toMatchObject({
      name: 'Test mic',
      serial: 'T-1',
      calibration: {
        fileName: 't-1.txt',
        points: 3,
        fromHz: 100,
        toHz: 10000,
        magnitudeDb: [-2, 0, 3],
        phaseDeg: [10, 0, -20],
      },
      sensitivity: { dbfsAt94DbSpl: -30 },
      // 94 dB SPL reads −30 dBFS: SPL = dBFS + 124.
      splOffset: { offsetDb: 124, source: 'sensitivity' },
    });
    const id = created.body.id;
    const list = await request(ctx.app).get('/v1/microphones').set(auth());
    expectToMatchContract('listMicrophones', 200, list.body);
    expect(list.body.data.map((m: { id: string }) => m.id)).toContain(id);
    const changed = await request(ctx.app)
      .patch(`/v1/microphones/${id}`)
      .set(auth())
      .send({ name: 'Renamed', sensitivity: { mvPerPa: 12.5 }, calibrationText: null });
    expect(changed.status).toBe(200);
    expectToMatchContract('updateMicrophone', 200, changed.body);
    // mV/Pa alone gives no offset (the interface's gain is unknown); the sensitivity's offset goes with it.
    expect(changed.body).toMatchObject({
      name: 'Renamed',
      calibration: null,
      sensitivity: { mvPerPa: 12.5 },
      splOffset: null,
    });
    expect((await request(ctx.app).delete(`/v1/microphones/${id}`).set(auth())).status).toBe(204);
    expect((await request(ctx.app).get(`/v1/microphones/${id}`).set(auth())).status).toBe(404);
  });

  it('names the line of a calibration that cannot be read, and stores nothing', async () => {
    const before = (await request(ctx.app).get('/v1/microphones?limit=100').set(auth())).body.data.length;
    const bad = await createMic({ calibrationText: '# cal\n100 -2\n1000 zero\n' });
    expectProblem(bad, 422, '/body/calibrationText');
    expect(bad.body.errors[0].message).toMatch(/^line 3: /);
    expectProblem(await createMic({ calibrationText: undefined }), 422, '/body/calibrationFileName');
    expectProblem(
      await createMic({ sensitivity: { mvPerPa: 10, dbfsAt94DbSpl: -30 } }),
      400,
      '/body/sensitivity',
    );
    expect((await request(ctx.app).get('/v1/microphones?limit=100').set(auth())).body.data.length).toBe(
      before,
    );
  });

  it('needs role tuning', async () => {
    expect((await createMic({}, ctx.keys.calculate)).status).toBe(403);
  });

  it("turns a 94 dB calibrator recording into the offset, replacing the sensitivity's", async () => {
    const mic = (await createMic({ sensitivity: { dbfsAt94DbSpl: -30 } })).body;
    const res = await request(ctx.app)
      .post(`/v1/microphones/${mic.id}/calibrator`)
      .set(auth())
      .field('calibratorLevelDb', '94')
      .field('inputGain', 'Input 1 at +30 dB')
      .attach('file', wav(sine(1000, -26, 3)), 'cal.wav');
    expect(res.status).toBe(200);
    expectToMatchContract('readMicrophoneCalibrator', 200, res.body);
    // A sine of RMS −26 dBFS at 94 dB SPL: offset 120 dB (24-bit quantisation far below 0.05 dB).
    expect(Math.abs(res.body.reading.splOffsetDb - 120)).toBeLessThan(0.05);
    expect(res.body.microphone.splOffset).toMatchObject({
      source: 'calibrator',
      calibratorLevelDb: 94,
      inputGain: 'Input 1 at +30 dB',
    });
    expect(res.body.microphone.splOffset.offsetDb).toBe(res.body.reading.splOffsetDb);
    const wrongTone = await request(ctx.app)
      .post(`/v1/microphones/${mic.id}/calibrator`)
      .set(auth())
      .field('calibratorLevelDb', '94')
      .attach('file', wav(sine(440, -26, 3)), 'cal.wav');
    expectProblem(wrongTone, 422, '/body/file');
    expectProblem(
      await request(ctx.app)
        .post(`/v1/microphones/${mic.id}/calibrator`)
        .set(auth())
        .field('calibratorLevelDb', '100')
        .attach('file', wav(sine(1000, -26, 3)), 'cal.wav'),
      400,
      '/body/calibratorLevelDb',
    );
  });

  it('corrects an analysis that names it, says so, and gives dB SPL with an offset', async () => {
    const mic = (await createMic({ sensitivity: { dbfsAt94DbSpl: -30 } })).body;
    // A unit-gain response (0.5 impulse: −6.02 dB flat) measured through a microphone whose deviation is
    // −2 dB at 100 Hz, 0 at 1 kHz, +3 at 10 kHz: the corrected response reads −6.02 − deviation.
    const file = wav(impulse(FS, 480, 0.5));
    const plain = await request(ctx.app)
      .post('/v1/analysis/impulse-response')
      .set(auth())
      .attach('file', file, 'ir.wav');
    const res = await request(ctx.app)
      .post('/v1/analysis/impulse-response')
      .set(auth())
      .field('microphoneId', mic.id)
      .attach('file', file, 'ir.wav');
    expect(res.status).toBe(200);
    expectToMatchContract('analyzeImpulseResponse', 200, res.body);
    expect(res.body.microphone).toMatchObject({
      id: mic.id,
      correctionApplied: true,
      calibratedFromHz: 100,
      calibratedToHz: 10000,
      heldFlatBelowHz: 100,
      heldFlatAboveHz: 10000,
      phaseCorrected: true,
      splOffsetDb: 124,
    });
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('calibrationHeldFlat');
    const { frequenciesHz, magnitudeDb, splDb } = res.body.frequencyResponse;
    const at = (hz: number) => frequenciesHz.findIndex((f: number) => f >= hz);
    for (const hz of [100, 1000, 10000, 19000]) {
      const i = at(hz);
      // The grid point nearest above each frequency; the deviation there, interpolated on a log axis.
      const expected = plain.body.frequencyResponse.magnitudeDb[i] - deviationAt(frequenciesHz[i]);
      expect(magnitudeDb[i]).toBeCloseTo(expected, 6);
      // A 0 dBFS-peak sine (RMS −3.01 dBFS) through it at the microphone: magnitude − 3.01 + 124 dB SPL.
      expect(splDb[i]).toBeCloseTo(magnitudeDb[i] + 20 * Math.log10(Math.SQRT1_2) + 124, 1);
    }
    // The phase stays inside (−180, 180].
    for (const p of res.body.frequencyResponse.phaseDeg) expect(p > -180 && p <= 180).toBe(true);
  });

  it("corrects a stored measurement that names it; another owner's microphone is unknown", async () => {
    const mic = (await createMic()).body;
    const room = await request(ctx.app)
      .post('/v1/rooms')
      .set(auth())
      .send(structuredClone({ ...STAGE3_ROOM }));
    const res = await request(ctx.app).post(`/v1/rooms/${room.body.id}/measurements`).set(auth()).send({
      kind: 'frequencyResponse',
      channel: 'M+000',
      microphoneId: mic.id,
      text: '100 80\n1000 80\n10000 80\n',
    });
    expect(res.status).toBe(201);
    expectToMatchContract('createMeasurement', 201, res.body);
    expect(res.body.result.magnitudeDb).toEqual([82, 80, 77]);
    expect(res.body.result.microphone).toMatchObject({
      id: mic.id,
      correctionApplied: true,
      splOffsetDb: null,
    });
    const others = await request(ctx.app).post(`/v1/rooms/${room.body.id}/measurements`).set(auth()).send({
      kind: 'frequencyResponse',
      channel: 'M+000',
      microphoneId: 'mic_0000000000000000000',
      text: '100 80\n1000 80\n',
    });
    expectProblem(others, 422, '/body/microphoneId');
  });
});

/** The test calibration's deviation at a frequency: linear in log f between 100 Hz, 1 kHz and 10 kHz, flat beyond. */
function deviationAt(hz: number): number {
  if (hz <= 100) return -2;
  if (hz >= 10000) return 3;
  if (hz <= 1000) return -2 + 2 * Math.log10(hz / 100);
  return 3 * Math.log10(hz / 1000);
}
