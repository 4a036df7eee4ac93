import { CalculationInputError } from '../errors';
import { cookbookPeakingDb, expectWithin } from '../filters/test-helpers';
import { channelCorrection, channelLimitProblems, delayInSamples } from './channel-edit';
import type { TuningChannel } from './tuning';

const channel = (over: Partial<TuningChannel> = {}): TuningChannel => ({
  id: 'M+030',
  delayMs: 1.5636,
  trimDb: -1.6,
  polarity: 'normal',
  eq: [],
  highPass: null,
  bassManaged: false,
  ...over,
});

const STAGE3_LIMITS = {
  delayMaxMs: 75,
  trimMinDb: -12,
  trimMaxDb: 12,
  eqBandsPerChannel: 2,
  eqMaxBoostDb: 3,
  eqMaxCutDb: 12,
};

describe('channelLimitProblems — settings a room’s processor cannot take (through findLimitViolations)', () => {
  it('finds nothing without limits or when everything fits, boundaries included', () => {
    const c = channel({
      trimDb: -12,
      delayMs: 75,
      eq: [{ type: 'peaking', frequencyHz: 200, gainDb: 3, q: 2 }],
    });
    expect(channelLimitProblems(c, 48000, null)).toEqual([]);
    expect(channelLimitProblems(c, 48000, STAGE3_LIMITS)).toEqual([]);
  });

  it('names each field over a limit, relative to the channel, in words', () => {
    const c = channel({
      delayMs: 75.01,
      trimDb: -12.5,
      eq: [
        { type: 'peaking', frequencyHz: 200, gainDb: 3.5, q: 2 },
        { type: 'lowShelf', frequencyHz: 60, gainDb: -12 },
        { type: 'notch', frequencyHz: 50, q: 10 },
      ],
    });
    const problems = channelLimitProblems(c, 48000, STAGE3_LIMITS);
    expect(problems.map((p) => p.field).sort()).toEqual(['/delayMs', '/eq', '/eq/0/gainDb', '/trimDb']);
    expect(problems.find((p) => p.field === '/eq/0/gainDb')?.message).toBe(
      'The room allows boosts up to +3 dB.',
    );
    expect(problems.find((p) => p.field === '/trimDb')?.message).toBe(
      'The room allows trims down to \u221212 dB.',
    );
    const cut = channelLimitProblems(
      channel({ eq: [{ type: 'highShelf', frequencyHz: 8000, gainDb: -12.1 }] }),
      48000,
      STAGE3_LIMITS,
    );
    expect(cut).toEqual([{ field: '/eq/0/gainDb', message: 'The room allows cuts down to \u221212 dB.' }]);
    expect(channelLimitProblems(channel({ trimDb: 12.2 }), 48000, STAGE3_LIMITS)).toEqual([
      { field: '/trimDb', message: 'The room allows trims up to +12 dB.' },
    ]);
  });

  it('holds overlapping bands to the boost limit together, in the check’s own words', () => {
    // Two +2.5 dB peaks at the same frequency sum to +5 dB (dB add in a cascade).
    const twin = { type: 'peaking' as const, frequencyHz: 1000, gainDb: 2.5, q: 1 };
    const problems = channelLimitProblems(channel({ eq: [twin, twin] }), 48000, STAGE3_LIMITS);
    expect(problems).toHaveLength(1);
    expect(problems[0].field).toBe('/eq');
    expect(problems[0].message).toMatch(/together boost 5 dB at 1000 Hz/);
  });
});

describe('channelCorrection — the response beside the channel editor', () => {
  it('adds the trim to a peaking band and matches the Audio EQ Cookbook closed form', () => {
    const band = { type: 'peaking' as const, frequencyHz: 209.7, gainDb: -3.5, q: 2.3 };
    const result = channelCorrection(channel({ eq: [band] }), null, 48000);
    expect(result.frequenciesHz[0]).toBe(10);
    expect(result.frequenciesHz.at(-1)).toBeGreaterThan(19000);
    expect(result.frequenciesHz.at(-1)).toBeLessThanOrEqual(20000);
    result.frequenciesHz.forEach((f, i) => {
      const expected = cookbookPeakingDb(band.frequencyHz, band.gainDb, band.q, f, 48000);
      expectWithin(result.eqDb[i], expected, 1e-9, `EQ at ${f} Hz`);
      expectWithin(result.magnitudeDb[i], expected - 1.6, 1e-9, `total at ${f} Hz`);
    });
  });

  it('draws a Linkwitz-Riley high-pass −6.02 dB at its corner (Linkwitz 1976: two cascaded Butterworths)', () => {
    const result = channelCorrection(
      channel({ trimDb: 0, highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 } }),
      null,
      48000,
    );
    const at80 = result.frequenciesHz.findIndex((f) => Math.abs(f - 80) < 1e-6);
    expect(at80).toBeGreaterThan(0);
    expectWithin(result.magnitudeDb[at80], 20 * Math.log10(0.5), 1e-6, 'LR4 at fc');
    expect(result.eqDb.every((db) => db === 0)).toBe(true);
  });

  it('puts the subwoofer low-pass on the subwoofer channel only, and rounds delay to samples', () => {
    const sub = {
      channel: 'LFE1',
      lowPass: { family: 'linkwitzRiley' as const, order: 4, frequencyHz: 80 },
      lfeGainDb: 10,
    };
    const lfe = channelCorrection(channel({ id: 'LFE1', trimDb: 0, delayMs: 0 }), sub, 48000);
    expect(lfe.magnitudeDb.at(-1)).toBeLessThan(-100);
    const main = channelCorrection(channel({ trimDb: 0 }), sub, 48000);
    expect(main.magnitudeDb.every((db) => Math.abs(db) < 1e-9)).toBe(true);
    // 1.5636 ms × 48 kHz = 75.05 samples → 75; × 96 kHz = 150.1 → 150.
    expect(main.delaySamples).toBe(75);
    expect(channelCorrection(channel(), null, 96000).delaySamples).toBe(150);
    // The export's own rounding (designTuning) and the table's agree: 10 ms at 44.1 kHz is 441 samples.
    expect(delayInSamples(10, 44100)).toBe(441);
    expect(delayInSamples(1.5636, 48000)).toBe(main.delaySamples);
  });

  it('names the band that cannot be realised at this rate, relative to the channel', () => {
    let caught: unknown;
    try {
      channelCorrection(
        channel({
          eq: [
            { type: 'peaking', frequencyHz: 1000, gainDb: 1 },
            { type: 'peaking', frequencyHz: 25000, gainDb: 1 },
          ],
        }),
        null,
        48000,
      );
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(CalculationInputError);
    expect((caught as CalculationInputError).field).toBe('/eq/1/frequencyHz');
  });
});
