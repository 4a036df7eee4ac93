import request from 'supertest';
import { WaveFile } from 'wavefile';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { decodeWav } from '../../shared/analysis/wav-decode';
import { webAudioRender, webAudioResponses } from '../reference/web-audio';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectProblem } from './calculation-helpers';

let ctx: TestContext;
let roomId: string;
/** The sweep as the service makes it: 2 s, 20 Hz–20 kHz, −12 dBFS, 48 kHz, 24-bit. */
let sweep: Float64Array;
beforeAll(async () => {
  ctx = await createTestContext();
  const room = await request(ctx.app)
    .post('/v1/rooms')
    .set(auth())
    .send(structuredClone({ ...STAGE3_ROOM }));
  expect(room.status).toBe(201);
  roomId = room.body.id;
  const signal = await request(ctx.app)
    .post('/v1/test-signals')
    .set(auth())
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    })
    .send({ kind: 'sweep', durationS: 2, levelDbfs: -12 });
  expect(signal.status).toBe(200);
  sweep = decodeWav(signal.body as Buffer).samples;
});
afterAll(async () => {
  await ctx.close();
});

const FS = 48000;
const auth = (key?: string) => ({ Authorization: `Bearer ${key ?? ctx.keys.tuning}` });
const base = () => `/v1/rooms/${roomId}/measurements`;

function wav(channels: Float64Array[]): Buffer {
  const data = channels.map((c) => Int32Array.from(c, (v) => Math.round(v * 8388607)));
  const file = new WaveFile();
  file.fromScratch(channels.length, FS, '24', channels.length === 1 ? data[0] : data);
  return Buffer.from(file.toBuffer());
}

function postFile(file: Buffer, fields: Record<string, string | number>, name = 'recording.wav') {
  let call = request(ctx.app).post(base()).set(auth());
  for (const [key, value] of Object.entries(fields)) call = call.field(key, String(value));
  return call.attach('file', file, name);
}

/** `length` samples holding `signal` from sample `at` on. */
function placed(signal: ArrayLike<number>, length: number, at: number): Float64Array {
  const out = new Float64Array(length);
  for (let i = 0; i < signal.length && at + i < length; i++) out[at + i] = signal[i];
  return out;
}

describe('a recorded sweep stored as a measurement of the room', () => {
  const PEAK = { type: 'peaking' as const, frequency: 1000, Q: 1.4, gain: 6 };

  it('is deconvolved and stored with its delay from the loopback and the response of the filter it went through', async () => {
    // The recording: the service's own sweep through a cookbook peaking filter rendered by
    // node-web-audio-api's OfflineAudioContext (an independent implementation, W3C Web Audio API
    // BiquadFilterNode), started 240 samples (interface latency) + 451 samples (3.22 m at 343 m/s) late;
    // the loopback input hears the sweep after the latency only.
    const latency = 240;
    const flight = 451;
    const length = sweep.length + FS;
    const filtered = webAudioRender({ sampleRateHz: FS, delaySamples: 0, biquad: PEAK, signal: sweep });
    const mic = placed(filtered, length, latency + flight);
    const loopback = placed(sweep, length, latency);
    const res = await postFile(wav([mic, loopback]), {
      channel: 'M+000',
      micPosition: 'MLP',
      fileKind: 'sweepRecording',
      fileChannel: 0,
      referenceFileChannel: 1,
      durationS: 2,
      levelDbfs: -12,
      smoothingOctaves: 0.0208,
    });
    expect(res.status).toBe(201);
    expectToMatchContract('createMeasurement', 201, res.body);
    expect(res.body.kind).toBe('impulseResponse');
    expect(res.body.source).toMatchObject({
      type: 'wav',
      fileKind: 'sweepRecording',
      channelCount: 2,
      channelIndex: 0,
      sweep: {
        startHz: 20,
        endHz: 20000,
        durationS: 2,
        levelDbfs: -12,
        method: 'regularizedDivision',
        offsetS: 0,
      },
    });
    // The delay: within one sample of the flight time, counted from the loopback.
    const flightMs = (flight / FS) * 1000;
    expect(Math.abs(res.body.summary.arrivalFromReferenceMs - flightMs)).toBeLessThanOrEqual(1000 / FS);
    expect(res.body.result.timingReference).toMatchObject({ source: 'loopback', fileChannel: 1 });
    expect(Math.abs(res.body.result.timing.arrivalFromReferenceSamples - flight)).toBeLessThanOrEqual(1);
    expect(res.body.result.distortion.harmonics.map((h: { harmonic: number }) => h.harmonic)).toEqual([
      2, 3, 4, 5,
    ]);

    // The response against the filter's own magnitude from node-web-audio-api's getFrequencyResponse,
    // between 100 Hz and 10 kHz (f2/2), within ±0.25 dB (1/48-octave power smoothing of a Q 1.4 peak).
    const { frequenciesHz, magnitudeDb } = res.body.result.frequencyResponse as {
      frequenciesHz: number[];
      magnitudeDb: number[];
    };
    const inBand = frequenciesHz.map((f, i) => [f, i]).filter(([f]) => f >= 100 && f <= 10000);
    const [reference] = webAudioResponses([
      { sampleRateHz: FS, frequenciesHz: inBand.map(([f]) => f), biquad: PEAK },
    ]);
    const worst = Math.max(
      ...inBand.map(([, i], k) => Math.abs(magnitudeDb[i] - 20 * Math.log10(reference.magnitude[k]))),
    );
    expect(worst).toBeLessThan(0.25);
    const at1k = inBand.findIndex(([f]) => f >= 1000);
    expect(magnitudeDb[inBand[at1k][1]]).toBeGreaterThan(5.5);

    // Read back: the same measurement, analysis and all.
    const read = await request(ctx.app).get(`${base()}/${res.body.id}`).set(auth());
    expect(read.status).toBe(200);
    expect(read.body.result.arrival).toEqual(res.body.result.arrival);
    expect(read.body.summary).toEqual(res.body.summary);
  });

  it('analyses one slot of a sequence without a loopback; its arrival includes the latency', async () => {
    const period = sweep.length + FS;
    const recording = new Float64Array(2 * period);
    recording.set(placed(sweep, period, 300), 0);
    recording.set(
      placed(
        sweep.map((x) => 0.25 * x),
        period,
        700,
      ),
      period,
    );
    const res = await postFile(wav([recording]), {
      channel: 'M+030',
      fileKind: 'sweepRecording',
      durationS: 2,
      offsetS: period / FS,
      lengthS: period / FS,
    });
    expect(res.status).toBe(201);
    expect(res.body.result.arrival.peakSample).toBe(700);
    expect(res.body.summary.arrivalFromReferenceMs).toBeUndefined();
    expect(res.body.source.sweep).toMatchObject({ offsetS: period / FS, lengthS: period / FS });
    const at1k = res.body.result.frequencyResponse.frequenciesHz.findIndex((f: number) => f >= 1000);
    expect(res.body.result.frequencyResponse.magnitudeDb[at1k]).toBeCloseTo(20 * Math.log10(0.25), 1);
  });

  it('refuses sweep fields on other files, a given timing on a sweep, and a bad loopback — storing nothing', async () => {
    const before = (await request(ctx.app).get(`${base()}?limit=100`).set(auth())).body.data.length;
    const file = wav([placed(sweep, sweep.length + FS, 100)]);
    const twoChannels = wav([placed(sweep, sweep.length + FS, 100), new Float64Array(sweep.length + FS)]);
    // Sweep parameters without fileKind sweepRecording: the WAV would be read as an impulse response.
    expectProblem(await postFile(file, { channel: 'M+000', durationS: 2 }), 422, '/body/durationS');
    expectProblem(
      await postFile(file, { channel: 'M+000', fileKind: 'impulseResponse', method: 'inverseFilter' }),
      422,
      '/body/method',
    );
    expectProblem(
      await postFile(file, {
        channel: 'M+000',
        fileKind: 'sweepRecording',
        durationS: 2,
        timingReferenceMs: 5,
      }),
      422,
      '/body/timingReferenceMs',
    );
    const notWav = await postFile(
      Buffer.from('20 1\n20000 1\n'),
      { channel: 'M+000', fileKind: 'sweepRecording' },
      'r.txt',
    );
    expectProblem(notWav, 422, '/body/file');
    expect(notWav.body.reason).toBe('notWav');
    expectProblem(
      await postFile(twoChannels, {
        channel: 'M+000',
        fileKind: 'sweepRecording',
        durationS: 2,
        fileChannel: 0,
        referenceFileChannel: 0,
      }),
      422,
      '/body/referenceFileChannel',
    );
    const silent = await postFile(twoChannels, {
      channel: 'M+000',
      fileKind: 'sweepRecording',
      durationS: 2,
      fileChannel: 0,
      referenceFileChannel: 1,
    });
    expectProblem(silent, 422, '/body/referenceFileChannel');
    expectProblem(
      await postFile(twoChannels, {
        channel: 'M+000',
        fileKind: 'sweepRecording',
        durationS: 2,
        fileChannel: 0,
        endHz: 30000,
      }),
      422,
      '/body/endHz',
    );
    expectProblem(
      await postFile(file, { channel: 'M+000', fileKind: 'sweepRecording', durationS: 2, offsetS: 10 }),
      422,
      '/body/offsetS',
    );
    expectProblem(await postFile(file, { channel: 'M+000', fileKind: 'wave' }), 400, '/body/fileKind');
    const after = (await request(ctx.app).get(`${base()}?limit=100`).set(auth())).body.data.length;
    expect(after).toBe(before);
  });
});
