import request from 'supertest';
import { decodeWav, openWav } from '../../shared/analysis/wav-decode';
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

function post(body: object, accept?: string) {
  let call = request(ctx.app).post('/v1/test-signals').set('Authorization', `Bearer ${ctx.keys.calculate}`);
  if (accept) call = call.set('Accept', accept);
  return call
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const raw = Buffer.concat(chunks);
        const type = String(res.headers['content-type'] ?? '');
        done(null, type.includes('json') ? JSON.parse(raw.toString('utf8')) : raw);
      });
    })
    .send(body);
}

describe('POST /v1/test-signals', () => {
  it('answers a sweep as a 24-bit WAV our reader opens, with its peak at the requested sine peak and the caution header', async () => {
    const res = await post({ kind: 'sweep', durationS: 1, silenceAfterS: 0.5, levelDbfs: -6 });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('audio/wav');
    expect(res.headers['content-disposition']).toMatch(
      /attachment; filename="?isochron-sweep-20-20000Hz-1s-48k\.wav"?/,
    );
    expect(res.headers['test-signal-caution']).toMatch(
      /start quietly.*NIOSH recommends at most 85 dBA.*Protect drivers/,
    );
    const wav = decodeWav(res.body as Buffer);
    expect(wav).toMatchObject({ sampleRateHz: 48000, channelCount: 1, encoding: 'pcm24', frameCount: 72000 });
    const peak = wav.samples.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
    // −6 dBFS sine peak = 0.501187; the sampled sweep comes within 0.01 dB of it (24-bit steps are 1.2e-7).
    expect(20 * Math.log10(peak)).toBeCloseTo(-6, 2);
    // The last 0.5 s is digital silence.
    expect(wav.samples.subarray(48000).every((v) => v === 0)).toBe(true);
  });

  it('describes a sweep with Accept: application/json, harmonic advances T·ln N/ln(f2/f1) (Farina 2000)', async () => {
    const res = await post({ kind: 'sweep', durationS: 10, startHz: 20, endHz: 20000 }, 'application/json');
    expect(res.status).toBe(200);
    expectToMatchContract('createTestSignal', 200, res.body);
    expect(res.body.sweep.rateS).toBeCloseTo(10 / Math.log(1000), 10);
    expect(res.body.sweep.harmonicAdvanceS[1].harmonic).toBe(3);
    expect(res.body.sweep.harmonicAdvanceS[1].advanceS).toBeCloseTo((10 * Math.log(3)) / Math.log(1000), 12);
    expect(res.body).toMatchObject({
      frameCount: 10 * 48000 + 2 * 48000,
      sizeBytes: 44 + 12 * 48000 * 3,
      peakDbfs: -12,
    });
    expect(res.body.cautions.map((c: { code: string }) => c.code)).toEqual([
      'testSignalLevel',
      'driverProtection',
    ]);
  });

  it('makes mid-band pink noise at −20 dBFS RMS with its crest factor, as 16-bit at 44.1 kHz', async () => {
    const body = { kind: 'pinkNoise', band: 'mid', durationS: 2, sampleRateHz: 44100, encoding: 'pcm16' };
    const described = await post(body, 'application/json');
    expect(described.status).toBe(200);
    expectToMatchContract('createTestSignal', 200, described.body);
    const file = await post(body);
    const wav = decodeWav(file.body as Buffer);
    let energy = 0;
    let peak = 0;
    for (const v of wav.samples) {
      energy += v * v;
      peak = Math.max(peak, Math.abs(v));
    }
    const rmsDbfs = 10 * Math.log10(energy / wav.samples.length);
    // 16-bit rounding adds noise near −101 dBFS: the file's RMS stays within 0.01 dB of −20.
    expect(rmsDbfs).toBeCloseTo(-20, 1);
    expect(Math.abs(rmsDbfs - -20)).toBeLessThan(0.01);
    expect(described.body.pinkNoise.crestFactorDb).toBeCloseTo(20 * Math.log10(peak) - rmsDbfs, 1);
    expectAnswered(described.body.pinkNoise.rmsDbfsSineReferenced, -20 + 10 * Math.log10(2), 'db');
    expect(described.body.pinkNoise).toMatchObject({ fromHz: 500, toHz: 2000 });
  });

  it('puts a layout sequence in one multichannel file: each channel sweeps in its slot, the loopback carries all', async () => {
    const body = {
      kind: 'sweepSequence',
      channels: ['M+030', 'M-030', 'M+000'],
      durationS: 0.5,
      gapS: 0.5,
      timingReference: true,
      encoding: 'float32',
    };
    const described = await post(body, 'application/json');
    expectToMatchContract('createTestSignal', 200, described.body);
    expect(described.body.sequence.slots.map((s: { startSample: number }) => s.startSample)).toEqual([
      0, 48000, 96000,
    ]);
    expect(described.body.sequence.timingReferenceChannelIndex).toBe(3);
    const file = openWav((await post(body)).body as Buffer);
    expect(file.channelCount).toBe(4);
    const energyIn = (x: Float64Array, from: number, to: number) =>
      x.subarray(from, to).reduce((s, v) => s + v * v, 0);
    for (let c = 0; c < 3; c++) {
      const { samples } = file.channel(c, '/channel');
      for (let slot = 0; slot < 3; slot++) {
        const e = energyIn(samples, slot * 48000, slot * 48000 + 24000);
        if (slot === c) expect(e).toBeGreaterThan(1000 * 1e-3);
        else expect(e).toBe(0);
      }
    }
    const [a, b, c, loopback] = [0, 1, 2, 3].map((i) => file.channel(i, '/channel').samples);
    expect(loopback.every((v, i) => v === a[i] + b[i] + c[i])).toBe(true);
  });

  it('refuses fields of another kind, naming them', async () => {
    expectProblem(await post({ kind: 'sweep', band: 'low', seed: 3 }), 400, '/body/band');
    expectProblem(await post({ kind: 'pinkNoise', channels: ['L'] }), 400, '/body/channels');
  });

  it('refuses an end frequency above Nyquist, a file over 64 MiB, clipping noise and a repeated channel', async () => {
    expectProblem(await post({ kind: 'sweep', sampleRateHz: 44100, endHz: 24000 }), 422, '/body/endHz');
    expectProblem(await post({ kind: 'sweep', startHz: 1000, endHz: 1500 }), 422, '/body/endHz');
    const big = await post({
      kind: 'sweepSequence',
      channels: Array.from({ length: 64 }, (_, i) => `C${i}`),
      durationS: 30,
      gapS: 10,
      sampleRateHz: 192000,
    });
    expectProblem(big, 422, '/body/durationS');
    expect(big.body.detail).toMatch(/at most 64 MiB/);
    const loud = await post({ kind: 'pinkNoise', levelDbfs: -3 });
    expectProblem(loud, 422, '/body/levelDbfs');
    expect(loud.body.detail).toMatch(/would clip/);
    expectProblem(await post({ kind: 'sweepSequence', channels: ['L', 'R', 'L'] }), 422, '/body/channels/2');
    expectProblem(await post({ kind: 'sweepSequence' }), 422, '/body/channels');
  });

  it('answers 406 when neither WAV nor JSON is acceptable', async () => {
    expectProblem(await post({ kind: 'sweep' }, 'text/html'), 406);
  });
});
