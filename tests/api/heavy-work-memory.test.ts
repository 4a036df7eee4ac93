import request from 'supertest';
import { WaveFile } from 'wavefile';
import { noisyDecay } from '../../shared/analysis/test-signals';
import { createTestContext, type TestContext } from '../support/test-context';

/*
 * A worker thread with a small heap (HEAVY_WORK_HEAP_MB): an analysis that outgrows it ends that thread.
 * The request that caused it gets a 422 problem saying what to make smaller; the pool starts another
 * thread and the service goes on answering, heavy requests included.
 */
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({ env: { HEAVY_WORK_THREADS: '1', HEAVY_WORK_HEAP_MB: '64' } });
});
afterAll(async () => {
  await ctx.close();
});

/** A room's impulse response (T60 = 0.5 s) as a 24-bit mono WAV file. */
function impulseResponseWav(sampleRateHz: number, durationS: number): Buffer {
  const h = noisyDecay({
    sampleRateHz,
    durationS,
    t60S: 0.5,
    startSample: Math.round(0.015 * sampleRateHz),
    startRms: 0.05,
    noiseDb: -80,
    seed: 1,
  });
  h[Math.round(0.0145 * sampleRateHz)] = 0.7;
  const file = new WaveFile();
  const scaled = Int32Array.from(h, (v) => Math.round(Math.max(-1, Math.min(1, v)) * 8388607));
  file.fromScratch(1, sampleRateHz, '24', scaled as unknown as number[]);
  return Buffer.from(file.toBuffer());
}

const analyse = (file: Buffer, fields: Record<string, string> = {}) => {
  const req = request(ctx.app)
    .post('/v1/analysis/impulse-response')
    .set('Authorization', `Bearer ${ctx.keys.calculate}`);
  for (const [name, value] of Object.entries(fields)) req.field(name, value);
  return req.attach('file', file, { filename: 'ir.wav', contentType: 'audio/wav' });
};

describe('a heavy calculation that outgrows its worker heap', () => {
  it('is answered 422 calculation-too-large, and the service keeps answering', async () => {
    expect(ctx.services.config.workHeapLimitMb).toBe(64);
    // The longest file at 192 kHz with the largest waterfall and spectrogram: it needs about 100 MiB.
    const res = await analyse(impulseResponseWav(192000, 30), {
      waterfall: 'true',
      spectrogram: 'true',
      decaySlices: '128',
      decayBins: '256',
      decayFromHz: '1',
      decayToHz: '96000',
      decaySpanMs: '2000',
      waterfallWindowMs: '3000',
      spectrogramWindowMs: '1000',
    });
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body).toMatchObject({
      status: 422,
      type: 'https://isochron.dev/problems/calculation-too-large',
      title: 'Calculation too large',
      instance: '/v1/analysis/impulse-response',
      heapLimitMb: 64,
    });
    expect(res.body.detail).toMatch(/impulse-response file with the decay plots asked for is too large/);
    expect(res.body.detail).toMatch(/more than 64 MiB/);
    expect(ctx.services.work.inFlight).toBe(0);

    // Cheap requests and the next heavy one are served: the pool replaced its one thread.
    expect((await request(ctx.app).get('/healthz')).status).toBe(200);
    const small = await analyse(impulseResponseWav(48000, 1));
    expect(small.status).toBe(200);
    expect(small.body.decay.t30S).toBeGreaterThan(0.4);
    expect(small.body.decay.t30S).toBeLessThan(0.6);
  });
});
