/**
 * The fitter judged the way an engineer judges EQ advice: corrections only where EQ helps (below the
 * room's transition frequency), level matched first, limits held by the bands together, no boosts into
 * cancellations or into dips that move between microphone positions, and tidy bands.
 *
 * Every response here is built from formulas written in this file or in filters/test-helpers.ts
 * (cookbook peaking sections evaluated directly), never from the code under test.
 */
import fc from 'fast-check';
import { cookbookPeakingDb, expectWithin } from '../filters/test-helpers';
import { fitParametricEq, type EqFitInput, type EqFitResult } from './fit-parametric-eq';

type Peak = [frequencyHz: number, gainDb: number, q: number];
const fs = 48000;
/** Stage 3 of the demo (invented): 6.10 × 7.40 × 3.05 m. */
const STAGE3_VOLUME_M3 = 6.1 * 7.4 * 3.05;
/** 1/24-octave grid from `from` to `to`, both included. */
const grid24 = (from: number, to: number): number[] => {
  const steps = Math.round(Math.log2(to / from) * 24);
  return Array.from({ length: steps + 1 }, (_, k) => from * Math.pow(to / from, k / steps));
};
const full = grid24(20, 20000);
const low = grid24(20, 500);
const peaksDb = (peaks: readonly Peak[], f: number) =>
  peaks.reduce((db, [f0, g, q]) => db + cookbookPeakingDb(f0, g, q, f, fs), 0);
const responseOf = (peaks: readonly Peak[], freqs: number[], level = 82): number[] =>
  freqs.map((f) => level + peaksDb(peaks, f));
/** Summed response of the fitted bands at f, evaluated independently of the fitter. */
const eqDbAt = (result: EqFitResult, f: number) =>
  result.bands.reduce((db, b) => db + cookbookPeakingDb(b.frequencyHz, b.gainDb, b.q, f, fs), 0);
/** 1/96 octave from 10 Hz to 22 kHz, plus the band centres: where the combined limits are checked. */
const checkGrid = (result: EqFitResult) =>
  [...grid24(10, 22000).flatMap((f) => [f, f * 2 ** (1 / 96), f * 2 ** (2 / 96), f * 2 ** (3 / 96)])]
    .concat(result.bands.map((b) => b.frequencyHz))
    .filter((f) => f < fs / 2);
/** Width between half-gain points in octaves, from 1/Q = 2·sinh((ln 2/2)·BW) (Audio EQ Cookbook, W3C Note 2021). */
const widthOctaves = (q: number) => (2 / Math.LN2) * Math.asinh(1 / (2 * q));

/** The band rules every answer must keep, checked from the bands alone. */
function expectDisciplined(
  result: EqFitResult,
  limits: { maxBands: number; maxBoostDb: number; maxCutDb: number; minGainDb: number },
): void {
  expect(result.bands.length).toBeLessThanOrEqual(limits.maxBands);
  const totals = checkGrid(result).map((f) => eqDbAt(result, f));
  expect(Math.max(0, ...totals)).toBeLessThanOrEqual(limits.maxBoostDb + 1e-6);
  expect(Math.max(0, ...totals.map((v) => -v))).toBeLessThanOrEqual(limits.maxCutDb + 1e-6);
  for (const [i, a] of result.bands.entries()) {
    expect(Math.abs(a.gainDb)).toBeGreaterThanOrEqual(limits.minGainDb);
    for (const b of result.bands.slice(i + 1)) {
      const apart = Math.abs(Math.log2(a.frequencyHz / b.frequencyHz));
      expect(apart).toBeGreaterThanOrEqual(1 / 6);
      if (Math.sign(a.gainDb) !== Math.sign(b.gainDb)) {
        expect(apart).toBeGreaterThanOrEqual((widthOctaves(a.q) + widthOctaves(b.q)) / 2);
      }
    }
  }
}

describe('fitParametricEq as an engineer would accept it', () => {
  it('leaves a normal roll-off alone: flat + 2nd-order low-pass at 12 kHz + −1 dB/octave tilt, defaults', () => {
    // Second-order Butterworth low-pass magnitude |H|² = 1/(1 + (f/fc)⁴) (textbook), tilt through 1 kHz.
    const magnitudeDb = full.map((f) => 85 - 10 * Math.log10(1 + (f / 12000) ** 4) - Math.log2(f / 1000));
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: full, magnitudeDb },
      maxBands: 8,
      room: { volumeM3: STAGE3_VOLUME_M3, reverberationTimeS: 0.3 },
    });
    // Transition frequency 2000·√(0.3/137.677) = 93.36 Hz (Kuttruff, "Room Acoustics").
    expectWithin(result.transition.frequencyHz, 93.4, 0.05, 'transition');
    expect(result.toHz).toBe(result.transition.frequencyHz);
    for (const band of result.bands) expect(band.frequencyHz).toBeLessThanOrEqual(93.4);
    // No broadband level change: the target sits at the measured mean over 500 Hz–2 kHz (85 dB: the tilt's
    // log2(f/1000) averages to 0 on a log grid symmetric about 1 kHz), the EQ leaves 500 Hz–20 kHz untouched.
    expectWithin(result.targetOffsetDb, 85, 0.05, 'target level');
    for (const f of [500, 1000, 2000, 5000, 12000, 20000])
      expectWithin(eqDbAt(result, f), 0, 0.05, `EQ at ${f} Hz`);
    expect(result.explanation.notUsed.map((n) => n.code)).toContain('aboveTransition');
    // With a tilt target of the same slope nothing is left to correct at all.
    const tilted = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: full, magnitudeDb },
      target: { kind: 'tilt', dbPerOctave: -1 },
      maxBands: 8,
      room: { volumeM3: STAGE3_VOLUME_M3, reverberationTimeS: 0.3 },
    });
    expect(tilted.bands).toEqual([]);
  });

  it('corrects above the transition only when asked, with few broad gentle bands', () => {
    const magnitudeDb = responseOf([[2500, 4, 0.7]], full).map(
      (db, i) => db - 10 * Math.log10(1 + (full[i] / 12000) ** 4),
    );
    const defaults = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: full, magnitudeDb },
      maxBands: 8,
      toHz: 150,
    });
    expect(defaults.bands).toEqual([]);
    const asked = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: full, magnitudeDb },
      maxBands: 8,
      toHz: 150,
      levelReferenceHz: { fromHz: 200, toHz: 600 },
      aboveTransition: {},
    });
    const broad = asked.bands.filter((b) => b.frequencyHz > 150);
    expect(broad.length).toBeGreaterThanOrEqual(1);
    expect(broad.length).toBeLessThanOrEqual(2);
    for (const b of broad) {
      expect(b.q).toBeLessThanOrEqual(1);
      expect(b.gainDb).toBeGreaterThanOrEqual(-3);
      expect(b.gainDb).toBeLessThan(0);
    }
    // The cut lands on the broad 2.5 kHz excess and lowers it.
    expect(broad.some((b) => b.frequencyHz > 1200 && b.frequencyHz < 5000)).toBe(true);
    expect(eqDbAt(asked, 2500)).toBeLessThan(-1.5);
    expect(asked.explanation.bands.find((e) => e.frequencyHz > 150)?.feature).toBe('broadExcess');
  });

  it('holds the boost limit for all bands together: one −6 dB dip, 2 dB limit, at most +2 dB in total', () => {
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: low, magnitudeDb: responseOf([[140, -6, 1.2]], low) },
      maxBands: 8,
      maxBoostDb: 2,
      toHz: 400,
    });
    expect(result.bands.length).toBeGreaterThanOrEqual(1);
    const totals = checkGrid(result).map((f) => eqDbAt(result, f));
    expect(Math.max(...totals)).toBeLessThanOrEqual(2 + 1e-6);
    expect(Math.max(...totals)).toBeGreaterThan(1.5);
    expectWithin(result.combined.maxBoostDb, Math.max(...totals), 0.01, 'combined boost reported');
    expectDisciplined(result, { maxBands: 8, maxBoostDb: 2, maxCutDb: 12, minGainDb: 0.5 });
  });

  it('gives a flat response with a single deep null (−18 dB, Q 14, 150 Hz) no band at all', () => {
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: low, magnitudeDb: responseOf([[150, -18, 14]], low) },
      maxBands: 8,
      maxBoostDb: 6,
      toHz: 400,
    });
    expect(result.bands).toEqual([]);
    expect(result.residualRmsDb.after).toBe(result.residualRmsDb.before);
    expect(result.explanation.notUsed.map((n) => n.code)).toContain('null');
  });

  it('with three positions: cuts a peak all three share, leaves a deep dip that moves between them alone', () => {
    const dipAt = [70, 84, 100];
    const positions = dipAt.map((f0, k) => ({
      label: `mic ${k + 1}`,
      measured: {
        frequenciesHz: low,
        magnitudeDb: responseOf(
          [
            [45, 8, 5],
            [f0, -15, 6],
          ],
          low,
        ),
      },
    }));
    const result = fitParametricEq({ sampleRateHz: fs, positions, maxBands: 8, maxBoostDb: 6, toHz: 300 });
    const cut = result.bands.filter((b) => b.gainDb < 0 && Math.abs(Math.log2(b.frequencyHz / 45)) < 0.1);
    expect(cut).toHaveLength(1);
    expect(cut[0].gainDb).toBeLessThan(-5);
    expect(result.bands.every((b) => b.gainDb <= 0)).toBe(true);
    for (const f of [65, 70, 77, 84, 92, 100, 108]) expect(Math.abs(eqDbAt(result, f))).toBeLessThan(1);
    expect(result.positions.map((p) => p.label)).toEqual(['mic 1', 'mic 2', 'mic 3']);
    result.positions.forEach((p, k) => {
      expect(p.residualRmsDb.after).toBeLessThan(p.residualRmsDb.before);
      p.predicted.frequenciesHz.forEach((f, i) =>
        expectWithin(
          p.predicted.magnitudeDb[i],
          positions[k].measured.magnitudeDb[i] + eqDbAt(result, f),
          1e-6,
          `${p.label} at ${f} Hz`,
        ),
      );
    });
    expect(result.explanation.notUsed.map((n) => n.code)).toContain('positionsDisagree');
    expect(result.explanation.bands[0].message).toMatch(
      /^Cuts a peak at 4\d\.\d Hz, \d\.\d dB above the target\.$/,
    );
  });

  it('explains every band and gives the residual per octave band before and after', () => {
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: {
        frequenciesHz: full,
        magnitudeDb: responseOf(
          [
            [42, 9, 6],
            [68, 6, 5],
          ],
          full,
        ),
      },
      maxBands: 4,
      room: { volumeM3: STAGE3_VOLUME_M3, reverberationTimeS: 0.3 },
    });
    expect(result.explanation.bands).toHaveLength(result.bands.length);
    for (const [i, e] of result.explanation.bands.entries()) {
      expect(e.frequencyHz).toBe(result.bands[i].frequencyHz);
      expect(e.feature).toBe('peak');
      expect(e.aboveTargetDb).toBeGreaterThan(4);
    }
    const octave63 = result.explanation.octaveBands.find((b) => b.centreHz === 63);
    const octave1k = result.explanation.octaveBands.find((b) => b.centreHz === 1000);
    expect(octave63!.afterDb).toBeLessThan(octave63!.beforeDb / 2);
    expectWithin(octave1k!.afterDb, octave1k!.beforeDb, 0.02, '1 kHz octave untouched');
    expect(result.explanation.octaveBands.map((b) => b.centreHz)).toEqual([
      31.5, 63, 125, 250, 500, 1000, 2000, 4000, 8000,
    ]);
  });

  it('matches the level over the reference band the caller chooses', () => {
    const magnitudeDb = full.map((f) => (f < 300 ? 90 : 80));
    const at = (levelReferenceHz?: { fromHz: number; toHz: number }) =>
      fitParametricEq({
        sampleRateHz: fs,
        measured: { frequenciesHz: full, magnitudeDb },
        maxBands: 2,
        toHz: 200,
        levelReferenceHz,
      });
    expectWithin(at().targetOffsetDb, 80, 1e-9, 'default 500 Hz–2 kHz');
    expectWithin(at({ fromHz: 40, toHz: 160 }).targetOffsetDb, 90, 1e-9, '40–160 Hz');
    // At the default level the 10 dB shelf below 300 Hz is cut (to the 12 dB default cut limit).
    expect(at().bands.length).toBeGreaterThan(0);
    expect(at({ fromHz: 40, toHz: 160 }).bands).toEqual([]);
  });

  it('keeps to the processor: its band frequency range and its filter types', () => {
    const input: EqFitInput = {
      sampleRateHz: fs,
      measured: {
        frequenciesHz: low,
        magnitudeDb: responseOf(
          [
            [30, 8, 4],
            [80, 6, 4],
          ],
          low,
        ),
      },
      maxBands: 4,
      toHz: 300,
    };
    const ranged = fitParametricEq({ ...input, bandFrequencyRangeHz: { fromHz: 40, toHz: 20000 } });
    expect(ranged.bands.length).toBeGreaterThan(0);
    expect(ranged.bands.every((b) => b.frequencyHz >= 40)).toBe(true);
    const noPeaking = fitParametricEq({ ...input, filterTypes: ['lowShelf', 'highShelf'] });
    expect(noPeaking.bands).toEqual([]);
    expect(noPeaking.explanation.notUsed.map((n) => n.code)).toContain('peakingNotSupported');
  });

  it('rounds bands to the processor steps without crossing a limit (1 Hz or 1/12 octave, 0.5 dB, Q 0.1)', () => {
    const input: EqFitInput = {
      sampleRateHz: fs,
      measured: {
        frequenciesHz: low,
        magnitudeDb: responseOf(
          [
            [37, 7, 5],
            [58, 6, 4],
            [140, -6, 1.2],
          ],
          low,
        ),
      },
      maxBands: 6,
      maxBoostDb: 2,
      maxCutDb: 6,
      toHz: 300,
    };
    const multiple = (v: number, step: number) => Math.abs(v / step - Math.round(v / step)) < 1e-6;
    const hz = fitParametricEq({ ...input, bandSteps: { frequencyHz: 1, gainDb: 0.5, q: 0.1 } });
    expect(hz.bands.length).toBeGreaterThanOrEqual(2);
    for (const b of hz.bands) {
      expect(multiple(b.frequencyHz, 1)).toBe(true);
      expect(multiple(b.gainDb, 0.5)).toBe(true);
      expect(multiple(b.q, 0.1)).toBe(true);
    }
    expectDisciplined(hz, { maxBands: 6, maxBoostDb: 2, maxCutDb: 6, minGainDb: 0.5 });
    const octave = fitParametricEq({
      ...input,
      bandSteps: { frequencyHz: 1 / 12, frequencyStepUnit: 'octave' },
    });
    // A step coarser than the range leaves no setting for a band: none is fitted, nothing breaks.
    expect(fitParametricEq({ ...input, bandSteps: { frequencyHz: 1000 } }).bands).toEqual([]);
    // On the 1/12-octave series through 1 kHz: log2(f/1000)·12 is a whole number.
    for (const b of octave.bands)
      expectWithin(
        Math.log2(b.frequencyHz / 1000) * 12,
        Math.round(Math.log2(b.frequencyHz / 1000) * 12),
        1e-4,
        `${b.frequencyHz} Hz`,
      );
  });

  it('fits toward a target given as points', () => {
    // A house curve: +4 dB at 20 Hz falling to 0 dB at 200 Hz; the response follows it but for one mode.
    const points = [
      { frequencyHz: 20, gainDb: 4 },
      { frequencyHz: 200, gainDb: 0 },
      { frequencyHz: 20000, gainDb: 0 },
    ];
    const house = (f: number) => (f >= 200 ? 0 : 4 - (4 * Math.log(f / 20)) / Math.log(10));
    const magnitudeDb = full.map((f) => 80 + house(f) + peaksDb([[55, 7, 5]], f));
    const result = fitParametricEq({
      sampleRateHz: fs,
      measured: { frequenciesHz: full, magnitudeDb },
      target: { kind: 'points', points },
      maxBands: 4,
      toHz: 200,
    });
    expect(result.bands).toHaveLength(1);
    expectWithin(result.bands[0].frequencyHz, 55, 2, 'band on the mode');
    expect(result.residualRmsDb.after).toBeLessThan(0.3);
  });

  it('keeps every rule for arbitrary responses and is deterministic (property test, fast-check)', () => {
    const feature = fc.tuple(
      fc.double({ min: 22, max: 380, noNaN: true }),
      fc.double({ min: -18, max: 15, noNaN: true }),
      fc.double({ min: 0.7, max: 14, noNaN: true }),
    );
    fc.assert(
      fc.property(
        fc.array(feature, { minLength: 0, maxLength: 7 }),
        fc.integer({ min: 0, max: 8 }),
        fc.constantFrom(0, 1, 2, 4, 6),
        fc.constantFrom(3, 6, 12),
        fc.constantFrom(0.5, 1),
        fc.constantFrom({ min: 0.5, max: 10 }, { min: 1, max: 4 }),
        (features, maxBands, maxBoostDb, maxCutDb, minGainDb, qRange) => {
          const input: EqFitInput = {
            sampleRateHz: fs,
            measured: { frequenciesHz: low, magnitudeDb: responseOf(features as Peak[], low) },
            maxBands,
            maxBoostDb,
            maxCutDb,
            minGainDb,
            qRange,
            fromHz: 25,
            toHz: 400,
          };
          const result = fitParametricEq(input);
          expectDisciplined(result, { maxBands, maxBoostDb, maxCutDb, minGainDb });
          for (const b of result.bands) {
            expect(b.q).toBeGreaterThanOrEqual(qRange.min);
            expect(b.q).toBeLessThanOrEqual(qRange.max);
            expect(b.frequencyHz).toBeGreaterThanOrEqual(25);
            expect(b.frequencyHz).toBeLessThanOrEqual(400);
          }
          expect(result.residualRmsDb.after).toBeLessThanOrEqual(result.residualRmsDb.before + 1e-9);
          expectWithin(
            result.combined.maxBoostDb,
            Math.max(0, ...checkGrid(result).map((f) => eqDbAt(result, f))),
            0.02,
            'combined boost',
          );
          expect(fitParametricEq(input)).toEqual(result);
        },
      ),
      { seed: 20261202, numRuns: 40 },
    );
  });
});
