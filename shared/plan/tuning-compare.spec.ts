import { responseGrid } from '../dsp/grid';
import type { TuningChannel, TuningSettings } from './tuning';
import { compareTunings, PASSBAND_RANGE_DB } from './tuning-compare';

const tweeterAt = (frequencyHz: number, order = 8): TuningSettings => ({
  sampleRateHz: 48000,
  subwoofer: null,
  channels: [
    {
      id: 'M+030',
      delayMs: 1.25,
      trimDb: -1.6,
      polarity: 'normal',
      eq: [],
      highPass: { family: 'linkwitzRiley', order, frequencyHz },
      bassManaged: false,
    } satisfies TuningChannel,
  ],
});

/**
 * Linkwitz-Riley high-pass of order 2n = an order-n Butterworth squared (S. H. Linkwitz, JAES 24(1),
 * 1976, from memory; scipy.signal butter): |H|² of the Butterworth is x^2n / (1 + x^2n), x = f/fc.
 */
const lrHighPassDb = (f: number, fc: number, order: number) => {
  const x = (f / fc) ** order;
  return 2 * 10 * Math.log10(x / (1 + x));
};

describe('compareTunings', () => {
  it('reports the response difference only where either high-pass is within 30 dB of its passband', () => {
    // LR2 against LR8, both at 1 kHz: at 20 Hz they are 68 and 272 dB down, 204 dB apart, and nothing
    // is heard from either; the difference that matters is where one of them still passes sound.
    const grid = responseGrid({ fromHz: 20, toHz: 20000, pointsPerOctave: 6 }, 48000);
    const a = grid.map((f) => lrHighPassDb(f, 1000, 2));
    const b = grid.map((f) => lrHighPassDb(f, 1000, 8));
    const counted = grid
      .map((_, i) => i)
      .filter((i) => a[i] >= -PASSBAND_RANGE_DB || b[i] >= -PASSBAND_RANGE_DB)
      .map((i) => Math.abs(b[i] - a[i]));
    const everywhere = Math.max(...grid.map((_, i) => Math.abs(b[i] - a[i])));
    const expected = Math.max(...counted);
    expect(everywhere).toBeGreaterThan(expected + 100);

    const [channel] = compareTunings(tweeterAt(1000, 2), tweeterAt(1000, 8)).channels;
    // The digital filters are bilinear transforms: below fc frequencies are warped by about
    // (π/fs)²·(fc² − f²)/3 relative, which the 48 dB/octave LR8 slope turns into under 0.1 dB.
    expect(Math.abs((channel.maxResponseDifferenceDb ?? 0) - expected)).toBeLessThan(0.1);
    expect(channel.highPassChanged).toBe(true);
  });

  it('settings that differ only below what an answer shows are the same', () => {
    const stored = tweeterAt(1000);
    const entered = structuredClone(stored);
    entered.channels[0].delayMs += 0.00003; // answered as 1.25 ms either way
    entered.channels[0].trimDb = -1.5999999999999943;
    const comparison = compareTunings(stored, entered);
    expect(comparison.identical).toBe(true);
    entered.channels[0].trimDb = -1.59;
    expect(compareTunings(stored, entered).identical).toBe(false);
  });
});
