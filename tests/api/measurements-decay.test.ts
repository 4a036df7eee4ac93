import request from 'supertest';
import { WaveFile } from 'wavefile';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { decodeWav } from '../../shared/analysis/wav-decode';
import { webAudioRender } from '../reference/web-audio';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectProblem } from './calculation-helpers';

// Decay plots stored with a measurement, checked against decays known in closed form.

let ctx: TestContext;
let roomId: string;
beforeAll(async () => {
  ctx = await createTestContext();
  const room = await request(ctx.app)
    .post('/v1/rooms')
    .set(auth())
    .send(structuredClone({ ...STAGE3_ROOM }));
  expect(room.status).toBe(201);
  roomId = room.body.id;
});
afterAll(async () => {
  await ctx.close();
});

const FS = 48000;
const auth = () => ({ Authorization: `Bearer ${ctx.keys.tuning}` });
const base = () => `/v1/rooms/${roomId}/measurements`;

function wav(channels: Float64Array[]): Buffer {
  const data = channels.map((c) => Int32Array.from(c, (v) => Math.round(v * 8388607)));
  const file = new WaveFile();
  file.fromScratch(channels.length, FS, '24', channels.length === 1 ? data[0] : data);
  return Buffer.from(file.toBuffer());
}

function postFile(file: Buffer, fields: Record<string, string | number>, name = 'take.wav') {
  let call = request(ctx.app).post(base()).set(auth());
  for (const [key, value] of Object.entries(fields)) call = call.field(key, String(value));
  return call.attach('file', file, name);
}

interface Plot {
  timesMs: number[];
  frequenciesHz: number[];
  levelDb: number[][];
  window: { name: string };
}

/** Index of the plot's frequency nearest `hz` (on a log axis). */
const nearest = (plot: Plot, hz: number) =>
  plot.frequenciesHz.reduce(
    (best, f, i, all) => (Math.abs(Math.log(f / hz)) < Math.abs(Math.log(all[best] / hz)) ? i : best),
    0,
  );

/** How far the line at `hz` has fallen in each slice from slice `from`, against the expected dB per ms. */
function fallErrors(plot: Plot, hz: number, dbPerMs: number, from = 0): number[] {
  const bin = nearest(plot, hz);
  return plot.timesMs.slice(from).map((t, k) => {
    const drop = plot.levelDb[from + k][bin] - plot.levelDb[from][bin];
    return Math.abs(drop + dbPerMs * (t - plot.timesMs[from]));
  });
}

describe('decay plots of a stored measurement', () => {
  it('show an exponentially decaying 1 kHz tone falling at its analytic rate, and are read back', async () => {
    // h(t) = e^(−δt)·sin(2π·1000·t): its level falls 20·log10(e)·δ = 8.686·δ dB per second (the decay
    // of a single mode, Kuttruff, "Room Acoustics", 5th ed., §3.1: T = 6.91/δ). δ = 40 /s: 0.347 dB/ms.
    const delta = 40;
    const arrival = 960;
    const tone = Float64Array.from({ length: FS }, (_, i) =>
      i < arrival
        ? 0
        : 0.5 * Math.exp((-delta * (i - arrival)) / FS) * Math.sin((2 * Math.PI * 1000 * (i - arrival)) / FS),
    );
    const res = await postFile(wav([tone]), {
      channel: 'M+000',
      micPosition: 'MLP',
      waterfall: 'true',
      spectrogram: 'true',
      decaySlices: 6,
      decayBins: 48,
      decayFromHz: 100,
      decayToHz: 10000,
      decaySpanMs: 100,
      spectrogramWindowMs: 20,
    });
    expect(res.status).toBe(201);
    expectToMatchContract('createMeasurement', 201, res.body);
    const dbPerMs = (20 * Math.LOG10E * delta) / 1000;
    const { waterfall, spectrogram } = res.body.result as { waterfall: Plot; spectrogram: Plot };
    expect(waterfall.timesMs).toEqual([0, 20, 40, 60, 80, 100]);
    expect(waterfall.levelDb).toHaveLength(6);
    expect(waterfall.levelDb[0]).toHaveLength(48);
    expect(waterfall.window.name).toBe('rectangular start, half-Hann end');
    // Cumulative spectral decay: each slice is the same decay started later, so 1 kHz falls by δ·t
    // (the tail past the fixed 500 ms end is e^(−2δ·0.4 s) ≈ −139 dB of the energy: nothing). 0.5 dB: the
    // detected arrival may sit a sample off the true one, which moves no slice's level by more than that.
    for (const error of fallErrors(waterfall, 1000, dbPerMs)) expect(error).toBeLessThan(0.5);
    // Spectrogram: a 20 ms Hann window wholly inside the decay reads e^(−δ·centre) times a constant, so
    // from the slice centred 20 ms in (the first with its whole window after the arrival) the same rate holds.
    expect(spectrogram.window.name).toBe('hann');
    for (const error of fallErrors(spectrogram, 1000, dbPerMs, 1)) expect(error).toBeLessThan(0.5);

    const read = await request(ctx.app).get(`${base()}/${res.body.id}`).set(auth());
    expect(read.body.result.waterfall).toEqual(waterfall);
    const list = await request(ctx.app).get(base()).set(auth());
    expect(list.body.data[0].result).toBeUndefined();
  });

  it('are stored from a recorded sweep through a resonance whose decay the cookbook formulas give', async () => {
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
    const sweep = decodeWav(signal.body as Buffer).samples;
    // The sweep through node-web-audio-api's band-pass BiquadFilterNode (W3C Web Audio API, an independent
    // implementation of R. Bristow-Johnson's "Cookbook formulae for audio EQ biquad filter coefficients"),
    // f0 = 1 kHz, Q = 50. Its poles have radius r = sqrt(a2/a0) = sqrt((1 − α)/(1 + α)) with
    // α = sin(ω0)/(2Q): the ringing at f0 falls by −20·log10(r) dB per sample.
    const Q = 50;
    const alpha = Math.sin((2 * Math.PI * 1000) / FS) / (2 * Q);
    const dbPerMs = (-20 * Math.log10(Math.sqrt((1 - alpha) / (1 + alpha))) * FS) / 1000;
    const padded = new Float64Array(sweep.length + FS);
    padded.set(sweep);
    const recorded = webAudioRender({
      sampleRateHz: FS,
      delaySamples: 0,
      biquad: { type: 'bandpass', frequency: 1000, Q, gain: 0 },
      signal: padded,
    });
    const res = await postFile(wav([recorded]), {
      channel: 'M-030',
      micPosition: 'MLP',
      fileKind: 'sweepRecording',
      durationS: 2,
      levelDbfs: -12,
      waterfall: 'true',
      decaySlices: 5,
      decayBins: 64,
      decayFromHz: 200,
      decayToHz: 5000,
      decaySpanMs: 40,
    });
    expect(res.status).toBe(201);
    expectToMatchContract('createMeasurement', 201, res.body);
    expect(res.body.source.fileKind).toBe('sweepRecording');
    expect(res.body.result.spectrogram).toBeUndefined();
    const waterfall = res.body.result.waterfall as Plot;
    expect(waterfall.timesMs).toEqual([0, 10, 20, 30, 40]);
    // 1 dB: the deconvolved response is band-limited by the sweep and regularised, which adds a little
    // ringing of its own under the resonance's (≈ 0.54 dB/ms here, 22 dB over the span).
    for (const error of fallErrors(waterfall, 1000, dbPerMs)) expect(error).toBeLessThan(1);
  });

  it('are refused, naming the field, on a text response and when the span reaches the window', async () => {
    const text = Buffer.from('20 80\n20000 80\n');
    const before = (await request(ctx.app).get(`${base()}?limit=100`).set(auth())).body.data.length;
    expectProblem(
      await postFile(text, { channel: 'M+000', waterfall: 'true' }, 'response.txt'),
      422,
      '/body/waterfall',
    );
    expectProblem(
      await postFile(text, { channel: 'M+000', decayBins: 32 }, 'response.txt'),
      422,
      '/body/decayBins',
    );
    const tone = Float64Array.from({ length: FS / 2 }, (_, i) => Math.exp(-i / 2000) * Math.sin(i / 5));
    expectProblem(
      await postFile(wav([tone]), { channel: 'M+000', waterfall: 'true', decaySpanMs: 600 }),
      422,
      '/body/decaySpanMs',
    );
    expectProblem(
      await postFile(wav([tone]), { channel: 'M+000', decaySlices: 129 }),
      400,
      '/body/decaySlices',
    );
    expect((await request(ctx.app).get(`${base()}?limit=100`).set(auth())).body.data.length).toBe(before);
  });
});
