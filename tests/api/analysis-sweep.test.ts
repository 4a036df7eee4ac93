import request from 'supertest';
import { WaveFile } from 'wavefile';
import { exponentialSweep, harmonicAdvanceS, type SweepSpec } from '../../shared/capture/sweep';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectProblem } from './calculation-helpers';
import { expectAnswered } from '../support/presentation';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const FS = 48000;
/** A 2 s sweep with the test-signal defaults otherwise (20 Hz–20 kHz, fades 50/10 ms, −12 dBFS). */
const SWEEP: SweepSpec = {
  sampleRateHz: FS,
  startHz: 20,
  endHz: 20000,
  durationS: 2,
  fadeInS: 0.05,
  fadeOutS: 0.01,
  levelDbfs: -12,
  silenceAfterS: 0,
};
const sweep = exponentialSweep(SWEEP);

/** A 24-bit WAV of the channels (full scale ±1), encoded with wavefile. */
function wav(channels: Float64Array[]): Buffer {
  const data = channels.map((c) => Int32Array.from(c, (v) => Math.round(v * 8388607)));
  const file = new WaveFile();
  file.fromScratch(channels.length, FS, '24', channels.length === 1 ? data[0] : data);
  return Buffer.from(file.toBuffer());
}

/** `length` samples with the sweep (through `shape`) starting at `at`. */
function placed(length: number, at: number, shape: (x: number) => number = (x) => x): Float64Array {
  const out = new Float64Array(length);
  for (let i = 0; i < sweep.length && at + i < length; i++) out[at + i] = shape(sweep[i]);
  return out;
}

function upload(file: Buffer, fields: Record<string, string | number>) {
  let call = request(ctx.app).post('/v1/analysis/sweep').set('Authorization', `Bearer ${ctx.keys.calculate}`);
  for (const [key, value] of Object.entries(fields)) call = call.field(key, String(value));
  return call.attach('file', file, 'recording.wav');
}

describe('POST /v1/analysis/sweep', () => {
  it('measures the arrival from the loopback channel and separates the harmonics of a distorting system', async () => {
    const latency = 240;
    const flight = 451; // 3.22 m at 343 m/s
    const length = sweep.length + FS;
    const mic = placed(length, latency + flight, (x) => 0.5 * (x + 0.3 * x * x));
    const loopback = placed(length, latency);
    const res = await upload(wav([mic, loopback]), { channel: 0, referenceChannel: 1, durationS: 2 });
    expect(res.status).toBe(200);
    expectToMatchContract('analyzeSweepRecording', 200, res.body);
    expect(res.body.arrival.peakSample).toBe(latency + flight);
    expect(res.body.timing.referencePeakSample).toBe(latency);
    expect(Math.abs(res.body.timing.arrivalFromReferenceSamples - flight)).toBeLessThanOrEqual(1);
    expectAnswered(res.body.timing.peakFromReferenceMs, (flight / FS) * 1000, 'ms');
    // Gain 0.5: the response reads 20·log10(0.5) = −6.02 dB at 1 kHz (24-bit quantisation far below).
    const at1k = res.body.frequencyResponse.frequenciesHz.findIndex((f: number) => f >= 1000);
    expect(res.body.frequencyResponse.magnitudeDb[at1k]).toBeCloseTo(-6.0206, 1);
    const second = res.body.distortion.harmonics.find((h: { harmonic: number }) => h.harmonic === 2);
    expect(second.advanceS).toBeCloseTo(harmonicAdvanceS(SWEEP, 2), 12);
    // 0.3·x² of A·sin: 2nd harmonic 0.3·A/2 re the fundamental (A = 10^(−12/20)), about −26.5 dB.
    const expected = 20 * Math.log10((0.3 * Math.pow(10, -12 / 20)) / 2);
    const at1kH = second.frequenciesHz.findIndex((f: number) => f >= 1000);
    expect(Math.abs(second.levelDb[at1kH] - expected)).toBeLessThan(0.2);
    expect(res.body.deconvolution).toMatchObject({ method: 'regularizedDivision', fftSize: 262144 });
    expect(res.body.file).toMatchObject({ channelCount: 2, channelIndex: 0, encoding: 'pcm24' });
  });

  it('analyses one slot of a sweep sequence from its offset and period', async () => {
    const period = sweep.length + FS;
    const mic = new Float64Array(2 * period);
    mic.set(placed(period, 300), 0);
    mic.set(
      placed(period, 700, (x) => 0.25 * x),
      period,
    );
    const res = await upload(wav([mic]), { durationS: 2, offsetS: period / FS, lengthS: period / FS });
    expect(res.status).toBe(200);
    expect(res.body.arrival.peakSample).toBe(700);
    const at1k = res.body.frequencyResponse.frequenciesHz.findIndex((f: number) => f >= 1000);
    expect(res.body.frequencyResponse.magnitudeDb[at1k]).toBeCloseTo(20 * Math.log10(0.25), 1);
  });

  it('refuses a recording shorter than the sweep, an offset past the end, a missing loopback and f2 above Nyquist', async () => {
    const short = await upload(wav([sweep.slice(0, FS)]), { durationS: 2 });
    expectProblem(short, 422, '/body/file');
    expect(short.body.reason).toBe('tooShort');
    const file = wav([placed(sweep.length + FS, 100)]);
    expectProblem(await upload(file, { durationS: 2, offsetS: 10 }), 422, '/body/offsetS');
    expectProblem(await upload(file, { durationS: 2, referenceChannel: 1 }), 422, '/body/referenceChannel');
    expectProblem(await upload(file, { durationS: 2, endHz: 30000 }), 422, '/body/endHz');
    expectProblem(await upload(file, { durationS: 2, method: 'guess' }), 400, '/body/method');
  });
});
