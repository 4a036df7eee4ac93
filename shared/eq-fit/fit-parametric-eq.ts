import { fractionalOctaveMean } from '../analysis/smoothing';
import { logFrequencyGrid } from '../dsp/grid';
import { sosMagnitudeDb, unitCircle, type UnitCircle } from '../dsp/response';
import type { Sos } from '../dsp/sos';
import { CalculationInputError, requireInRange, requireInteger } from '../errors';
import { designBiquad, FILTER_LIMITS } from '../filters/biquad-design';
import { requireSampleRate } from '../units/sample-rate';
import { levenbergMarquardt, type LeastSquaresProblem } from './least-squares';
import { findNulls, type ResponseNull } from './nulls';
import { requireTargetCurve, targetDb, type TargetCurve } from './target-curve';

export interface EqFitInput {
  /** Processor sample rate the sections are designed for, hertz. */
  sampleRateHz: number;
  /** Measured magnitude response (any level; it is matched to the target over the fit band). */
  measured: { frequenciesHz: number[]; magnitudeDb: number[] };
  /** Target curve (default flat). */
  target?: TargetCurve;
  /** Most peaking bands to use, 0..64. */
  maxBands: number;
  /** Largest boost per band, dB, 0..24 (default 0: cuts only). */
  maxBoostDb?: number;
  /** Largest cut per band, dB, 0..48 (default 12). */
  maxCutDb?: number;
  /** Fit band, hertz (default: the measured range within 20 Hz..min(20 kHz, 0.45·fs)). */
  fromHz?: number;
  toHz?: number;
  /** Allowed Q of the bands (default 0.5..10). */
  qRange?: { min: number; max: number };
}

export interface PeakingBand {
  type: 'peaking';
  frequencyHz: number;
  gainDb: number;
  q: number;
}

export interface EqFitWarning {
  code: string;
  message: string;
}

export interface EqFitResult {
  bands: PeakingBand[];
  /** One cookbook peaking section per band, a0 = 1. */
  sections: Sos[];
  /** The measured response with the sections applied, at the measured frequencies. */
  predicted: { frequenciesHz: number[]; magnitudeDb: number[] };
  /**
   * RMS over the fit band's 1/48-octave grid of (response − target − level), before and after the EQ, dB,
   * with the level as the fit sets it (see `targetOffsetDb`) before and after. Nulls count.
   */
  residualRmsDb: { before: number; after: number };
  /**
   * Level at which the corrected response matches the target, dB: with boosts allowed, the median of
   * (measured − target) over the band outside nulls; with cuts only, the mean of (measured + EQ − target)
   * outside nulls, because cuts can only bring the response down to its lower parts.
   */
  targetOffsetDb: number;
  fromHz: number;
  toHz: number;
  warnings: EqFitWarning[];
}

export const EQ_FIT_DEFAULTS = { maxBoostDb: 0, maxCutDb: 12, qMin: 0.5, qMax: 10 } as const;
export const EQ_FIT_LIMITS = { maxBands: 64, maxBoostDb: 24, maxCutDb: 48, maxPoints: 16384 } as const;

/** Fit grid density, points per octave. */
const GRID_POINTS_PER_OCTAVE = 48;
/** Excursions smaller than this are left alone: a band for them would chase measurement noise [product choice]. */
const MIN_CORRECTION_DB = 1;
/** Peaks left this high when the bands run out earn a warning, dB. */
const REMAINING_PEAK_WARNING_DB = 3;
/** A dip must be this many times deeper than the highest peak is high before it gets a boost band. */
const BOOST_PREFERENCE = 2;
/** Weight of the penalty on any boost the EQ puts into a null. */
const NULL_PENALTY = 10;
/** Joint refinement of every band at once up to this many bands; beyond it, band by band. */
const JOINT_REFINEMENT_MAX_BANDS = 16;

interface Band {
  frequencyHz: number;
  gainDb: number;
  q: number;
}

/**
 * Fits up to `maxBands` peaking filters that bring a measured response toward a target, cut first.
 *
 * 1. The measurement is resampled to a 1/48-octave grid over the fit band (power average where the
 *    measurement is denser than the grid, log-frequency interpolation where it is sparser) and compared
 *    with the target placed at the measurement's median level over the band.
 * 2. Narrow deep dips (≥ 6 dB below that level, ≤ 1/3 octave wide at half depth) are taken as nulls: they
 *    are left out of the fit, any boost into them is penalised and then removed, and each one is reported
 *    with a `nullNotBoosted` warning.
 * 3. Greedy: while bands remain, the largest remaining peak (≥ 1 dB) gets a cut band — f at the peak, gain
 *    = −height, Q from the width at half height `Q = √(2^N)/(2^N − 1)` for N octaves; when boosts are
 *    allowed, a dip gets a boost band instead only when it is twice as deep as the highest peak is high
 *    (cut first). Q is capped where the measurement is too coarse to show narrower bands. After each band all bands are refined together by
 *    bounded Levenberg–Marquardt on (log f, gain, log Q). With cuts only, the target's level is left free
 *    during refinement (the channel trim sets the level), so cuts flatten the response toward its lower
 *    parts; with boosts allowed it stays at the median, and dips below it are filled up to `maxBoostDb`.
 * 4. Band values are rounded (0.1 Hz, 0.01 dB, 0.001 Q, never past a limit) before the sections are
 *    designed, so the sections match the values a person would type into a processor.
 *
 * Deterministic: no randomness; the same input always gives the same bands.
 *
 * @returns bands, their cookbook peaking sections (designBiquad), the predicted response at the measured
 *   frequencies, residual RMS before/after, the target offset and warnings.
 * @throws CalculationInputError naming the field when an input is out of range.
 */
export function fitParametricEq(input: EqFitInput): EqFitResult {
  const fs = requireSampleRate(input.sampleRateHz);
  const { frequenciesHz, magnitudeDb } = requireMeasured(input.measured, fs);
  const target = requireTargetCurve(input.target ?? { kind: 'flat' });
  const maxBands = requireInteger(
    input.maxBands,
    { min: 0, max: EQ_FIT_LIMITS.maxBands },
    'maxBands',
    '/maxBands',
  );
  const maxBoostDb = requireInRange(
    input.maxBoostDb ?? EQ_FIT_DEFAULTS.maxBoostDb,
    { min: 0, max: EQ_FIT_LIMITS.maxBoostDb, unit: 'dB' },
    'maxBoostDb',
    '/maxBoostDb',
  );
  const maxCutDb = requireInRange(
    input.maxCutDb ?? EQ_FIT_DEFAULTS.maxCutDb,
    { min: 0, max: EQ_FIT_LIMITS.maxCutDb, unit: 'dB' },
    'maxCutDb',
    '/maxCutDb',
  );
  const qRange = requireQRange(input.qRange);
  const warnings: EqFitWarning[] = [];
  const { fromHz, toHz } = fitBand(input, frequenciesHz, fs, warnings);
  const qMax = resolutionLimitedQ(frequenciesHz, fromHz, toHz, qRange, warnings);

  const grid = logFrequencyGrid(fromHz, toHz, GRID_POINTS_PER_OCTAVE, 'iec');
  if (grid.length < 8) {
    throw new CalculationInputError(
      `the fit band ${fromHz}..${toHz} Hz is too narrow; it must span at least 1/6 octave`,
      '/toHz',
    );
  }
  const measuredOnGrid = resampleDb(frequenciesHz, magnitudeDb, grid);
  const targetOnGrid = grid.map((f) => targetDb(target, f));
  const departure = measuredOnGrid.map((m, i) => m - targetOnGrid[i]);
  // The median sets the level: peaks and dips then both count as departures from the typical level.
  let targetOffsetDb = median(departure);
  let nulls = findNulls(
    grid,
    Float64Array.from(departure, (d) => d - targetOffsetDb),
  );
  const inNull = new Uint8Array(grid.length);
  for (const dip of nulls) inNull.fill(1, dip.first, dip.last + 1);
  if (nulls.length > 0) {
    targetOffsetDb = median(departure.filter((_, i) => !inNull[i]));
    nulls = findNulls(
      grid,
      Float64Array.from(departure, (d) => d - targetOffsetDb),
    );
    inNull.fill(0);
    for (const dip of nulls) inNull.fill(1, dip.first, dip.last + 1);
  }
  const errorDb = Float64Array.from(departure, (d) => d - targetOffsetDb);

  const model = new BandModel(
    grid,
    fs,
    errorDb,
    inNull,
    {
      lnFrom: Math.log(fromHz),
      lnTo: Math.log(toHz),
      minGain: -maxCutDb,
      maxGain: maxBoostDb,
      lnQMin: Math.log(qRange.min),
      lnQMax: Math.log(qMax),
    },
    maxBoostDb === 0,
  );
  let bands = model.greedyFit(maxBands);
  bands = withoutBoostIntoNulls(model, bands);
  bands = bands
    .map((b) => roundBand(b, fromHz, toHz, maxCutDb, maxBoostDb, { min: qRange.min, max: qMax }))
    .filter((b) => Math.abs(b.gainDb) >= 0.1)
    .sort((a, b) => a.frequencyHz - b.frequencyHz);

  const peakingBands: PeakingBand[] = bands.map((b) => ({ type: 'peaking', ...b }));
  const sections = peakingBands.map((b) => designBiquad(b, fs));
  const eqOnGrid = sosMagnitudeDb(sections, model.circle);
  const eqOnMeasured = sosMagnitudeDb(sections, unitCircle(frequenciesHz, fs));
  const levelBefore = model.levelOf(new Float64Array(grid.length));
  const levelAfter = model.levelOf(eqOnGrid);
  const residualAfter = Array.from(errorDb, (e, i) => e + eqOnGrid[i] - levelAfter);

  warnings.push(...nullWarnings(nulls, maxBoostDb));
  warnings.push(...limitWarnings(peakingBands, residualAfter, inNull, maxBands, maxCutDb, maxBoostDb));

  return {
    bands: peakingBands,
    sections,
    predicted: {
      frequenciesHz: [...frequenciesHz],
      magnitudeDb: magnitudeDb.map((m, i) => m + eqOnMeasured[i]),
    },
    residualRmsDb: { before: rms(errorDb.map((e) => e - levelBefore)), after: rms(residualAfter) },
    targetOffsetDb: targetOffsetDb + levelAfter,
    fromHz,
    toHz,
    warnings,
  };
}

interface Bounds {
  lnFrom: number;
  lnTo: number;
  minGain: number;
  maxGain: number;
  lnQMin: number;
  lnQMax: number;
}

/** The fit's data and the dB response of peaking bands on its grid. */
class BandModel {
  readonly circle: UnitCircle;

  constructor(
    readonly grid: number[],
    readonly sampleRateHz: number,
    readonly errorDb: Float64Array,
    readonly inNull: Uint8Array,
    readonly bounds: Bounds,
    /** When true the target's level follows the corrected response (cuts only); otherwise it is fixed. */
    readonly freeLevel: boolean,
  ) {
    this.circle = unitCircle(grid, sampleRateHz);
  }

  /** dB response of one cookbook peaking section on the grid, written into `out`. */
  bandDb(band: Band, out: Float64Array): Float64Array {
    return sosMagnitudeDb([designBiquad({ type: 'peaking', ...band }, this.sampleRateHz)], this.circle, out);
  }

  totalDb(bands: readonly Band[]): Float64Array {
    const total = new Float64Array(this.grid.length);
    const scratch = new Float64Array(this.grid.length);
    for (const band of bands) {
      this.bandDb(band, scratch);
      for (let i = 0; i < total.length; i++) total[i] += scratch[i];
    }
    return total;
  }

  greedyFit(maxBands: number): Band[] {
    let bands: Band[] = [];
    for (let k = 0; k < maxBands; k++) {
      const residual = this.fillResiduals(this.totalDb(bands), new Float64Array(this.grid.length));
      const start = this.initialBand(residual);
      if (!start) break;
      bands = this.refine([...bands, start], 20);
    }
    return bands.length > 0 ? this.refine(bands, 60) : bands;
  }

  /** A new band for the largest peak (cut), or when none is left and boosts are allowed the largest dip. */
  private initialBand(residual: Float64Array): Band | null {
    let peak = -1;
    let dip = -1;
    for (let i = 0; i < residual.length; i++) {
      if (this.inNull[i]) continue;
      if (peak < 0 || residual[i] > residual[peak]) peak = i;
      if (dip < 0 || residual[i] < residual[dip]) dip = i;
    }
    if (peak < 0) return null;
    const peakWorth = this.bounds.minGain < 0 && residual[peak] >= MIN_CORRECTION_DB ? residual[peak] : 0;
    // Cut first: a dip earns a boost band only when it is twice as deep as the highest peak is high.
    const dipWorth =
      this.bounds.maxGain > 0 && -residual[dip] >= MIN_CORRECTION_DB ? -residual[dip] / BOOST_PREFERENCE : 0;
    if (peakWorth === 0 && dipWorth === 0) return null;
    const centre = peakWorth >= dipWorth ? peak : dip;

    const height = residual[centre];
    let lo = centre;
    while (
      lo > 0 &&
      !this.inNull[lo - 1] &&
      Math.abs(residual[lo - 1]) > Math.abs(height) / 2 &&
      Math.sign(residual[lo - 1]) === Math.sign(height)
    )
      lo--;
    let hi = centre;
    while (
      hi < residual.length - 1 &&
      !this.inNull[hi + 1] &&
      Math.abs(residual[hi + 1]) > Math.abs(height) / 2 &&
      Math.sign(residual[hi + 1]) === Math.sign(height)
    )
      hi++;
    const widthOctaves = Math.max(
      1 / GRID_POINTS_PER_OCTAVE,
      Math.log2(this.grid[hi] / this.grid[lo]) + 1 / GRID_POINTS_PER_OCTAVE,
    );
    const ratio = Math.pow(2, widthOctaves);
    const q = Math.sqrt(ratio) / (ratio - 1);
    const { minGain, maxGain, lnQMin, lnQMax } = this.bounds;
    return {
      frequencyHz: this.grid[centre],
      gainDb: Math.min(maxGain, Math.max(minGain, -height)),
      q: Math.min(Math.exp(lnQMax), Math.max(Math.exp(lnQMin), q)),
    };
  }

  /** Bounded Levenberg–Marquardt on (ln f, gain, ln Q) of the given bands, jointly or one at a time. */
  refine(bands: Band[], maxIterations: number): Band[] {
    if (bands.length <= JOINT_REFINEMENT_MAX_BANDS) {
      return this.refineSubset(
        bands,
        bands.map((_, i) => i),
        maxIterations,
      );
    }
    let current = this.refineSubset(bands, [bands.length - 1], maxIterations);
    for (let sweep = 0; sweep < 2; sweep++) {
      for (let i = 0; i < current.length; i++) current = this.refineSubset(current, [i], maxIterations);
    }
    return current;
  }

  /** Mean of (error + EQ) over the fitted points: the level a free-level fit matches the target at. */
  levelOf(eq: ArrayLike<number>): number {
    if (!this.freeLevel) return 0;
    let sum = 0;
    let count = 0;
    for (let i = 0; i < eq.length; i++) {
      if (this.inNull[i]) continue;
      sum += this.errorDb[i] + eq[i];
      count++;
    }
    return count > 0 ? sum / count : 0;
  }

  /** Residuals of a total EQ curve: the remaining error on fitted points, a penalty on any boost into a null. */
  fillResiduals(eq: Float64Array, out: Float64Array): Float64Array {
    const level = this.levelOf(eq);
    for (let i = 0; i < eq.length; i++) {
      out[i] = this.inNull[i] ? NULL_PENALTY * Math.max(0, eq[i]) : this.errorDb[i] + eq[i] - level;
    }
    return out;
  }

  private refineSubset(bands: Band[], free: number[], maxIterations: number): Band[] {
    const m = this.grid.length;
    const n = 3 * free.length;
    const fixed = this.totalDb(bands.filter((_, i) => !free.includes(i)));
    const bandAt = (p: Float64Array, j: number): Band => ({
      frequencyHz: Math.exp(p[3 * j]),
      gainDb: p[3 * j + 1],
      q: Math.exp(p[3 * j + 2]),
    });
    const responses = free.map(() => new Float64Array(m));
    const eq = new Float64Array(m);
    const probe = new Float64Array(m);
    const probeEq = new Float64Array(m);
    const probeResiduals = new Float64Array(m);
    const evaluate = (p: Float64Array): void => {
      eq.set(fixed);
      responses.forEach((response, j) => {
        this.bandDb(bandAt(p, j), response);
        for (let i = 0; i < m; i++) eq[i] += response[i];
      });
    };
    const { lnFrom, lnTo, minGain, maxGain, lnQMin, lnQMax } = this.bounds;
    const upper = Float64Array.from(free.flatMap(() => [lnTo, maxGain, lnQMax]));
    const problem: LeastSquaresProblem = {
      lower: Float64Array.from(free.flatMap(() => [lnFrom, minGain, lnQMin])),
      upper,
      residuals: (p) => {
        evaluate(p);
        return this.fillResiduals(eq, new Float64Array(m));
      },
      jacobian: (p, r) => {
        evaluate(p);
        const J = new Float64Array(m * n);
        const shifted = Float64Array.from(p);
        for (let k = 0; k < n; k++) {
          const j = Math.floor(k / 3);
          // Forward differences, stepping inward at an upper bound so the probe stays a valid filter.
          const h = k % 3 === 1 ? 1e-3 : 1e-5;
          const step = p[k] + h > upper[k] ? -h : h;
          shifted[k] = p[k] + step;
          this.bandDb(bandAt(shifted, j), probe);
          shifted[k] = p[k];
          const response = responses[j];
          for (let i = 0; i < m; i++) probeEq[i] = eq[i] - response[i] + probe[i];
          this.fillResiduals(probeEq, probeResiduals);
          for (let i = 0; i < m; i++) J[i * n + k] = (probeResiduals[i] - r[i]) / step;
        }
        return J;
      },
    };
    const start = Float64Array.from(
      free.flatMap((i) => [Math.log(bands[i].frequencyHz), bands[i].gainDb, Math.log(bands[i].q)]),
    );
    const { p } = levenbergMarquardt(problem, start, { maxIterations, relativeTolerance: 1e-4 });
    return bands.map((band, i) => (free.includes(i) ? bandAt(p, free.indexOf(i)) : band));
  }
}

/** Scales boosts down until the EQ adds no more than 0.1 dB inside any null. */
function withoutBoostIntoNulls(model: BandModel, bands: Band[]): Band[] {
  let current = bands;
  for (let attempt = 0; attempt < 40; attempt++) {
    const total = model.totalDb(current);
    const worst = Math.max(0, ...Array.from(total).filter((_, i) => model.inNull[i] === 1));
    if (worst <= 0.1) return current;
    current = current.map((b) => (b.gainDb > 0 ? { ...b, gainDb: b.gainDb * 0.8 } : b));
  }
  return current.map((b) => (b.gainDb > 0 ? { ...b, gainDb: 0 } : b));
}

function roundBand(
  band: Band,
  fromHz: number,
  toHz: number,
  maxCutDb: number,
  maxBoostDb: number,
  qRange: { min: number; max: number },
): Band {
  const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
  return {
    frequencyHz: clamp(Math.round(band.frequencyHz * 10) / 10, fromHz, toHz),
    gainDb: clamp(Math.trunc(band.gainDb * 100) / 100, -maxCutDb, maxBoostDb),
    q: clamp(Math.round(band.q * 1000) / 1000, qRange.min, qRange.max),
  };
}

function nullWarnings(nulls: ResponseNull[], maxBoostDb: number): EqFitWarning[] {
  return nulls.map((dip) => ({
    code: 'nullNotBoosted',
    message:
      `A narrow dip ${dip.depthDb.toFixed(1)} dB deep at ${dip.frequencyHz.toFixed(1)} Hz ` +
      `(${dip.widthOctaves.toFixed(2)} octave wide) looks like a cancellation; ` +
      (maxBoostDb > 0 ? 'it was not boosted' : 'cuts cannot fill it') +
      '. Moving the loudspeaker or the listening position changes it; EQ does not.',
  }));
}

function limitWarnings(
  bands: PeakingBand[],
  residualAfter: number[],
  inNull: Uint8Array,
  maxBands: number,
  maxCutDb: number,
  maxBoostDb: number,
): EqFitWarning[] {
  const warnings: EqFitWarning[] = [];
  const atLimit = bands.filter(
    (b) => b.gainDb <= -maxCutDb + 0.01 || (maxBoostDb > 0 && b.gainDb >= maxBoostDb - 0.01),
  );
  if (atLimit.length > 0) {
    warnings.push({
      code: 'gainLimitReached',
      message: `The band(s) at ${atLimit.map((b) => `${b.frequencyHz} Hz`).join(', ')} reached the gain limit (cut ${maxCutDb} dB, boost ${maxBoostDb} dB).`,
    });
  }
  const remainingPeak = Math.max(0, ...residualAfter.filter((_, i) => !inNull[i]));
  if (maxBands > 0 && bands.length >= maxBands && remainingPeak >= REMAINING_PEAK_WARNING_DB) {
    warnings.push({
      code: 'bandLimitReached',
      message: `All ${maxBands} bands are used and a peak of ${remainingPeak.toFixed(1)} dB above the target remains.`,
    });
  }
  return warnings;
}

function requireMeasured(
  measured: EqFitInput['measured'],
  fs: number,
): { frequenciesHz: number[]; magnitudeDb: number[] } {
  const { frequenciesHz, magnitudeDb } = measured ?? {};
  if (
    !Array.isArray(frequenciesHz) ||
    frequenciesHz.length < 2 ||
    frequenciesHz.length > EQ_FIT_LIMITS.maxPoints
  ) {
    throw new CalculationInputError(
      `measured.frequenciesHz must list 2..${EQ_FIT_LIMITS.maxPoints} frequencies`,
      '/measured/frequenciesHz',
    );
  }
  if (!Array.isArray(magnitudeDb) || magnitudeDb.length !== frequenciesHz.length) {
    throw new CalculationInputError(
      `measured.magnitudeDb must have one value per frequency (${frequenciesHz.length}); received ${Array.isArray(magnitudeDb) ? magnitudeDb.length : 'none'}`,
      '/measured/magnitudeDb',
    );
  }
  frequenciesHz.forEach((f, i) => {
    requireInRange(
      f,
      { min: 0, exclusiveMin: true, max: fs / 2, exclusiveMax: true, unit: 'Hz' },
      'frequency',
      `/measured/frequenciesHz/${i}`,
    );
    if (i > 0 && f <= frequenciesHz[i - 1]) {
      throw new CalculationInputError(
        `frequencies must ascend; ${f} Hz follows ${frequenciesHz[i - 1]} Hz`,
        `/measured/frequenciesHz/${i}`,
      );
    }
  });
  magnitudeDb.forEach((db, i) =>
    requireInRange(db, { min: -300, max: 300, unit: 'dB' }, 'magnitude', `/measured/magnitudeDb/${i}`),
  );
  return { frequenciesHz, magnitudeDb };
}

function requireQRange(qRange: EqFitInput['qRange']): { min: number; max: number } {
  const min = requireInRange(
    qRange?.min ?? EQ_FIT_DEFAULTS.qMin,
    { min: FILTER_LIMITS.qMin, max: FILTER_LIMITS.qMax },
    'qRange.min',
    '/qRange/min',
  );
  const max = requireInRange(
    qRange?.max ?? EQ_FIT_DEFAULTS.qMax,
    { min, max: FILTER_LIMITS.qMax },
    'qRange.max',
    '/qRange/max',
  );
  return { min, max };
}

function fitBand(
  input: EqFitInput,
  frequenciesHz: number[],
  fs: number,
  warnings: EqFitWarning[],
): { fromHz: number; toHz: number } {
  const lowest = frequenciesHz[0];
  const highest = Math.min(frequenciesHz[frequenciesHz.length - 1], 0.45 * fs);
  const fromRequested = input.fromHz ?? Math.max(20, lowest);
  const toRequested = input.toHz ?? Math.min(20000, highest);
  requireInRange(fromRequested, { min: 1, max: fs / 2, exclusiveMax: true, unit: 'Hz' }, 'fromHz', '/fromHz');
  requireInRange(
    toRequested,
    { min: fromRequested, exclusiveMin: true, max: fs / 2, unit: 'Hz' },
    'toHz',
    '/toHz',
  );
  const fromHz = Math.max(fromRequested, lowest);
  const toHz = Math.min(toRequested, highest);
  if (!(toHz > fromHz)) {
    throw new CalculationInputError(
      `the fit band ${fromRequested}..${toRequested} Hz does not overlap the measurement (${lowest}..${highest} Hz)`,
      '/fromHz',
    );
  }
  if (fromHz !== fromRequested || toHz !== toRequested) {
    warnings.push({
      code: 'fitRangeClipped',
      message: `The fit band was narrowed to ${fromHz}..${toHz} Hz, the part of ${fromRequested}..${toRequested} Hz the measurement covers (at most 0.45 × the sample rate).`,
    });
  }
  return { fromHz, toHz };
}

/**
 * The highest Q the measurement can support: a band narrower than two of its point spacings cannot be told
 * from the measurement's own sampling. Q of a bandwidth of N octaves is `√(2^N)/(2^N − 1)` (Audio EQ
 * Cookbook). Returns qRange.max unless the data is coarser, then warns `qLimitedByResolution`.
 */
function resolutionLimitedQ(
  frequenciesHz: number[],
  fromHz: number,
  toHz: number,
  qRange: { min: number; max: number },
  warnings: EqFitWarning[],
): number {
  const spacings: number[] = [];
  for (let i = 1; i < frequenciesHz.length; i++) {
    if (frequenciesHz[i] > fromHz && frequenciesHz[i - 1] < toHz) {
      spacings.push(Math.log2(frequenciesHz[i] / frequenciesHz[i - 1]));
    }
  }
  const ratio = Math.pow(2, 2 * median(spacings));
  const supported = Math.sqrt(ratio) / (ratio - 1);
  if (supported >= qRange.max) return qRange.max;
  const limited = Math.max(qRange.min, Math.floor(supported * 100) / 100);
  warnings.push({
    code: 'qLimitedByResolution',
    message: `The measurement has about ${(1 / median(spacings)).toFixed(1)} points per octave, so Q is limited to ${limited} (a band narrower than two point spacings cannot be resolved).`,
  });
  return limited;
}

const median = (values: readonly number[]): number => {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
};

/**
 * The measurement on the fit grid: where at least two measured points fall inside a grid point's
 * 1/48-octave window, their power average; elsewhere dB interpolated linearly in log frequency, which
 * keeps the shape of resonances sampled more coarsely than the grid.
 */
function resampleDb(frequenciesHz: number[], magnitudeDb: number[], grid: number[]): number[] {
  const power = magnitudeDb.map((db) => Math.pow(10, db / 10));
  const averaged = fractionalOctaveMean(frequenciesHz, power, 1 / GRID_POINTS_PER_OCTAVE, grid);
  const halfWindow = Math.pow(2, 1 / (2 * GRID_POINTS_PER_OCTAVE));
  let k = 0;
  return grid.map((f, i) => {
    while (k < frequenciesHz.length - 2 && frequenciesHz[k + 1] <= f) k++;
    let inside = 0;
    for (let j = Math.max(0, k - 2); j < Math.min(frequenciesHz.length, k + 4); j++) {
      if (frequenciesHz[j] >= f / halfWindow && frequenciesHz[j] <= f * halfWindow) inside++;
    }
    if (inside >= 2) return 10 * Math.log10(averaged[i]);
    const t = Math.log(f / frequenciesHz[k]) / Math.log(frequenciesHz[k + 1] / frequenciesHz[k]);
    return magnitudeDb[k] + t * (magnitudeDb[k + 1] - magnitudeDb[k]);
  });
}

const rms = (values: ArrayLike<number>): number => {
  let s = 0;
  for (let i = 0; i < values.length; i++) s += values[i] * values[i];
  return Math.sqrt(s / values.length);
};
