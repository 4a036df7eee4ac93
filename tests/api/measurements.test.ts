import request from 'supertest';
import { WaveFile } from 'wavefile';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { noisyDecay } from '../../shared/analysis/test-signals';
import { expectToMatchContract, responseValidator } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectProblem } from './calculation-helpers';
import { expectAnswered } from '../support/presentation';

let ctx: TestContext;
let roomId: string;
beforeAll(async () => {
  ctx = await createTestContext();
  const res = await request(ctx.app)
    .post('/v1/rooms')
    .set('Authorization', `Bearer ${ctx.keys.tuning}`)
    .send(structuredClone({ ...STAGE3_ROOM }));
  expect(res.status).toBe(201);
  roomId = res.body.id;
});
afterAll(async () => {
  await ctx.close();
});

const base = () => `/v1/rooms/${roomId}/measurements`;
const auth = (key = ctx.keys.tuning) => ({ Authorization: `Bearer ${key}` });
const postJson = (body: unknown, key?: string) =>
  request(ctx.app)
    .post(base())
    .set(auth(key))
    .send(body as object);
function postFile(file: Buffer, fileName: string, fields: Record<string, string>, key?: string) {
  let call = request(ctx.app).post(base()).set(auth(key));
  for (const [name, value] of Object.entries(fields)) call = call.field(name, value);
  return call.attach('file', file, fileName);
}
const count = async () =>
  (await request(ctx.app).get(`${base()}?limit=100`).set(auth())).body.data.length as number;

function wav24(channels: Float64Array[]): Buffer {
  const file = new WaveFile();
  const data = channels.map((c) => Array.from(c, (v) => Math.round(v * 8388607)));
  file.fromScratch(channels.length, 48000, '24', channels.length === 1 ? data[0] : data);
  return Buffer.from(file.toBuffer());
}

describe('stored measurements', () => {
  it('stores an impulse response from a multichannel WAV with its analysis, the room modes included', async () => {
    const t60 = 0.35;
    const decay = noisyDecay({
      sampleRateHz: 48000,
      durationS: 1.5,
      t60S: t60,
      startSample: 480,
      startRms: 0.1,
      noiseDb: -70,
      seed: 8,
    });
    const res = await postFile(wav24([new Float64Array(72000), decay]), 'centre.wav', {
      channel: 'M+000',
      micPosition: 'MLP',
      fileChannel: '1',
    });
    expect(res.status).toBe(201);
    expectToMatchContract('createMeasurement', 201, res.body);
    expect(res.headers.location).toBe(`${base()}/${res.body.id}`);
    expect(res.body).toMatchObject({ channel: 'M+000', micPosition: 'MLP', kind: 'impulseResponse' });
    expect(res.body.source).toMatchObject({
      type: 'wav',
      fileName: 'centre.wav',
      channelCount: 2,
      channelIndex: 1,
      encoding: 'pcm24',
    });
    expect(res.body.result.arrival.arrivalMs).toBeGreaterThanOrEqual(10);
    // 5 %: the JND of reverberation time, ISO 3382-1 Annex A (from memory).
    expect(Math.abs(res.body.result.decay.t30S / t60 - 1)).toBeLessThan(0.05);
    // Stage 3 is 7.40 m long: first axial mode c/(2L) = 343.2/14.8 Hz at 20 °C.
    expectAnswered(res.body.result.room.modes[0].frequencyHz, 343.2 / 14.8, 'hz');
    const read = await request(ctx.app).get(`${base()}/${res.body.id}`).set(auth());
    expect(read.status).toBe(200);
    expectToMatchContract('getMeasurement', 200, read.body);
    expect(read.body.result.frequencyResponse.magnitudeDb).toEqual(
      res.body.result.frequencyResponse.magnitudeDb,
    );
    // The contract types the result by kind: the same answer with the analysis's arrival gone, a frequency
    // response whose levels are not numbers, or an SPL reading with an unknown weighting matches none.
    const validate = responseValidator('getMeasurement', 200)!;
    const { arrival: _arrival, ...withoutArrival } = read.body.result;
    expect(validate({ ...read.body, result: withoutArrival })).toBe(false);
    expect(validate({ ...read.body, result: { frequenciesHz: [20], magnitudeDb: 'loud' } })).toBe(false);
    expect(validate({ ...read.body, result: { splDb: 84, weighting: 'B', timeWeighting: 'slow' } })).toBe(
      false,
    );
    expect(validate(read.body)).toBe(true);
  });

  it('stores a text frequency response from a file and from JSON, and an SPL reading', async () => {
    const text = '# demo data\nFreq(Hz);dB;deg\n20;80,5;0\n40;82;-10\n80;79,25;-20\n';
    const fromFile = await postFile(Buffer.from(text), 'left.txt', { channel: 'M+030', micPosition: '1' });
    expect(fromFile.status).toBe(201);
    expectToMatchContract('createMeasurement', 201, fromFile.body);
    expect(fromFile.body.result).toEqual({
      frequenciesHz: [20, 40, 80],
      magnitudeDb: [80.5, 82, 79.25],
      phaseDeg: [0, -10, -20],
    });

    const fromJson = await postJson({
      kind: 'frequencyResponse',
      channel: 'M+030',
      micPosition: '2',
      text: '20 74.5\n40 76\n80 73.25',
    });
    expect(fromJson.status).toBe(201);
    expectToMatchContract('createMeasurement', 201, fromJson.body);
    expect(fromJson.body.source).toEqual({ type: 'text' });

    const spl = await postJson({ kind: 'spl', channel: 'M+000', splDb: 84.6 });
    expect(spl.status).toBe(201);
    expectToMatchContract('createMeasurement', 201, spl.body);
    expect(spl.body).toMatchObject({
      micPosition: '1',
      result: { splDb: 84.6, weighting: 'C', timeWeighting: 'slow' },
    });
  });

  it('power-averages a channel over its microphone positions (10·log10 of the mean of 10^(L/10))', async () => {
    const res = await request(ctx.app).get(`${base()}/average?channel=M%2B030`).set(auth());
    expect(res.status).toBe(200);
    expectToMatchContract('averageMeasurements', 200, res.body);
    expect(res.body.micPositions).toEqual(['1', '2']);
    // The two responses differ by exactly 6 dB at every frequency, so their power average lies
    // 10·log10((1 + 10^−0.6)/2) = −1.969 dB from the louder one everywhere; at 20 Hz the louder reads 80.5 dB.
    const offset = 10 * Math.log10((1 + Math.pow(10, -0.6)) / 2);
    const first = await request(ctx.app).get(`${base()}?channel=M%2B030`).set(auth());
    expect(first.body.data).toHaveLength(2);
    expect(res.body.frequenciesHz[0]).toBeLessThan(20.3);
    expect(Math.abs(res.body.magnitudeDb[0] - (80.5 + offset))).toBeLessThan(0.05);
  });

  it('lists without arrays, filtered by channel, and deletes', async () => {
    const list = await request(ctx.app).get(`${base()}?channel=M%2B000`).set(auth());
    expect(list.status).toBe(200);
    expectToMatchContract('listMeasurements', 200, list.body);
    expect(list.body.data.map((m: { kind: string }) => m.kind)).toEqual(['impulseResponse', 'spl']);
    expect(list.body.data[0].result).toBeUndefined();
    expect(list.body.data[0].summary.t30S).toBeGreaterThan(0);
    const id = list.body.data[1].id;
    expect((await request(ctx.app).delete(`${base()}/${id}`).set(auth())).status).toBe(204);
    expect((await request(ctx.app).get(`${base()}/${id}`).set(auth())).status).toBe(404);
  });

  describe('refuses bad uploads and stores nothing', () => {
    it.each([
      [
        'a truncated WAV',
        () => wav24([new Float64Array(4800).fill(0.1)]).subarray(0, 3000),
        'ir.wav',
        'truncated',
      ],
      ['a silent WAV', () => wav24([new Float64Array(4800)]), 'ir.wav', 'silent'],
      ['an empty WAV', () => Buffer.alloc(0), 'ir.wav', 'emptyFile'],
      ['a WAV that is not one', () => Buffer.from('not audio at all'), 'ir.wav', 'notWav'],
    ])('%s (422 unusable-audio)', async (_name, file, fileName, reason) => {
      const before = await count();
      const res = await postFile(file(), fileName, { channel: 'M+000' });
      expectProblem(res, 422, '/body/file');
      expect(res.body.reason).toBe(reason);
      expect(await count()).toBe(before);
    });

    it('a multichannel WAV without fileChannel names /body/fileChannel', async () => {
      const res = await postFile(wav24([new Float64Array(4800), new Float64Array(4800)]), 'ir.wav', {
        channel: 'M+000',
      });
      expectProblem(res, 422, '/body/fileChannel');
      expect(res.body.detail).toMatch(/with fileChannel/);
    });

    it('a malformed text response names the line', async () => {
      const before = await count();
      const res = await postFile(Buffer.from('20 80\n40 eighty\n'), 'r.txt', { channel: 'M+030' });
      expectProblem(res, 422, '/body/file');
      expect(res.body.detail).toMatch(/line 2/);
      expect(await count()).toBe(before);
    });

    it.each([
      ['an unknown channel', { kind: 'spl', channel: 'M+999', splDb: 80 }, 422, '/body/channel'],
      ['an SPL out of range', { kind: 'spl', channel: 'M+000', splDb: 200 }, 400, '/body'],
      [
        'a response given twice',
        {
          kind: 'frequencyResponse',
          channel: 'M+030',
          text: '20 80\n40 81',
          response: { frequenciesHz: [20, 40], magnitudeDb: [80, 81] },
        },
        422,
        '/body/response',
      ],
      [
        'descending frequencies',
        {
          kind: 'frequencyResponse',
          channel: 'M+030',
          response: { frequenciesHz: [40, 20], magnitudeDb: [80, 81] },
        },
        422,
        '/body/response/frequenciesHz/1',
      ],
    ])('%s', async (_name, body, status, pointer) => {
      const res = await postJson(body);
      expect(res.status).toBe(status);
      expect(JSON.stringify(res.body.errors)).toContain(pointer);
    });
  });

  it('keeps rooms private: another owner gets 404, a calculate key 403', async () => {
    expect((await postJson({ kind: 'spl', channel: 'M+000', splDb: 80 }, ctx.keys.otherTuning)).status).toBe(
      404,
    );
    expect((await request(ctx.app).get(base()).set(auth(ctx.keys.otherTuning))).status).toBe(404);
    expect((await postJson({ kind: 'spl', channel: 'M+000', splDb: 80 }, ctx.keys.calculate)).status).toBe(
      403,
    );
    expect(
      (await postFile(Buffer.from('20 80\n40 81'), 'r.txt', { channel: 'M+000' }, ctx.keys.calculate)).status,
    ).toBe(403);
  });
});

describe('deleting a room', () => {
  it('takes its measurements with it', async () => {
    const created = await request(ctx.app)
      .post('/v1/rooms')
      .set(auth())
      .send(structuredClone({ ...STAGE3_ROOM, name: 'Stage 3 (to delete)' }));
    expect(created.status).toBe(201);
    const path = `/v1/rooms/${created.body.id}/measurements`;
    const stored = await request(ctx.app)
      .post(path)
      .set(auth())
      .send({ kind: 'spl', channel: 'M+000', splDb: 79.4 });
    expect(stored.status).toBe(201);

    expect((await request(ctx.app).delete(`/v1/rooms/${created.body.id}`).set(auth())).status).toBe(204);
    expect((await request(ctx.app).get(`${path}/${stored.body.id}`).set(auth())).status).toBe(404);
    expect(await ctx.db.models.Measurement.count({ where: { roomId: created.body.id } })).toBe(0);
  });
});

describe('spatial average of mixed kinds', () => {
  it('refuses to average dBFS impulse-response analyses with SPL-scale frequency responses unless kind is named', async () => {
    const decay = noisyDecay({
      sampleRateHz: 48000,
      durationS: 1,
      t60S: 0.3,
      startSample: 480,
      startRms: 0.1,
      noiseDb: -70,
      seed: 3,
    });
    expect((await postFile(wav24([decay]), 'right.wav', { channel: 'M-030', micPosition: '1' })).status).toBe(
      201,
    );
    const text = await postJson({
      kind: 'frequencyResponse',
      channel: 'M-030',
      micPosition: '2',
      text: '20 74.5\n40 76\n80 73.25\n20000 70',
    });
    expect(text.status).toBe(201);

    const mixed = await request(ctx.app).get(`${base()}/average?channel=M-030`).set(auth());
    expectProblem(mixed, 422, '/query/kind');
    const onlyText = await request(ctx.app)
      .get(`${base()}/average?channel=M-030&kind=frequencyResponse`)
      .set(auth());
    expect(onlyText.status).toBe(200);
    expect(onlyText.body.measurementIds).toEqual([text.body.id]);
  });
});
