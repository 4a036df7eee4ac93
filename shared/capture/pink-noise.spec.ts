import { rfft } from '../dsp/fft';
import { pinkNoise, PINK_NOISE_BANDS, type PinkNoiseBand } from './pink-noise';

const FS = 48000;

/**
 * Mid-band frequencies and band edges of IEC 61260-1:2014 (base ten): G = 10^(3/10), fm = 1000·G^(x/b)
 * for odd b, edges fm·G^(∓1/(2b)). Written out here from the standard, not taken from the code under test.
 */
function iecBands(
  fromHz: number,
  toHz: number,
  b: number,
): Array<{ lowerHz: number; upperHz: number; centreHz: number }> {
  const G = Math.pow(10, 3 / 10);
  const out = [];
  for (let x = -60; x <= 60; x++) {
    const centreHz = 1000 * Math.pow(G, x / b);
    const lowerHz = centreHz * Math.pow(G, -1 / (2 * b));
    const upperHz = centreHz * Math.pow(G, 1 / (2 * b));
    if (lowerHz >= fromHz && upperHz <= toHz) out.push({ lowerHz, upperHz, centreHz });
  }
  return out;
}

/** Energy of the signal in each band: the periodogram summed over the bins inside the band's edges. */
function bandLevelsDb(samples: Float64Array, bands: ReturnType<typeof iecBands>): number[] {
  let size = 1;
  while (size < samples.length) size *= 2;
  const { re, im } = rfft(samples, size);
  return bands.map(({ lowerHz, upperHz }) => {
    let energy = 0;
    for (let k = Math.ceil((lowerHz * size) / FS); k * FS < upperHz * size; k++)
      energy += re[k] ** 2 + im[k] ** 2;
    return 10 * Math.log10(energy);
  });
}

describe('pink noise', () => {
  it.each([
    ['full', 3],
    ['full', 1],
    ['mid', 3],
    ['low', 3],
  ] as Array<[PinkNoiseBand, number]>)(
    '%s band has equal energy in every IEC 61260-1 1/%d-octave band inside it, within ±1 dB',
    (band, b) => {
      const noise = pinkNoise({ sampleRateHz: FS, durationS: 10, band, rmsDbfs: -20, seed: 11 });
      const { fromHz, toHz } = PINK_NOISE_BANDS[band];
      const bands = iecBands(fromHz, toHz, b);
      expect(bands.length).toBeGreaterThanOrEqual(b === 1 ? 7 : band === 'full' ? 28 : 4);
      const levels = bandLevelsDb(noise.samples, bands);
      const mean = levels.reduce((s, v) => s + v, 0) / levels.length;
      for (const level of levels) expect(Math.abs(level - mean)).toBeLessThanOrEqual(1);
    },
  );

  it('falls 3 dB per octave in narrow bands too (power spectral density ∝ 1/f): 100 Hz vs 6.4 kHz, six octaves', () => {
    const noise = pinkNoise({ sampleRateHz: FS, durationS: 10, band: 'full', rmsDbfs: -20, seed: 5 });
    // Equal-width 20 Hz bands: 6 octaves apart, the density differs by 10·log10(64) = 18.06 dB.
    const narrow = (hz: number) => ({ lowerHz: hz - 10, upperHz: hz + 10, centreHz: hz });
    const [low, high] = bandLevelsDb(noise.samples, [narrow(100), narrow(6400)]);
    expect(Math.abs(low - high - 10 * Math.log10(64))).toBeLessThan(1);
  });
});
