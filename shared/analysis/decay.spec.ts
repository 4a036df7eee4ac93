import { sosfilt } from '../dsp/sosfilt';
import { designBandPass } from './band-filter';
import { decayTimes } from './decay';
import { bandCentreHz, nominalOctaveCentreHz } from './iec-bands';
import { noisyDecay } from './test-signals';

/**
 * Tolerance: 5 % of T60, the just-noticeable difference of reverberation time listed in ISO 3382-1
 * Annex A, Table A.1 [from memory]. A noise carrier's own fluctuation adds a few percent in octave bands
 * (it grows as the band narrows), so band results are the mean of 8 independent carriers.
 */
const JND = 0.05;
const fs = 48000;
const decay = (t60S: number, noiseDb: number, seed: number) =>
  noisyDecay({
    sampleRateHz: fs,
    durationS: Math.max(2, 2 * t60S),
    t60S,
    startSample: 480,
    startRms: 0.3,
    noiseDb,
    seed,
  });

/** Plain Schroeder integration to the end of the file with no noise handling, written out here. */
function naiveT30(h: Float64Array, start: number): number {
  const tail = new Float64Array(h.length - start);
  let running = 0;
  for (let i = h.length - 1; i >= start; i--) {
    running += h[i] * h[i];
    tail[i - start] = running;
  }
  const db = Array.from(tail, (e) => 10 * Math.log10(e / tail[0]));
  const points = db.map((y, i) => [i / fs, y]).filter(([, y]) => y <= -5 && y >= -35);
  const mx = points.reduce((s, [x]) => s + x, 0) / points.length;
  const my = points.reduce((s, [, y]) => s + y, 0) / points.length;
  const slope =
    points.reduce((s, [x, y]) => s + (x - mx) * (y - my), 0) /
    points.reduce((s, [x]) => s + (x - mx) ** 2, 0);
  return -60 / slope;
}

describe('decay times by Schroeder backward integration (ISO 3382-1/-2)', () => {
  it.each([0.3, 0.8, 1.5])(
    'reads EDT, T20 and T30 of a T60 = %f s exponential decay within 5 %% (JND)',
    (t60) => {
      const result = decayTimes(decay(t60, -80, 11), fs, 480);
      for (const key of ['edtS', 't20S', 't30S'] as const) {
        expect(Math.abs(result[key]! / t60 - 1)).toBeLessThan(JND);
      }
      expect(result.insufficientRange).toEqual([]);
    },
  );

  it.each([0.4, 1.0])('reads octave-band T20 and T30 (125 Hz–8 kHz) of T60 = %f s within 5 %%', (t60) => {
    const carriers = [1, 2, 3, 4, 5, 6, 7, 8].map((seed) => decay(t60, -80, seed));
    for (const x of [-3, -2, -1, 0, 1, 2, 3]) {
      const sums = { edtS: 0, t20S: 0, t30S: 0 };
      for (const h of carriers) {
        const filtered = sosfilt(designBandPass(bandCentreHz(x, 1), 1, fs), h);
        const result = decayTimes(filtered, fs, 480);
        sums.edtS += result.edtS! / 8;
        sums.t20S += result.t20S! / 8;
        sums.t30S += result.t30S! / 8;
      }
      const band = `${nominalOctaveCentreHz(x)} Hz`;
      expect({ band, t20: Math.abs(sums.t20S / t60 - 1) < JND }).toEqual({ band, t20: true });
      expect({ band, t30: Math.abs(sums.t30S / t60 - 1) < JND }).toEqual({ band, t30: true });
      // EDT spans only the first 10 dB, so its carrier fluctuation is largest; checked from 500 Hz up.
      if (x >= -1) expect({ band, edt: Math.abs(sums.edtS / t60 - 1) < JND }).toEqual({ band, edt: true });
    }
  });

  it.each([
    [-30, ['t20S', 't30S']],
    [-40, ['t30S']],
    [-50, []],
  ])(
    'with noise %d dB under the decay start, withholds the times whose range lacks 10 dB of margin (%j)',
    (noiseDb, withheld) => {
      const result = decayTimes(decay(0.5, noiseDb as number, 3), fs, 480);
      expect(result.insufficientRange).toEqual(withheld);
      for (const key of withheld as Array<'t20S' | 't30S'>) expect(result[key]).toBeNull();
      expect(Math.abs(result.edtS! / 0.5 - 1)).toBeLessThan(JND);
      // The decay falls 120 dB/s, so it meets noise N dB down at −N/120 s; Lundeby's crossing within 10 %.
      expect(Math.abs(result.truncationS / (-(noiseDb as number) / 120) - 1)).toBeLessThan(0.1);
      expect(Math.abs(result.impulseToNoiseDb + (noiseDb as number))).toBeLessThan(3);
    },
  );

  it('stays within 5 % where integrating the noise to the end of the file reads more than 10 % long', () => {
    const h = decay(0.5, -50, 5);
    expect(naiveT30(h, 480) / 0.5).toBeGreaterThan(1.1);
    expect(Math.abs(decayTimes(h, fs, 480).t30S! / 0.5 - 1)).toBeLessThan(JND);
  });

  it('returns no times for a response with no decay (a lone impulse)', () => {
    const h = new Float64Array(48000);
    h[100] = 1;
    const result = decayTimes(h, fs, 100);
    expect([result.edtS, result.t20S, result.t30S]).toEqual([null, null, null]);
    expect(result.insufficientRange).toEqual(['edtS', 't20S', 't30S']);
  });
});
