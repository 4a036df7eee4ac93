import { expectWithin } from '../filters/test-helpers';
import { analyzeImpulseResponse } from './analyze-impulse-response';
import { SignalProblemError } from './signal-problem';
import { noisyDecay, seededGaussian } from './test-signals';

const fs = 48000;
const stage3 = { widthM: 6.1, lengthM: 7.4, heightM: 3.05 };

describe('impulse-response analysis', () => {
  it('reads a lone impulse at sample 700: arrival 14.583 ms, 0 dB and 0° at every frequency', () => {
    const x = new Float64Array(fs);
    x[700] = 1;
    const result = analyzeImpulseResponse(x, fs);
    expectWithin(result.arrival.arrivalMs, 14.583333, 1e-6, 'arrivalMs');
    expect(result.frequencyResponse.frequenciesHz[0]).toBeGreaterThanOrEqual(20);
    expect(result.frequencyResponse.frequenciesHz.at(-1)).toBeLessThanOrEqual(20000);
    result.frequencyResponse.magnitudeDb.forEach((db) => expectWithin(db, 0, 1e-9, 'magnitude'));
    result.frequencyResponse.phaseDeg.forEach((deg) => expectWithin(deg, 0, 1e-6, 'phase'));
    expect(result.frequencyResponse.smoothingOctaves).toBeCloseTo(1 / 12, 12);
    expect(result.decay.edtS).toBeNull();
    expect(result.warnings.map((w) => w.code)).toContain('decayRangeInsufficient');
  });

  it('reads a room-like decay: T30 within 5 % (ISO 3382-1 JND, from memory), octave bands, modes up to fS', () => {
    const t60 = 0.45;
    const h = noisyDecay({
      sampleRateHz: fs,
      durationS: 2,
      t60S: t60,
      startSample: 700,
      startRms: 0.1,
      noiseDb: -75,
      seed: 4,
    });
    const result = analyzeImpulseResponse(h, fs, { room: stage3, smoothingOctaves: 1 / 6 });
    expect(result.arrival.arrivalSample).toBeGreaterThanOrEqual(700);
    expect(result.arrival.arrivalMs).toBeLessThan(15);
    for (const key of ['edtS', 't20S', 't30S'] as const)
      expect(Math.abs(result.decay[key]! / t60 - 1)).toBeLessThan(0.05);
    expect(result.decay.bands.map((b) => b.nominalHz)).toEqual([63, 125, 250, 500, 1000, 2000, 4000, 8000]);
    const room = result.room!;
    expectWithin(
      room.schroederFrequencyHz!,
      2000 * Math.sqrt(result.decay.t30S! / (6.1 * 7.4 * 3.05)),
      1e-9,
      'fS',
    );
    expect(room.modes[0]).toMatchObject({ nx: 0, ny: 1, nz: 0, kind: 'axial' });
    expect(room.modes.every((m) => m.frequencyHz <= room.schroederFrequencyHz!)).toBe(true);
    expect(room.speedOfSoundMps).toBe(343.2);
    // White-noise carrier: every frequency's expected |H|² is the total energy Σh² (Parseval), so the
    // mean smoothed power across the band matches 10·log10(Σh²) within 1 dB.
    let energy = 0;
    for (const v of h) energy += v * v;
    expectWithin(result.level.energyDb, 10 * Math.log10(energy), 1e-9, 'energyDb');
    const midPowers = result.frequencyResponse.magnitudeDb
      .filter(
        (_, i) =>
          result.frequencyResponse.frequenciesHz[i] > 200 &&
          result.frequencyResponse.frequenciesHz[i] < 10000,
      )
      .map((db) => Math.pow(10, db / 10));
    const meanDb = 10 * Math.log10(midPowers.reduce((a, b) => a + b, 0) / midPowers.length);
    expectWithin(meanDb, 10 * Math.log10(energy), 1, 'mean level');
  });

  it('warns when the peak is less than 20 dB above the noise', () => {
    const noise = seededGaussian(9);
    const x = Float64Array.from({ length: fs }, () => 0.01 * noise());
    x[1000] = 0.05;
    expect(analyzeImpulseResponse(x, fs).warnings.map((w) => w.code)).toContain('lowPeakToNoise');
  });

  it('refuses a silent signal and a signal shorter than 10 ms as signal problems', () => {
    expect(() => analyzeImpulseResponse(new Float64Array(fs), fs)).toThrow(SignalProblemError);
    expect(() => analyzeImpulseResponse(new Float64Array(fs), fs)).toThrow(
      /silent: its peak is digital zero/,
    );
    const quiet = new Float64Array(fs);
    quiet[10] = 1e-7;
    expect(() => analyzeImpulseResponse(quiet, fs)).toThrow(/-140.0 dBFS, below -120 dBFS/);
    expect(() => analyzeImpulseResponse(new Float64Array(100).fill(0.5), fs)).toThrow(/at least 10 ms/);
  });

  it('refuses a smoothing width outside 1/48..1 octave', () => {
    const x = new Float64Array(fs);
    x[0] = 1;
    expect(() => analyzeImpulseResponse(x, fs, { smoothingOctaves: 2 })).toThrow(
      expect.objectContaining({ field: '/smoothingOctaves' }),
    );
  });
});
