import fc from 'fast-check';
import { CalculationInputError } from '../errors';
import { designBiquad } from '../filters/biquad-design';
import { cookbookPeakingDb, expectWithin } from '../filters/test-helpers';
import { fitParametricEq, type EqFitInput } from './fit-parametric-eq';

type Peak = [frequencyHz: number, gainDb: number, q: number];
const fs = 48000;
/** 1/24-octave grid from 20 Hz up to and including 500 Hz. */
const grid24 = (from = 20, to = 500): number[] => {
  const steps = Math.round(Math.log2(to / from) * 24);
  return Array.from({ length: steps + 1 }, (_, k) => from * Math.pow(to / from, k / steps));
};
const responseOf = (peaks: Peak[], freqs: number[], level = 82): number[] =>
  freqs.map((f) => level + peaks.reduce((db, [f0, g, q]) => db + cookbookPeakingDb(f0, g, q, f, fs), 0));
const bandsDbAt = (bands: Array<{ frequencyHz: number; gainDb: number; q: number }>, f: number) =>
  bands.reduce((db, b) => db + cookbookPeakingDb(b.frequencyHz, b.gainDb, b.q, f, fs), 0);

describe('fitParametricEq', () => {
  const freqs = grid24();
  const roomPeaks: Peak[] = [
    [38, 7, 5],
    [57, 5, 6],
    [92, 9, 8],
    [140, 4, 3],
    [210, 6, 7],
    [330, 3.5, 4],
  ];

  it('flattens a response made of six known resonances (cut only) to under 0.3 dB RMS', () => {
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: responseOf(roomPeaks, freqs) },
      maxBands: 8,
      fromHz: 20,
      toHz: 500,
    });
    expect(result.residualRmsDb.before).toBeGreaterThan(1.5);
    expect(result.residualRmsDb.after).toBeLessThan(0.3);
    expect(result.bands.every((b) => b.gainDb < 0)).toBe(true);
    // Each resonance is cut by a band within 5 % of its frequency.
    for (const [f0] of roomPeaks)
      expect(result.bands.some((b) => Math.abs(b.frequencyHz / f0 - 1) < 0.05)).toBe(true);
    expectWithin(result.targetOffsetDb, 82, 0.3, 'level of the corrected response');
    // The measurement stops at 500 Hz, below the 500 Hz–2 kHz level reference band.
    expect(result.warnings.map((w) => w.code)).toEqual(['levelReferenceNotMeasured']);
  });

  it('returns sections equal to the cookbook design of its bands and a prediction that adds them to the measurement', () => {
    const measured = responseOf(roomPeaks, freqs);
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: measured },
      maxBands: 8,
      fromHz: 20,
      toHz: 500,
    });
    expect(result.sections).toEqual(result.bands.map((b) => designBiquad(b, fs)));
    freqs.forEach((f, i) =>
      expectWithin(
        result.predicted.magnitudeDb[i],
        measured[i] + bandsDbAt(result.bands, f),
        1e-9,
        `${f} Hz`,
      ),
    );
    // The prediction is flat within ±1 dB where the fit applied.
    const flatness = result.predicted.magnitudeDb.map((m) => m - result.targetOffsetDb);
    expect(Math.max(...flatness.map(Math.abs))).toBeLessThan(1);
  });

  it('fills broad dips when boosts are allowed, and cuts first: no boost without a dip', () => {
    const peaks: Peak[] = [
      [45, 6, 5],
      [120, -4, 1.5],
      [260, 5, 6],
    ];
    const measured = responseOf(peaks, freqs);
    const cutOnly = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: measured },
      maxBands: 6,
      fromHz: 20,
      toHz: 500,
    });
    const withBoost = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: measured },
      maxBands: 6,
      maxBoostDb: 6,
      fromHz: 20,
      toHz: 500,
    });
    expect(cutOnly.bands.every((b) => b.gainDb <= 0)).toBe(true);
    expect(withBoost.residualRmsDb.after).toBeLessThan(0.3);
    expect(withBoost.residualRmsDb.after).toBeLessThan(cutOnly.residualRmsDb.after);
    const boosts = withBoost.bands.filter((b) => b.gainDb > 0);
    expect(boosts).toHaveLength(1);
    expect(Math.abs(boosts[0].frequencyHz / 120 - 1)).toBeLessThan(0.1);

    const onlyPeaks = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: responseOf([[70, 6, 4]], freqs) },
      maxBands: 4,
      maxBoostDb: 6,
      fromHz: 20,
      toHz: 500,
    });
    expect(onlyPeaks.bands.every((b) => b.gainDb < 0)).toBe(true);
  });

  it('never boosts into a deep narrow null and says so (nullNotBoosted)', () => {
    const peaks: Peak[] = [
      [50, 6, 5],
      [118, -18, 12],
      [250, 5, 5],
    ];
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: responseOf(peaks, freqs) },
      maxBands: 8,
      maxBoostDb: 12,
      fromHz: 20,
      toHz: 500,
    });
    const warning = result.warnings.find((w) => w.code === 'nullNotBoosted');
    expect(warning?.message).toMatch(/11[5-9]\.\d Hz/);
    for (const f of [108, 112, 115, 118, 121, 124, 128])
      expect(bandsDbAt(result.bands, f)).toBeLessThanOrEqual(0.1);
  });

  it('follows a tilt target: a −1 dB/octave room curve with resonances is corrected to the tilt', () => {
    const tilted = responseOf(roomPeaks, freqs).map((db, i) => db - Math.log2(freqs[i] / 1000));
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: tilted },
      target: { kind: 'tilt', dbPerOctave: -1 },
      maxBands: 8,
      fromHz: 20,
      toHz: 500,
    });
    expect(result.residualRmsDb.after).toBeLessThan(0.3);
    const flat = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: tilted },
      maxBands: 8,
      fromHz: 20,
      toHz: 500,
    });
    // The corrected response keeps the tilt: 4 dB more at 25 Hz than at 400 Hz (4 octaves × 1 dB).
    const at = (magnitudeDb: number[], f: number) => magnitudeDb[freqs.findIndex((x) => x >= f)];
    const slope = (m: number[]) => at(m, 25) - at(m, 400);
    expectWithin(slope(result.predicted.magnitudeDb), 4, 0.5, 'tilt kept');
    expect(slope(flat.predicted.magnitudeDb)).toBeLessThan(2.5);
  });

  it('leaves the response alone with maxBands = 0 and when nothing exceeds 1 dB', () => {
    const zero = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: responseOf(roomPeaks, freqs) },
      maxBands: 0,
    });
    expect(zero.bands).toEqual([]);
    expect(zero.residualRmsDb.after).toBeCloseTo(zero.residualRmsDb.before, 12);
    const smooth = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: responseOf([[100, 0.8, 1]], freqs) },
      maxBands: 8,
    });
    expect(smooth.bands).toEqual([]);
  });

  it('is deterministic', () => {
    const input: EqFitInput = {
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: responseOf(roomPeaks, freqs) },
      maxBands: 5,
      maxBoostDb: 3,
    };
    expect(fitParametricEq(input)).toEqual(fitParametricEq(input));
  });

  it('warns when the bands run out and when a band reaches the gain limit', () => {
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: responseOf(roomPeaks, freqs) },
      maxBands: 2,
      maxCutDb: 6,
      fromHz: 20,
      toHz: 500,
    });
    expect(result.bands.length).toBeLessThanOrEqual(2);
    expect(result.warnings.map((w) => w.code)).toEqual(
      expect.arrayContaining(['bandLimitReached', 'gainLimitReached']),
    );
  });

  it('respects every limit for arbitrary responses (property test, fast-check)', () => {
    const peak = fc.tuple(
      fc.double({ min: 25, max: 450, noNaN: true }),
      fc.double({ min: -15, max: 15, noNaN: true }),
      fc.double({ min: 0.7, max: 12, noNaN: true }),
    );
    fc.assert(
      fc.property(
        fc.array(peak, { minLength: 0, maxLength: 6 }),
        fc.integer({ min: 0, max: 6 }),
        fc.constantFrom(0, 3, 6),
        fc.constantFrom(6, 12),
        fc.constantFrom({ min: 0.5, max: 10 }, { min: 1, max: 4 }),
        (peaks, maxBands, maxBoostDb, maxCutDb, qRange) => {
          const result = fitParametricEq({
            sampleRateHz: 96000,
            measured: { frequenciesHz: freqs, magnitudeDb: responseOf(peaks as Peak[], freqs) },
            maxBands,
            maxBoostDb,
            maxCutDb,
            qRange,
            fromHz: 30,
            toHz: 400,
          });
          expect(result.bands.length).toBeLessThanOrEqual(maxBands);
          for (const b of result.bands) {
            expect(b.gainDb).toBeGreaterThanOrEqual(-maxCutDb);
            expect(b.gainDb).toBeLessThanOrEqual(maxBoostDb);
            expect(b.q).toBeGreaterThanOrEqual(qRange.min);
            expect(b.q).toBeLessThanOrEqual(qRange.max);
            expect(b.frequencyHz).toBeGreaterThanOrEqual(30);
            expect(b.frequencyHz).toBeLessThanOrEqual(400);
          }
          expect(result.residualRmsDb.after).toBeLessThanOrEqual(result.residualRmsDb.before + 1e-9);
        },
      ),
      { seed: 20240611, numRuns: 25 },
    );
  });

  it.each([
    [{ maxBands: 65 }, '/maxBands'],
    [{ maxBands: 2.5 }, '/maxBands'],
    [{ maxBoostDb: -1 }, '/maxBoostDb'],
    [{ maxCutDb: 60 }, '/maxCutDb'],
    [{ qRange: { min: 4, max: 2 } }, '/qRange/max'],
    [{ fromHz: 600, toHz: 900 }, '/fromHz'],
    [{ sampleRateHz: 1000 }, '/sampleRateHz'],
    [{ measured: { frequenciesHz: [20, 10], magnitudeDb: [0, 0] } }, '/measured/frequenciesHz/1'],
    [{ measured: { frequenciesHz: [20, 40], magnitudeDb: [0] } }, '/measured/magnitudeDb'],
    [{ measured: { frequenciesHz: [20, 30000], magnitudeDb: [0, 0] } }, '/measured/frequenciesHz/1'],
    [{ target: { kind: 'tilt', dbPerOctave: 9 } }, '/target/dbPerOctave'],
  ])('refuses %j, naming %s', (patch, field) => {
    const input = {
      sampleRateHz: fs,
      measured: { frequenciesHz: freqs, magnitudeDb: responseOf(roomPeaks, freqs) },
      maxBands: 4,
      ...patch,
    } as EqFitInput;
    let caught: unknown;
    try {
      fitParametricEq(input);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(CalculationInputError);
    expect((caught as CalculationInputError).field).toBe(field);
  });
});
