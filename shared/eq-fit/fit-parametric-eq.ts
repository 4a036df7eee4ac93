import { nominalOctaveCentreHz, bandsBetween } from '../analysis/iec-bands';
import { fractionalOctaveMean } from '../analysis/smoothing';
import { logFrequencyGrid } from '../dsp/grid';
import { sosMagnitudeDb, unitCircle } from '../dsp/response';
import type { Sos } from '../dsp/sos';
import { CalculationInputError, requireInRange, requireInteger } from '../errors';
import { designBiquad, FILTER_LIMITS } from '../filters/biquad-design';
import { LIMITS, MAX_FREQUENCY_HZ } from '../limits';
import { requireSampleRate } from '../units/sample-rate';
import {
  bandwidthOctaves,
  bandsOverlap,
  combinedExtremes,
  MIN_BAND_SPACING_OCTAVES,
  octavesApart,
  truncateToStep,
  withinCombinedLimits,
} from './band-discipline';
import {
  BandModel,
  weightedRms,
  type Band,
  type BandBounds,
  type BandSteps,
  type FitData,
} from './band-model';
import { findNulls, type ResponseNull } from './nulls';
import { requireTargetCurve, targetDb, type TargetCurve } from './target-curve';

export interface MeasuredResponse {
  frequenciesHz: number[];
  magnitudeDb: number[];
}

/** One microphone position's measurement of the same loudspeaker. */
export interface EqFitPosition {
  label: string;
  measured: MeasuredResponse;
}

export interface EqFitInput {
  /** Processor sample rate the sections are designed for, hertz. */
  sampleRateHz: number;
  /** Measured magnitude response at one position (any level). Give this or `positions`. */
  measured?: MeasuredResponse;
  /** Measurements at 2..16 microphone positions; the fit works on their spatial average. */
  positions?: EqFitPosition[];
  /** Target curve (default flat). */
  target?: TargetCurve;
  /** Most peaking bands to use in all, 0..64. */
  maxBands: number;
  /** Largest boost of all bands together at any frequency, dB, 0..24 (default 0: cuts only). */
  maxBoostDb?: number;
  /** Largest cut of all bands together at any frequency, dB, 0..48 (default 12). */
  maxCutDb?: number;
  /** Lower end of the correction, hertz (default: the lowest measured frequency, at least 20 Hz). */
  fromHz?: number;
  /** Upper end of the correction, hertz (default: the transition frequency). */
  toHz?: number;
  /** Allowed Q of the bands below the transition (default 0.5..10). */
  qRange?: { min: number; max: number };
  /** Smallest gain worth a band, dB (default 0.5). */
  minGainDb?: number;
  /** Band over which the target is matched to the measurement's level (default 500..2000 Hz). */
  levelReferenceHz?: { fromHz: number; toHz: number };
  /** The room, for the transition frequency 2000·√(T/V) (Kuttruff, "Room Acoustics"). */
  room?: { volumeM3: number; reverberationTimeS?: number };
  /** Centre frequencies the processor's bands accept, hertz. */
  bandFrequencyRangeHz?: { fromHz: number; toHz: number };
  /** Filter types the processor offers; without `peaking` no band is fitted. */
  filterTypes?: string[];
  /**
   * The processor's setting steps (default 0.1 Hz, 0.01 dB, 0.001): bands are rounded to them, gains toward
   * 0 dB, so the limits still hold. `frequencyStepUnit` `octave`: the step is a fraction of an octave from 1 kHz.
   */
  bandSteps?: { frequencyHz?: number; frequencyStepUnit?: 'hz' | 'octave'; gainDb?: number; q?: number };
  /** Broad, gentle corrections above the transition frequency: only when given. */
  aboveTransition?: {
    /** Most bands above the transition, 0..4 (default 2); they count toward `maxBands`. */
    maxBands?: number;
    /** Largest boost of one broad band, dB (default 2, never more than `maxBoostDb`). */
    maxBoostDb?: number;
    /** Largest cut of one broad band, dB (default 3, never more than `maxCutDb`). */
    maxCutDb?: number;
    /** Highest Q of a broad band (default 1; at least 0.3). */
    qMax?: number;
    /** Upper end of the broad corrections, hertz (default: the measurement's top, at most 20 kHz). */
    toHz?: number;
  };
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

/** What a band corrects: the feature of the response it was placed for. */
export interface BandExplanation {
  frequencyHz: number;
  gainDb: number;
  q: number;
  /** `peak`/`dip` below the transition; `broadExcess`/`broadDeficit` a broad trend above it. */
  feature: 'peak' | 'dip' | 'broadExcess' | 'broadDeficit';
  featureHz: number;
  /** How far the feature stands above (+) or below (−) the target at its level, dB. */
  aboveTargetDb: number;
  message: string;
}

/** A correction that was considered and left out, and why. */
export interface NotUsed {
  code:
    | 'null'
    | 'positionsDisagree'
    | 'narrowDip'
    | 'boostsNotAllowed'
    | 'belowMinimumGain'
    | 'merged'
    | 'opposesCut'
    | 'madeResidualWorse'
    | 'littleBenefit'
    | 'bandBudget'
    | 'aboveTransition'
    | 'peakingNotSupported';
  frequencyHz: number | null;
  message: string;
}

export interface OctaveResidual {
  /** Nominal mid-band frequency of the IEC 61260-1 octave band, hertz. */
  centreHz: number;
  /** RMS of (response − target − level) in the band before and after the EQ, dB. */
  beforeDb: number;
  afterDb: number;
}

export interface PositionResult {
  label: string;
  predicted: MeasuredResponse;
  residualRmsDb: { before: number; after: number };
}

export interface EqFitResult {
  bands: PeakingBand[];
  /** One cookbook peaking section per band, a0 = 1. */
  sections: Sos[];
  /** The measurement (or the spatial average) with the sections applied. */
  predicted: MeasuredResponse;
  /**
   * RMS of (response − target − level) before and after, dB, weighted by agreement between positions:
   * over fromHz..toHz, or up to the top of the broad corrections when `aboveTransition` was given.
   */
  residualRmsDb: { before: number; after: number };
  /** Level of the target: the measurement's mean departure from the target over the level reference band, dB. */
  targetOffsetDb: number;
  fromHz: number;
  toHz: number;
  /** The transition frequency and where it came from. */
  transition: { frequencyHz: number; source: 'room' | 'toHz' | 'assumed'; reverberationTimeS: number | null };
  levelReference: { fromHz: number; toHz: number; source: 'referenceBand' | 'fitBandMedian' };
  /** Largest boost and cut (both ≥ 0) of all bands together at any frequency, dB. */
  combined: { maxBoostDb: number; maxCutDb: number };
  explanation: { bands: BandExplanation[]; notUsed: NotUsed[]; octaveBands: OctaveResidual[] };
  /** With several positions: the spatial average fitted and each position's predicted result. */
  average: MeasuredResponse | null;
  positions: PositionResult[];
  warnings: EqFitWarning[];
}

/** Defaults of the fit; those the contract states come from shared/limits.ts. */
export const EQ_FIT_DEFAULTS = {
  maxBoostDb: LIMITS.maxBoostDb.default,
  maxCutDb: LIMITS.maxCutDb.default,
  qMin: 0.5,
  qMax: 10,
  minGainDb: LIMITS.minGainDb.default,
  levelFromHz: 500,
  levelToHz: 2000,
  /** Without a room, the correction stops here [common practice: small rooms' transition region lies near 100–300 Hz]. */
  transitionHz: 200,
  /** Reverberation time assumed when a room volume comes without one, s [common practice for treated control rooms]. */
  reverberationTimeS: 0.3,
  aboveMaxBands: LIMITS['AboveTransition.maxBands'].default,
  aboveMaxBoostDb: LIMITS['AboveTransition.maxBoostDb'].default,
  aboveMaxCutDb: LIMITS['AboveTransition.maxCutDb'].default,
  aboveQMax: LIMITS['AboveTransition.qMax'].default,
} as const;
/** Ranges the fit accepts: the contract's bounds (shared/limits.ts), checked again for callers in the core. */
export const EQ_FIT_LIMITS = {
  maxBands: LIMITS.maxBands.maximum,
  maxBoostDb: LIMITS.maxBoostDb.maximum,
  maxCutDb: LIMITS.maxCutDb.maximum,
  /**
   * Larger than the contract's MAX_FIT_POINTS (what one request may send): stored room plans fit responses
   * averaged from stored measurements, which that bound does not cover, so this is the core's own budget.
   */
  maxPoints: 16384,
  maxPositions: LIMITS['EqFitRequest.positions'].maxItems,
  minGainMaxDb: LIMITS.minGainDb.maximum,
  aboveMaxBands: LIMITS['AboveTransition.maxBands'].maximum,
  aboveQMin: LIMITS['AboveTransition.qMax'].minimum,
  aboveQMaxMax: LIMITS['AboveTransition.qMax'].maximum,
} as const;

/** Fit grid density, points per octave (IEC base-ten series, so grids of different ranges line up). */
const GRID_POINTS_PER_OCTAVE = 48;
/** A feature smaller than this is not worth a band: it would chase measurement noise [product choice]. */
const MIN_FEATURE_DB = 1;
/** Peaks left this high when the bands run out earn a warning, dB. */
const REMAINING_PEAK_WARNING_DB = 3;
/** A dip must be this many times deeper than the highest peak is high before it gets a boost band (cut first). */
const BOOST_PREFERENCE = 2;
/** A dip narrower than this at half depth is not boosted: it is a cancellation or a notch that moves, octaves. */
const NARROW_DIP_OCTAVES = 1 / 6;
/** Boosts stay broad: a narrow boost spends headroom on a feature that moves with the listener [practice]. */
const BOOST_Q_MAX = 3;
/** Positions disagreeing by more than this (standard deviation, dB) are not boosted there. */
const DISAGREEMENT_NO_BOOST_DB = 3;
/** Spread (dB) at which a frequency's weight in the fit halves: w = 1/(1 + (σ/σ½)²). */
const DISAGREEMENT_HALF_WEIGHT_DB = 2;
/** A response this much lower over the level reference band than in its fit band is band-limited (a subwoofer), dB. */
const OUT_OF_BAND_DB = 10;
/** A band that lowers the residual RMS by less than this is not worth a processor slot, dB [product choice]. */
const MIN_BENEFIT_DB = 0.02;
/** How far above the correction range the fit still watches the bands' skirts, octaves. */
const GUARD_OCTAVES = 1;
/** Smoothing of the response above the transition, octaves: only broad trends count there. */
const ABOVE_SMOOTHING_OCTAVES = 1 / 2;
/** Most entries in `notUsed`, so a pathological response cannot make the answer huge. */
const MAX_NOT_USED = 24;

type Feature = Pick<BandExplanation, 'feature' | 'featureHz' | 'aboveTargetDb'>;
interface Fitted {
  band: Band;
  bounds: BandBounds;
  feature: Feature;
  /** `room`: below the transition; `broad`: a gentle band above it. */
  region: 'room' | 'broad';
}

interface Position {
  label: string;
  frequenciesHz: number[];
  magnitudeDb: number[];
}

/**
 * Fits peaking filters that bring a measured response toward a target curve the way an engineer would:
 *
 * 1. **Level first.** The target is placed at the measurement's mean level over the level reference band
 *    (default 500 Hz–2 kHz), so the EQ corrects shape, never overall level.
 * 2. **Range.** Bands go from the low end up to the transition frequency `2000·√(T/V)` (Kuttruff, "Room
 *    Acoustics") of the given room (T defaults to 0.3 s), or `toHz`, or 200 Hz when neither is given. Above
 *    it, only when `aboveTransition` is given, a few broad bands (Q ≤ 1) correct the ½-octave-smoothed trend.
 * 3. **Several positions** are power-averaged on a 1/48-octave grid; each frequency's weight in the fit is
 *    `1/(1 + (σ/2 dB)²)` of the positions' spread σ, and where σ > 3 dB nothing is boosted.
 * 4. **Greedy, cut first.** The largest weighted peak (≥ 1 dB) gets a cut; a dip gets a boost only when
 *    boosts are allowed, it is at least 1/6 octave wide at half depth, not a null (≥ 6 dB, ≤ 1/3 octave),
 *    not where positions disagree, and twice as deep as the highest peak is high. After each band all bands
 *    are refined together (bounded Levenberg–Marquardt); the cost penalises boosts into no-boost points and
 *    the summed EQ beyond its limits.
 * 5. **Band discipline.** Same-sign bands closer than 1/6 octave are merged; a boost overlapping a cut is
 *    dropped; bands under `minGainDb` are dropped; then the summed response of all bands is held within
 *    `maxBoostDb` and `maxCutDb` at every frequency (1/96-octave grid and every band centre), and bands are
 *    removed while the residual is worse than with no EQ.
 *
 * Deterministic: no randomness; the same input always gives the same answer.
 *
 * @returns bands, their cookbook peaking sections, the predicted response, residuals (overall and per
 *   octave band), the combined boost and cut, per-band explanations and the corrections left out.
 * @throws CalculationInputError naming the field when an input is out of range.
 */
export function fitParametricEq(input: EqFitInput): EqFitResult {
  const fs = requireSampleRate(input.sampleRateHz);
  const positions = requirePositions(input, fs);
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
  const minGainDb = requireInRange(
    input.minGainDb ?? EQ_FIT_DEFAULTS.minGainDb,
    { min: 0, max: EQ_FIT_LIMITS.minGainMaxDb, unit: 'dB' },
    'minGainDb',
    '/minGainDb',
  );
  const qRange = requireQRange(input.qRange);
  const bandRange = requireBandRange(input.bandFrequencyRangeHz, fs);
  const warnings: EqFitWarning[] = [];
  const notUsed: NotUsed[] = [];

  const lowest = Math.max(...positions.map((p) => p.frequenciesHz[0]));
  const highest = Math.min(0.45 * fs, ...positions.map((p) => p.frequenciesHz[p.frequenciesHz.length - 1]));
  if (!(highest > lowest)) {
    throw new CalculationInputError(
      'the positions share no frequency range below 0.45 × the sample rate',
      input.positions ? '/positions' : '/measured/frequenciesHz',
    );
  }
  const transition = transitionOf(input, warnings);
  const { fromHz, toHz } = fitBand(input, lowest, highest, transition.frequencyHz, warnings);
  const qMax = resolutionLimitedQ(positions[0].frequenciesHz, fromHz, toHz, qRange, warnings);

  // Everything is compared on one 1/48-octave grid over the measured range.
  const grid = logFrequencyGrid(lowest, highest, GRID_POINTS_PER_OCTAVE, 'iec');
  if (grid.length < 2) {
    throw new CalculationInputError(
      `the measurement spans too little (${lowest}..${highest} Hz) to fit; it must span at least 1/24 octave`,
      input.positions ? '/positions' : '/measured/frequenciesHz',
    );
  }
  const onGrid = positions.map((p) => resampleDb(p.frequenciesHz, p.magnitudeDb, grid));
  const { averageDb, spreadDb } = spatialAverage(onGrid);
  const targetOnGrid = grid.map((f) => targetDb(target, f));
  const departure = averageDb.map((m, i) => m - targetOnGrid[i]);
  const fitFirst = grid.findIndex((f) => f >= fromHz);
  let fitLast = -1;
  for (let i = grid.length - 1; i >= 0; i--)
    if (grid[i] <= toHz) {
      fitLast = i;
      break;
    }
  const fitGrid = fitFirst >= 0 && fitLast >= fitFirst ? grid.slice(fitFirst, fitLast + 1) : [];
  const level = levelOf(input, grid, departure, fitFirst, fitLast, warnings);
  const deviation = Float64Array.from(departure, (d) => d - level.offsetDb);
  const weight = Float64Array.from(spreadDb, (s) => 1 / (1 + (s / DISAGREEMENT_HALF_WEIGHT_DB) ** 2));

  // Below the transition.
  const fitError = deviation.slice(fitFirst, fitLast + 1);
  const nulls = fitGrid.length > 2 ? findNulls(fitGrid, fitError) : [];
  // The guard: up to an octave above the range, where the bands' skirts should leave the response alone.
  let guardLast = fitLast;
  while (
    fitGrid.length > 0 &&
    guardLast + 1 < grid.length &&
    grid[guardLast + 1] <= toHz * 2 ** GUARD_OCTAVES
  )
    guardLast++;
  const roomGrid = fitGrid.length > 0 ? grid.slice(fitFirst, guardLast + 1) : [];
  const guard = Uint8Array.from(roomGrid, (_, i) => (i >= fitGrid.length ? 1 : 0));
  const noBoost = new Uint8Array(roomGrid.length);
  for (const dip of nulls) noBoost.fill(1, dip.first, dip.last + 1);
  for (let i = 0; i < fitGrid.length; i++)
    if (spreadDb[fitFirst + i] > DISAGREEMENT_NO_BOOST_DB) noBoost[i] = 1;
  const roomData: FitData = {
    grid: roomGrid,
    errorDb: Float64Array.from(roomGrid, (_, i) => (guard[i] ? 0 : fitError[i])),
    weight: Float64Array.from(roomGrid, (_, i) => weight[fitFirst + i]),
    noBoost,
    guard,
    baseDb: new Float64Array(roomGrid.length),
    maxBoostDb,
    maxCutDb,
    freeLevel: level.source === 'fitBandMedian' && maxBoostDb === 0,
  };
  const peakingAllowed = !input.filterTypes || input.filterTypes.includes('peaking');
  if (!peakingAllowed) {
    notUsed.push({
      code: 'peakingNotSupported',
      frequencyHz: null,
      message: `The processor offers ${input.filterTypes?.join(', ') || 'no filter types'} but no peaking filters, so no band was fitted.`,
    });
  }
  const steps = requireSteps(input.bandSteps);
  const roomBounds = {
    fromHz: Math.max(fromHz, bandRange.min),
    toHz: Math.min(toHz, bandRange.max),
    qMin: qRange.min,
    qMax,
    steps,
  };
  let fitted: Fitted[] = [];
  let roomModel: BandModel | null = null;
  if (peakingAllowed && fitGrid.length >= 8 && roomBounds.toHz > roomBounds.fromHz && maxBands > 0) {
    roomModel = new BandModel(roomData, fs);
    fitted = fitRoomBands(roomModel, roomBounds, {
      maxBands,
      maxBoostDb,
      maxCutDb,
      minGainDb,
      nulls,
      spreadDb: spreadDb.slice(fitFirst, fitLast + 1),
      notUsed,
    });
  } else if (fitGrid.length < 8 && maxBands > 0) {
    warnings.push({
      code: 'fitRangeTooNarrow',
      message: `The correction range ${round1(fromHz)}..${round1(toHz)} Hz spans less than 1/6 octave of the measurement, so no band was fitted below the transition.`,
    });
  }

  // Above the transition: only when asked.
  const aboveTop = Math.min(input.aboveTransition?.toHz ?? 20000, highest);
  if (input.aboveTransition && peakingAllowed) {
    fitted = fitBroadBands(input.aboveTransition, {
      fs,
      grid,
      deviation,
      weight,
      fromHz: toHz,
      toHz: aboveTop,
      fitted,
      maxBands,
      maxBoostDb,
      maxCutDb,
      minGainDb,
      bandRange,
      steps,
      notUsed,
      warnings,
    });
  } else if (input.toHz === undefined && level.source === 'referenceBand') {
    reportAboveTransition(grid, deviation, toHz, highest, notUsed);
  }

  // Final check of every rule on the rounded bands, and never worse than no EQ.
  fitted = finalDiscipline(fitted, fs, maxBoostDb, maxCutDb, minGainDb, steps.gainDb, roomModel, notUsed);
  // With broad bands the answer covers the whole corrected range, on the unsmoothed response: bands go
  // (broad ones first) while the residual there is worse than without them.
  let reportLast = fitLast;
  if (input.aboveTransition && fitGrid.length > 0) {
    while (reportLast + 1 < grid.length && grid[reportLast + 1] <= aboveTop) reportLast++;
  }
  const reportModel =
    reportLast > fitLast
      ? new BandModel(
          {
            grid: grid.slice(fitFirst, reportLast + 1),
            errorDb: deviation.slice(fitFirst, reportLast + 1),
            weight: weight.slice(fitFirst, reportLast + 1),
            noBoost: new Uint8Array(reportLast + 1 - fitFirst),
            guard: new Uint8Array(reportLast + 1 - fitFirst),
            baseDb: new Float64Array(reportLast + 1 - fitFirst),
            maxBoostDb,
            maxCutDb,
            freeLevel: false,
          },
          fs,
        )
      : null;
  if (reportModel) {
    fitted = notWorseThanNone(reportModel, fitted, notUsed, 'broad');
    fitted = notWorseThanNone(reportModel, fitted, notUsed, 'any');
  }
  fitted.sort((a, b) => a.band.frequencyHz - b.band.frequencyHz);

  const bands: PeakingBand[] = fitted.map(({ band }) => ({ type: 'peaking', ...band }));
  const sections = bands.map((b) => designBiquad(b, fs));
  const eqOnGrid = sosMagnitudeDb(sections, unitCircle(grid, fs));
  const roomWeight = roomData.weight;
  const eqOnFit = eqOnGrid.slice(fitFirst, fitLast + 1);
  // A free level (cuts only, no reference band) follows the corrected response; otherwise both are 0.
  const levelModel = new BandModel(roomData, fs);
  const levelBefore = levelModel.levelOf(new Float64Array(roomGrid.length));
  const levelAfter = levelModel.levelOf(eqOnGrid.slice(fitFirst, fitFirst + roomGrid.length));
  const before = reportModel
    ? reportModel.weightedRms([])
    : weightedRms(
        fitError.map((e) => e - levelBefore),
        roomWeight,
      );
  const after = reportModel
    ? reportModel.weightedRms(fitted.map((f) => f.band))
    : weightedRms(
        fitError.map((e, i) => e + eqOnFit[i] - levelAfter),
        roomWeight,
      );
  const combined = combinedExtremes(
    fitted.map((f) => f.band),
    fs,
  );

  warnings.push(...nullWarnings(nulls, maxBoostDb));
  warnings.push(
    ...limitWarnings(
      fitted,
      fitError.map((e) => e - levelAfter),
      eqOnFit,
      maxBands,
      combined,
      maxCutDb,
      maxBoostDb,
    ),
  );

  const single = positions.length === 1;
  const predictedAt = (p: Position): MeasuredResponse => {
    const eq = sosMagnitudeDb(sections, unitCircle(p.frequenciesHz, fs));
    return { frequenciesHz: [...p.frequenciesHz], magnitudeDb: p.magnitudeDb.map((m, i) => m + eq[i]) };
  };
  return {
    bands,
    sections,
    predicted: single
      ? predictedAt(positions[0])
      : { frequenciesHz: [...grid], magnitudeDb: averageDb.map((m, i) => m + eqOnGrid[i]) },
    residualRmsDb: { before, after },
    targetOffsetDb: level.offsetDb + levelAfter,
    fromHz,
    toHz,
    transition,
    levelReference: { fromHz: level.fromHz, toHz: level.toHz, source: level.source },
    combined,
    explanation: {
      bands: fitted.map((f) =>
        explain(
          f.region === 'room'
            ? featureUnder(
                f,
                fitGrid,
                fitError.map((e) => e - levelBefore),
              )
            : f,
        ),
      ),
      notUsed: notUsed.slice(0, MAX_NOT_USED),
      octaveBands: octaveResiduals(grid, deviation, eqOnGrid, levelBefore, levelAfter),
    },
    average: single ? null : { frequenciesHz: [...grid], magnitudeDb: [...averageDb] },
    positions: single
      ? []
      : positions.map((p, k) => {
          const own = onGrid[k].map((m, i) => m - targetOnGrid[i]);
          const ownLevel = levelOf(input, grid, own, fitFirst, fitLast, []).offsetDb;
          const error = own.slice(fitFirst, fitLast + 1).map((d) => d - ownLevel);
          return {
            label: p.label,
            predicted: predictedAt(p),
            residualRmsDb: {
              before: rms(error),
              after: rms(error.map((e, i) => e + eqOnGrid[fitFirst + i])),
            },
          };
        }),
    warnings,
  };
}

interface RoomFitOptions {
  maxBands: number;
  maxBoostDb: number;
  maxCutDb: number;
  minGainDb: number;
  nulls: ResponseNull[];
  spreadDb: Float64Array;
  notUsed: NotUsed[];
}

/** Greedy placement and joint refinement below the transition, then merging and pruning (see fitParametricEq). */
function fitRoomBands(
  model: BandModel,
  limits: { fromHz: number; toHz: number; qMin: number; qMax: number; steps: BandSteps },
  options: RoomFitOptions,
): Fitted[] {
  const { maxBands, maxBoostDb, maxCutDb, minGainDb, notUsed } = options;
  const cutBounds: BandBounds = { ...limits, minGainDb: -maxCutDb, maxGainDb: 0 };
  const boostBounds: BandBounds = {
    ...limits,
    minGainDb: 0,
    maxGainDb: maxBoostDb,
    qMax: Math.max(limits.qMin, Math.min(limits.qMax, BOOST_Q_MAX)),
  };
  const grid = model.data.grid;
  const skipped = new Uint8Array(grid.length);
  const refine = (fitted: Fitted[], iterations: number, onlyLast = false): Fitted[] => {
    const bands = model.refine(
      fitted.map((f) => f.band),
      fitted.map((f) => f.bounds),
      iterations,
      onlyLast,
    );
    return fitted.map((f, i) => ({ ...f, band: bands[i] }));
  };

  // Boost candidates that cannot be used are reported once, with the reason.
  for (const dip of options.nulls) {
    notUsed.push({
      code: 'null',
      frequencyHz: round1(dip.frequencyHz),
      message: `A dip ${dip.depthDb.toFixed(1)} dB deep and ${dip.widthOctaves.toFixed(2)} octave wide at ${round1(dip.frequencyHz)} Hz looks like a cancellation; it was not boosted.`,
    });
  }
  reportDisagreement(grid, model.data.errorDb, options.spreadDb, notUsed);

  let fitted: Fitted[] = [];
  let setAside = 0;
  for (;;) {
    const residual = model.residualDb(fitted.map((f) => f.band));
    const start = initialBand(residual, model.data, skipped, { cutBounds, boostBounds, minGainDb, notUsed });
    if (!start) break;
    if (fitted.length >= maxBands) {
      notUsed.push({
        code: 'bandBudget',
        frequencyHz: round1(start.feature.featureHz),
        message: `A ${start.feature.feature} at ${round1(start.feature.featureHz)} Hz, ${signed(start.feature.aboveTargetDb)} dB from the target, got no band: all ${maxBands} bands are in use.`,
      });
      break;
    }
    // The new band finds its place against the others; all move together once the greedy pass ends.
    const trial = refine([...fitted, start], 20, true);
    const gain = model.weightedRms(fitted.map((f) => f.band)) - model.weightedRms(trial.map((f) => f.band));
    if (gain < MIN_BENEFIT_DB) {
      // A feature no band can help (one sitting at the edge of the range, say) is set aside, not retried.
      const centre = grid.indexOf(start.feature.featureHz);
      const [lo, hi] = halfHeightRegion(residual, model.data.noBoost, centre);
      skipped.fill(start.feature.feature === 'peak' ? 2 : 1, lo, hi + 1);
      notUsed.push({
        code: 'littleBenefit',
        frequencyHz: round1(start.feature.featureHz),
        message: `A ${start.feature.feature} at ${round1(start.feature.featureHz)} Hz, ${signed(start.feature.aboveTargetDb)} dB from the target, got no band: one within the limits would lower the residual by less than ${MIN_BENEFIT_DB} dB.`,
      });
      if (++setAside > 2 * maxBands + 8) break;
      continue;
    }
    fitted = trial;
  }
  if (maxBoostDb === 0) reportDipNotBoosted(model, fitted, notUsed);
  if (fitted.length === 0) return fitted;
  fitted = refine(fitted, 60);

  // Merge, drop and refine again until nothing changes (at most four rounds).
  for (let round = 0; round < 4; round++) {
    const { kept, changed } = disciplined(fitted, maxCutDb, maxBoostDb, minGainDb, notUsed, true);
    fitted = kept;
    if (!changed || fitted.length === 0) break;
    fitted = refine(fitted, 30);
  }
  return fitted;
}

/**
 * One round of the band rules on rounded bands: a boost within 1/6 octave of, or overlapping, a cut is
 * dropped (cut first); same-sign bands within 1/6 octave are merged into the larger one (`merge`) or the
 * smaller is dropped; bands under the minimum gain are dropped.
 */
function disciplined(
  fitted: Fitted[],
  maxCutDb: number,
  maxBoostDb: number,
  minGainDb: number,
  notUsed: NotUsed[],
  merge: boolean,
): { kept: Fitted[]; changed: boolean } {
  let kept = fitted.map((f) => ({ ...f, band: roundBand(f.band, f.bounds) }));
  let changed = false;
  // Largest first, so a smaller band gives way to a larger one.
  kept.sort(
    (a, b) => Math.abs(b.band.gainDb) - Math.abs(a.band.gainDb) || a.band.frequencyHz - b.band.frequencyHz,
  );
  const result: Fitted[] = [];
  for (const candidate of kept) {
    const { band } = candidate;
    if (band.gainDb === 0 || Math.abs(band.gainDb) < minGainDb) {
      changed = true;
      notUsed.push({
        code: 'belowMinimumGain',
        frequencyHz: band.frequencyHz,
        message: `A band at ${band.frequencyHz} Hz would change the response by only ${Math.abs(band.gainDb).toFixed(2)} dB (minimum ${minGainDb} dB); it was left out.`,
      });
      continue;
    }
    const opposing = result.find(
      (k) =>
        Math.sign(k.band.gainDb) !== Math.sign(band.gainDb) &&
        (bandsOverlap(k.band, band) || octavesApart(k.band, band) < MIN_BAND_SPACING_OCTAVES),
    );
    if (opposing) {
      changed = true;
      // Cut first: a boost that overlaps a cut gives way, whichever is larger.
      const boost = band.gainDb > 0 ? candidate : opposing;
      const cut = band.gainDb > 0 ? opposing : candidate;
      if (boost !== candidate) result.splice(result.indexOf(boost), 1, candidate);
      notUsed.push({
        code: 'opposesCut',
        frequencyHz: boost.band.frequencyHz,
        message: `A boost of ${boost.band.gainDb} dB at ${boost.band.frequencyHz} Hz would overlap the cut at ${cut.band.frequencyHz} Hz; bands of opposite sign are not stacked, so the boost was left out.`,
      });
      continue;
    }
    const near = result.find((k) => octavesApart(k.band, band) < MIN_BAND_SPACING_OCTAVES);
    if (near) {
      changed = true;
      if (merge) {
        const total = Math.abs(near.band.gainDb) + Math.abs(band.gainDb);
        const lnF =
          (Math.abs(near.band.gainDb) * Math.log(near.band.frequencyHz) +
            Math.abs(band.gainDb) * Math.log(band.frequencyHz)) /
          total;
        const sign = Math.sign(near.band.gainDb);
        near.band = {
          frequencyHz: Math.exp(lnF),
          gainDb:
            sign *
            Math.min(
              sign > 0 ? maxBoostDb : maxCutDb,
              Math.abs(near.band.gainDb) + Math.abs(band.gainDb) / 2,
            ),
          q: Math.min(near.band.q, band.q),
        };
        near.band.q = Math.min(near.bounds.qMax, Math.max(near.bounds.qMin, near.band.q));
        near.band.frequencyHz = Math.min(
          near.bounds.toHz,
          Math.max(near.bounds.fromHz, near.band.frequencyHz),
        );
      }
      notUsed.push({
        code: 'merged',
        frequencyHz: band.frequencyHz,
        message: `A band at ${band.frequencyHz} Hz lay within 1/6 octave of the band at ${near.band.frequencyHz.toFixed(1)} Hz; ${merge ? 'the two were merged into one' : 'the smaller was left out'}.`,
      });
      continue;
    }
    result.push(candidate);
  }
  kept = result;
  return { kept, changed };
}

/**
 * The last word on the bands: rounded; no boost overlapping a cut; none within 1/6 octave of another; the
 * combined limits held; none under the minimum gain; no boost into a no-boost point; and bands removed
 * while the residual is worse than with no EQ. Only removes bands or shrinks gains, so it ends.
 */
function finalDiscipline(
  fitted: Fitted[],
  fs: number,
  maxBoostDb: number,
  maxCutDb: number,
  minGainDb: number,
  gainStepDb: number,
  roomModel: BandModel | null,
  notUsed: NotUsed[],
): Fitted[] {
  let current = fitted;
  for (let round = 0; round < 20; round++) {
    const before = current.length;
    current = disciplined(current, maxCutDb, maxBoostDb, minGainDb, notUsed, false).kept;
    const limited = withinCombinedLimits(
      current.map((f) => f.band),
      fs,
      maxBoostDb,
      maxCutDb,
      gainStepDb,
    );
    current = current.map((f, i) => ({ ...f, band: limited.bands[i] }));
    if (roomModel) current = withoutBoostIntoNoBoost(roomModel, current, gainStepDb);
    current = current.filter(
      (f) => (f.band.gainDb !== 0 && Math.abs(f.band.gainDb) >= minGainDb) || dropNote(f, minGainDb, notUsed),
    );
    if (roomModel) current = notWorseThanNone(roomModel, current, notUsed, 'room');
    if (roomModel) current = withoutIdleBands(roomModel, current, notUsed);
    const stable =
      current.length === before &&
      !limited.scaled &&
      current.every((f) => Math.abs(f.band.gainDb) >= minGainDb);
    if (stable) break;
  }
  return current;
}

function dropNote(f: Fitted, minGainDb: number, notUsed: NotUsed[]): false {
  notUsed.push({
    code: 'belowMinimumGain',
    frequencyHz: f.band.frequencyHz,
    message: `The band at ${f.band.frequencyHz} Hz shrank to ${Math.abs(f.band.gainDb).toFixed(2)} dB to keep the combined limits, under the ${minGainDb} dB minimum; it was left out.`,
  });
  return false;
}

/** Scales boosts down until the summed EQ adds no more than 0.1 dB at any no-boost point. */
function withoutBoostIntoNoBoost(model: BandModel, fitted: Fitted[], gainStepDb: number): Fitted[] {
  let current = fitted;
  for (let attempt = 0; attempt < 40; attempt++) {
    const total = model.totalDb(current.map((f) => f.band));
    let worst = 0;
    for (let i = 0; i < total.length; i++) if (model.data.noBoost[i]) worst = Math.max(worst, total[i]);
    if (worst <= 0.1) return current;
    current = current.map((f) =>
      f.band.gainDb > 0
        ? { ...f, band: { ...f.band, gainDb: truncateToStep(f.band.gainDb * 0.8, gainStepDb) } }
        : f,
    );
  }
  return current.filter((f) => f.band.gainDb <= 0);
}

/** Removes room bands that lower the residual by less than {@link MIN_BENEFIT_DB}: they would only fill a slot. */
function withoutIdleBands(model: BandModel, fitted: Fitted[], notUsed: NotUsed[]): Fitted[] {
  let current = fitted;
  for (;;) {
    const all = model.weightedRms(current.map((f) => f.band));
    const idle = current.find(
      (f) =>
        f.region === 'room' &&
        model.weightedRms(current.filter((g) => g !== f).map((g) => g.band)) - all < MIN_BENEFIT_DB,
    );
    if (!idle) return current;
    notUsed.push({
      code: 'littleBenefit',
      frequencyHz: idle.band.frequencyHz,
      message: `The band at ${idle.band.frequencyHz} Hz (${idle.band.gainDb} dB) lowered the residual by less than ${MIN_BENEFIT_DB} dB; it was left out.`,
    });
    current = current.filter((f) => f !== idle);
  }
}

/**
 * Removes, one at a time, the band of `region` whose removal helps most, while the residual on the model's
 * grid is worse than without the bands of that region (bands of the other region stay as they are).
 */
function notWorseThanNone(
  model: BandModel,
  fitted: Fitted[],
  notUsed: NotUsed[],
  region: Fitted['region'] | 'any',
): Fitted[] {
  const mine = (f: Fitted) => region === 'any' || f.region === region;
  const others = fitted.filter((f) => !mine(f));
  const rmsOf = (mine: Fitted[]) => model.weightedRms([...others, ...mine].map((f) => f.band));
  const none = rmsOf([]);
  let current = fitted.filter(mine);
  while (current.length > 0 && rmsOf(current) > none + 1e-9) {
    let best = 0;
    let bestRms = Infinity;
    current.forEach((_, k) => {
      const r = rmsOf(current.filter((__, j) => j !== k));
      if (r < bestRms) {
        bestRms = r;
        best = k;
      }
    });
    notUsed.push({
      code: 'madeResidualWorse',
      frequencyHz: current[best].band.frequencyHz,
      message: `The band at ${current[best].band.frequencyHz} Hz made the residual worse than no EQ once the limits were applied; it was left out.`,
    });
    current = current.filter((_, j) => j !== best);
  }
  return [...others, ...current];
}

/**
 * A new band for the largest weighted peak (cut), or a dip when boosts are allowed and the dip qualifies
 * (see fitParametricEq). Dips that do not qualify are marked in `skipped` and reported once.
 */
function initialBand(
  residual: Float64Array,
  data: FitData,
  skipped: Uint8Array,
  options: { cutBounds: BandBounds; boostBounds: BandBounds; minGainDb: number; notUsed: NotUsed[] },
): Fitted | null {
  const { cutBounds, boostBounds, minGainDb, notUsed } = options;
  const threshold = Math.max(MIN_FEATURE_DB, minGainDb);
  const inBounds = (f: number, b: BandBounds) => f >= b.fromHz && f <= b.toHz;
  let peak = -1;
  for (let i = 0; i < residual.length; i++) {
    if (skipped[i] === 2 || !inBounds(data.grid[i], cutBounds)) continue;
    if (peak < 0 || residual[i] * data.weight[i] > residual[peak] * data.weight[peak]) peak = i;
  }
  const peakWorth =
    peak >= 0 && cutBounds.minGainDb < 0 && residual[peak] >= threshold
      ? residual[peak] * data.weight[peak]
      : 0;

  let dip = -1;
  if (boostBounds.maxGainDb > 0) {
    for (let attempt = 0; attempt < 16; attempt++) {
      let candidate = -1;
      for (let i = 0; i < residual.length; i++) {
        if (data.noBoost[i] || skipped[i] || !inBounds(data.grid[i], boostBounds)) continue;
        if (candidate < 0 || residual[i] < residual[candidate]) candidate = i;
      }
      if (candidate < 0 || -residual[candidate] < threshold) break;
      const [lo, hi] = halfHeightRegion(residual, data.noBoost, candidate);
      const width = widthOctaves(data.grid, lo, hi);
      const touchesNoBoost =
        (lo > 0 && data.noBoost[lo - 1] === 1) || (hi < residual.length - 1 && data.noBoost[hi + 1] === 1);
      if (width < NARROW_DIP_OCTAVES || touchesNoBoost) {
        skipped.fill(1, lo, hi + 1);
        if (!touchesNoBoost) {
          notUsed.push({
            code: 'narrowDip',
            frequencyHz: round1(data.grid[candidate]),
            message: `A dip ${(-residual[candidate]).toFixed(1)} dB deep at ${round1(data.grid[candidate])} Hz is only ${width.toFixed(2)} octave wide at half depth; narrow dips are not boosted.`,
          });
        }
        continue;
      }
      dip = candidate;
      break;
    }
  }
  const dipWorth = dip >= 0 ? (-residual[dip] * data.weight[dip]) / BOOST_PREFERENCE : 0;
  if (peakWorth === 0 && dipWorth === 0) return null;
  const isCut = peakWorth >= dipWorth;
  const centre = isCut ? peak : dip;
  const bounds = isCut ? cutBounds : boostBounds;
  const height = residual[centre];
  const [lo, hi] = halfHeightRegion(residual, data.noBoost, centre);
  const ratio = Math.pow(2, widthOctaves(data.grid, lo, hi));
  const q = Math.sqrt(ratio) / (ratio - 1);
  return {
    band: {
      frequencyHz: data.grid[centre],
      gainDb: Math.min(bounds.maxGainDb, Math.max(bounds.minGainDb, -height)),
      q: Math.min(bounds.qMax, Math.max(bounds.qMin, q)),
    },
    bounds,
    feature: { feature: isCut ? 'peak' : 'dip', featureHz: data.grid[centre], aboveTargetDb: height },
    region: 'room',
  };
}

/** Indices around `centre` where the residual keeps its sign and exceeds half the centre's value. */
function halfHeightRegion(residual: Float64Array, stop: Uint8Array, centre: number): [number, number] {
  const height = residual[centre];
  const inside = (i: number) =>
    !stop[i] && Math.abs(residual[i]) > Math.abs(height) / 2 && Math.sign(residual[i]) === Math.sign(height);
  let lo = centre;
  while (lo > 0 && inside(lo - 1)) lo--;
  let hi = centre;
  while (hi < residual.length - 1 && inside(hi + 1)) hi++;
  return [lo, hi];
}

function widthOctaves(grid: readonly number[], lo: number, hi: number): number {
  return Math.log2(grid[hi] / grid[lo]) + 1 / GRID_POINTS_PER_OCTAVE;
}

interface BroadContext {
  fs: number;
  grid: number[];
  deviation: Float64Array;
  weight: Float64Array;
  fromHz: number;
  toHz: number;
  fitted: Fitted[];
  maxBands: number;
  maxBoostDb: number;
  maxCutDb: number;
  minGainDb: number;
  bandRange: { min: number; max: number };
  steps: BandSteps;
  notUsed: NotUsed[];
  warnings: EqFitWarning[];
}

/**
 * Broad, gentle bands above the transition on the ½-octave-smoothed residual (after the room bands),
 * each within its own Q and gain limits, within the remaining band budget; a band that does not lower the
 * smoothed residual is left out.
 */
function fitBroadBands(options: NonNullable<EqFitInput['aboveTransition']>, ctx: BroadContext): Fitted[] {
  const wanted = requireInteger(
    options.maxBands ?? EQ_FIT_DEFAULTS.aboveMaxBands,
    { min: 0, max: EQ_FIT_LIMITS.aboveMaxBands },
    'aboveTransition.maxBands',
    '/aboveTransition/maxBands',
  );
  const boost = Math.min(
    ctx.maxBoostDb,
    requireInRange(
      options.maxBoostDb ?? EQ_FIT_DEFAULTS.aboveMaxBoostDb,
      { min: 0, max: EQ_FIT_LIMITS.maxBoostDb, unit: 'dB' },
      'aboveTransition.maxBoostDb',
      '/aboveTransition/maxBoostDb',
    ),
  );
  const cut = Math.min(
    ctx.maxCutDb,
    requireInRange(
      options.maxCutDb ?? EQ_FIT_DEFAULTS.aboveMaxCutDb,
      { min: 0, max: EQ_FIT_LIMITS.maxCutDb, unit: 'dB' },
      'aboveTransition.maxCutDb',
      '/aboveTransition/maxCutDb',
    ),
  );
  const qMax = requireInRange(
    options.qMax ?? EQ_FIT_DEFAULTS.aboveQMax,
    { min: EQ_FIT_LIMITS.aboveQMin, max: EQ_FIT_LIMITS.aboveQMaxMax },
    'aboveTransition.qMax',
    '/aboveTransition/qMax',
  );
  if (options.toHz !== undefined) {
    requireInRange(
      options.toHz,
      { min: 1, max: ctx.fs / 2, unit: 'Hz' },
      'aboveTransition.toHz',
      '/aboveTransition/toHz',
    );
  }
  const budget = Math.min(wanted, ctx.maxBands - ctx.fitted.length);
  const first = ctx.grid.findIndex((f) => f >= ctx.fromHz);
  let last = -1;
  for (let i = ctx.grid.length - 1; i >= 0; i--)
    if (ctx.grid[i] <= ctx.toHz) {
      last = i;
      break;
    }
  if (budget <= 0 || first < 0 || last - first < GRID_POINTS_PER_OCTAVE / 2) {
    if (wanted > 0 && budget <= 0) {
      ctx.notUsed.push({
        code: 'bandBudget',
        frequencyHz: null,
        message: `No band was left for broad corrections above ${round1(ctx.fromHz)} Hz: all ${ctx.maxBands} bands are in use below the transition.`,
      });
    }
    return ctx.fitted;
  }
  const grid = ctx.grid.slice(first, last + 1);
  const smoothed = fractionalOctaveMean(ctx.grid, ctx.deviation, ABOVE_SMOOTHING_OCTAVES, grid);
  const fs = ctx.fs;
  const lowBands = ctx.fitted.map((f) => f.band);
  const baseDb = sosMagnitudeDb(
    lowBands.map((b) => designBiquad({ type: 'peaking', ...b }, fs)),
    unitCircle(grid, fs),
  );
  const data: FitData = {
    grid,
    errorDb: smoothed,
    weight: ctx.weight.slice(first, last + 1),
    noBoost: new Uint8Array(grid.length),
    guard: new Uint8Array(grid.length),
    baseDb,
    maxBoostDb: ctx.maxBoostDb,
    maxCutDb: ctx.maxCutDb,
    freeLevel: false,
  };
  const model = new BandModel(data, fs);
  const limits = {
    fromHz: Math.max(ctx.fromHz, ctx.bandRange.min),
    toHz: Math.min(ctx.toHz, ctx.bandRange.max),
    qMin: EQ_FIT_LIMITS.aboveQMin,
    qMax,
    steps: ctx.steps,
  };
  if (!(limits.toHz > limits.fromHz)) return ctx.fitted;
  const cutBounds: BandBounds = { ...limits, minGainDb: -cut, maxGainDb: 0 };
  const boostBounds: BandBounds = { ...limits, minGainDb: 0, maxGainDb: boost };
  let broad: Fitted[] = [];
  const skipped = new Uint8Array(grid.length);
  for (let k = 0; k < budget; k++) {
    const residual = model.residualDb(broad.map((f) => f.band));
    const start = initialBand(residual, data, skipped, {
      cutBounds,
      boostBounds,
      minGainDb: ctx.minGainDb,
      notUsed: [],
    });
    if (!start) break;
    start.region = 'broad';
    start.feature = {
      ...start.feature,
      feature: start.feature.feature === 'peak' ? 'broadExcess' : 'broadDeficit',
    };
    broad = [...broad, start];
    const refined = model.refine(
      broad.map((f) => f.band),
      broad.map((f) => f.bounds),
      30,
    );
    broad = broad.map((f, i) => ({ ...f, band: refined[i] }));
  }
  // A broad band may not crowd or oppose a room band, nor make the smoothed trend worse.
  const all = disciplined(
    [...ctx.fitted, ...broad],
    ctx.maxCutDb,
    ctx.maxBoostDb,
    ctx.minGainDb,
    ctx.notUsed,
    false,
  ).kept;
  return notWorseThanNone(model, all, ctx.notUsed, 'broad');
}

/** With no broad corrections asked for, says how far the smoothed response strays above the transition. */
function reportAboveTransition(
  grid: number[],
  deviation: Float64Array,
  fromHz: number,
  toHz: number,
  notUsed: NotUsed[],
): void {
  const inside = grid.filter((f) => f > fromHz * Math.pow(2, 1 / 6) && f <= toHz);
  if (inside.length < GRID_POINTS_PER_OCTAVE / 2) return;
  const smoothed = fractionalOctaveMean(grid, deviation, ABOVE_SMOOTHING_OCTAVES, inside);
  let worst = 0;
  smoothed.forEach((v, i) => {
    if (Math.abs(v) > Math.abs(smoothed[worst])) worst = i;
  });
  if (Math.abs(smoothed[worst]) < MIN_FEATURE_DB) return;
  notUsed.push({
    code: 'aboveTransition',
    frequencyHz: round1(inside[worst]),
    message: `Above the ${round1(fromHz)} Hz correction limit the ½-octave-smoothed response departs from the target by up to ${signed(smoothed[worst])} dB (at ${round1(inside[worst])} Hz); it was left alone. Ask for aboveTransition to allow a few broad, gentle bands there.`,
  });
}

/** With cuts only, names the deepest broad dip left (≥ 1 dB, not a null), which a boost could have lifted. */
function reportDipNotBoosted(model: BandModel, fitted: Fitted[], notUsed: NotUsed[]): void {
  const residual = model.residualDb(fitted.map((f) => f.band));
  let dip = -1;
  for (let i = 0; i < residual.length; i++) {
    if (model.data.noBoost[i] || model.data.guard[i]) continue;
    if (dip < 0 || residual[i] < residual[dip]) dip = i;
  }
  if (dip < 0 || residual[dip] > -MIN_FEATURE_DB) return;
  const [lo, hi] = halfHeightRegion(residual, model.data.noBoost, dip);
  if (widthOctaves(model.data.grid, lo, hi) < NARROW_DIP_OCTAVES) return;
  notUsed.push({
    code: 'boostsNotAllowed',
    frequencyHz: round1(model.data.grid[dip]),
    message: `A dip ${(-residual[dip]).toFixed(1)} dB below the target at ${round1(model.data.grid[dip])} Hz was left: boosts are not allowed (maxBoostDb 0).`,
  });
}

/** Reports the frequencies where the positions disagree by more than 3 dB (standard deviation), once per region. */
function reportDisagreement(
  grid: readonly number[],
  errorDb: Float64Array,
  spreadDb: Float64Array,
  notUsed: NotUsed[],
): void {
  let i = 0;
  while (i < spreadDb.length) {
    if (spreadDb[i] <= DISAGREEMENT_NO_BOOST_DB) {
      i++;
      continue;
    }
    let j = i;
    let worst = i;
    while (j + 1 < spreadDb.length && spreadDb[j + 1] > DISAGREEMENT_NO_BOOST_DB) {
      j++;
      if (spreadDb[j] > spreadDb[worst]) worst = j;
    }
    notUsed.push({
      code: 'positionsDisagree',
      frequencyHz: round1(grid[worst]),
      message: `From ${round1(grid[i])} to ${round1(grid[j])} Hz the microphone positions differ by up to ${spreadDb[worst].toFixed(1)} dB (standard deviation); nothing is boosted there and the fit weighs it less (average ${signed(errorDb[worst])} dB from the target at ${round1(grid[worst])} Hz).`,
    });
    i = j + 1;
  }
}

/**
 * The feature a room band corrects, read from the response before any EQ: its highest point (a cut) or
 * lowest (a boost) within the band's half-gain width. Bands move and merge while they are fitted, so the
 * feature that first placed a band may no longer be the one it sits on.
 */
function featureUnder(f: Fitted, grid: readonly number[], errorDb: ArrayLike<number>): Fitted {
  const half = Math.pow(2, bandwidthOctaves(f.band.q) / 2);
  const cut = f.band.gainDb < 0;
  // The turning point nearest the band's centre (a peak for a cut, a dip for a boost), else the extreme.
  const higher = (a: number, b: number) => (cut ? errorDb[a] > errorDb[b] : errorDb[a] < errorDb[b]);
  const apart = (i: number) => Math.abs(Math.log(grid[i] / f.band.frequencyHz));
  let best = -1;
  let turning = -1;
  for (let i = 0; i < grid.length; i++) {
    if (grid[i] < f.band.frequencyHz / half || grid[i] > f.band.frequencyHz * half) continue;
    if (best < 0 || higher(i, best)) best = i;
    const isTurning = i > 0 && i < grid.length - 1 && !higher(i - 1, i) && !higher(i + 1, i);
    if (isTurning && (turning < 0 || apart(i) < apart(turning))) turning = i;
  }
  if (turning >= 0) best = turning;
  if (best < 0) return f;
  return {
    ...f,
    feature: { feature: cut ? 'peak' : 'dip', featureHz: grid[best], aboveTargetDb: errorDb[best] },
  };
}

function explain(f: Fitted): BandExplanation {
  const { band, feature } = f;
  const where = `${round1(feature.featureHz)} Hz`;
  const by = `${Math.abs(feature.aboveTargetDb).toFixed(1)} dB ${feature.aboveTargetDb >= 0 ? 'above' : 'below'} the target`;
  const message =
    feature.feature === 'peak'
      ? `Cuts a peak at ${where}, ${by}.`
      : feature.feature === 'dip'
        ? `Lifts a broad dip at ${where}, ${by}.`
        : feature.feature === 'broadExcess'
          ? `Gently lowers a broad excess around ${where} (½-octave smoothed), ${by}.`
          : `Gently lifts a broad shortfall around ${where} (½-octave smoothed), ${by}.`;
  return {
    frequencyHz: band.frequencyHz,
    gainDb: band.gainDb,
    q: band.q,
    feature: feature.feature,
    featureHz: round1(feature.featureHz),
    aboveTargetDb: Math.round(feature.aboveTargetDb * 100) / 100,
    message,
  };
}

/** RMS departure from the target per IEC 61260-1 octave band lying wholly inside the grid, before and after. */
function octaveResiduals(
  grid: number[],
  deviation: Float64Array,
  eqDb: Float64Array,
  levelBefore: number,
  levelAfter: number,
): OctaveResidual[] {
  if (grid.length < 2) return [];
  return bandsBetween(grid[0], grid[grid.length - 1], 1)
    .filter((band) => band.lowerHz >= grid[0] * 0.999 && band.upperHz <= grid[grid.length - 1] * 1.001)
    .map((band) => {
      let before = 0;
      let after = 0;
      let count = 0;
      for (let i = 0; i < grid.length; i++) {
        if (grid[i] < band.lowerHz || grid[i] >= band.upperHz) continue;
        before += (deviation[i] - levelBefore) ** 2;
        after += (deviation[i] + eqDb[i] - levelAfter) ** 2;
        count++;
      }
      return {
        centreHz: nominalOctaveCentreHz(band.index),
        beforeDb: Math.round(Math.sqrt(before / count) * 100) / 100,
        afterDb: Math.round(Math.sqrt(after / count) * 100) / 100,
      };
    })
    .filter((band) => Number.isFinite(band.beforeDb));
}

/**
 * Power average of the positions on the grid, `10·log10(mean 10^(L/10))` [practice], and the standard
 * deviation of their levels in dB at each frequency (0 for one position).
 */
function spatialAverage(onGrid: number[][]): { averageDb: number[]; spreadDb: Float64Array } {
  const n = onGrid.length;
  const points = onGrid[0].length;
  const averageDb: number[] = [];
  const spreadDb = new Float64Array(points);
  for (let i = 0; i < points; i++) {
    let power = 0;
    let mean = 0;
    for (let k = 0; k < n; k++) {
      power += Math.pow(10, onGrid[k][i] / 10);
      mean += onGrid[k][i];
    }
    mean /= n;
    let variance = 0;
    for (let k = 0; k < n; k++) variance += (onGrid[k][i] - mean) ** 2;
    averageDb.push(n === 1 ? onGrid[0][i] : 10 * Math.log10(power / n));
    spreadDb[i] = n > 1 ? Math.sqrt(variance / (n - 1)) : 0;
  }
  return { averageDb, spreadDb };
}

/**
 * The level the target is placed at: the mean departure over the level reference band where the
 * measurement covers at least 1/3 octave of it; otherwise the median over the fit band outside nulls.
 */
function levelOf(
  input: EqFitInput,
  grid: number[],
  departure: number[],
  fitFirst: number,
  fitLast: number,
  warnings: EqFitWarning[],
): { offsetDb: number; fromHz: number; toHz: number; source: 'referenceBand' | 'fitBandMedian' } {
  const reference = input.levelReferenceHz ?? {
    fromHz: EQ_FIT_DEFAULTS.levelFromHz,
    toHz: EQ_FIT_DEFAULTS.levelToHz,
  };
  requireInRange(
    reference.fromHz,
    { min: 1, max: MAX_FREQUENCY_HZ, unit: 'Hz' },
    'levelReferenceHz.fromHz',
    '/levelReferenceHz/fromHz',
  );
  requireInRange(
    reference.toHz,
    { min: reference.fromHz, exclusiveMin: true, max: MAX_FREQUENCY_HZ, unit: 'Hz' },
    'levelReferenceHz.toHz',
    '/levelReferenceHz/toHz',
  );
  const inside: number[] = [];
  grid.forEach((f, i) => {
    if (f >= reference.fromHz && f <= reference.toHz) inside.push(departure[i]);
  });
  const first = Math.max(0, fitFirst);
  const last = fitLast >= first ? fitLast : grid.length - 1;
  const band = departure.slice(first, last + 1);
  const referenceMean = inside.length > 0 ? inside.reduce((s, v) => s + v, 0) / inside.length : NaN;
  // A subwoofer or another band-limited feed lies far below its own band over 500 Hz–2 kHz: that is not its level.
  const outOfBand = band.length > 0 && referenceMean < median(band) - OUT_OF_BAND_DB;
  if (inside.length >= GRID_POINTS_PER_OCTAVE / 3 && !outOfBand) {
    const from = Math.max(reference.fromHz, grid[0]);
    const to = Math.min(reference.toHz, grid[grid.length - 1]);
    return { offsetDb: referenceMean, fromHz: round1(from), toHz: round1(to), source: 'referenceBand' };
  }
  // Nulls would drag the median down; leave them out once they are found against a first guess.
  const guess = median(band);
  const nulls =
    band.length > 2
      ? findNulls(
          grid.slice(first, last + 1),
          band.map((d) => d - guess),
        )
      : [];
  const outside = band.filter((_, i) => !nulls.some((n) => i >= n.first && i <= n.last));
  warnings.push(
    outOfBand
      ? {
          code: 'levelReferenceOutOfBand',
          message: `The response lies ${(median(band) - referenceMean).toFixed(1)} dB lower over ${reference.fromHz}..${reference.toHz} Hz than in the fit band (a subwoofer or band-limited feed?), so the target was placed at the median level of the fit band instead (with cuts only, at the mean level of the corrected response). Give levelReferenceHz inside its band to choose.`,
        }
      : {
          code: 'levelReferenceNotMeasured',
          message: `The measurement does not cover the level reference band ${reference.fromHz}..${reference.toHz} Hz, so the target was placed at the median level of the fit band instead (with cuts only, at the mean level of the corrected response).`,
        },
  );
  return {
    offsetDb: median(outside.length > 0 ? outside : band),
    fromHz: round1(grid[first]),
    toHz: round1(grid[last]),
    source: 'fitBandMedian',
  };
}

/** The transition frequency: the caller's `toHz`, else 2000·√(T/V) of the room, else the assumed default. */
function transitionOf(input: EqFitInput, warnings: EqFitWarning[]): EqFitResult['transition'] {
  if (input.room) {
    const volume = requireInRange(
      input.room.volumeM3,
      { min: LIMITS.volumeM3.minimum, max: LIMITS.volumeM3.maximum, unit: 'm³' },
      'room.volumeM3',
      '/room/volumeM3',
    );
    const given = input.room.reverberationTimeS;
    const t = requireInRange(
      given ?? EQ_FIT_DEFAULTS.reverberationTimeS,
      { min: LIMITS.reverberationTimeS.minimum, max: LIMITS.reverberationTimeS.maximum, unit: 's' },
      'room.reverberationTimeS',
      '/room/reverberationTimeS',
    );
    if (given === undefined && input.toHz === undefined) {
      warnings.push({
        code: 'reverberationTimeAssumed',
        message: `No reverberation time was given; ${EQ_FIT_DEFAULTS.reverberationTimeS} s was assumed for the transition frequency. Give room.reverberationTimeS (a measured T20 or T30) for the room's own.`,
      });
    }
    const frequencyHz = Math.round(2000 * Math.sqrt(t / volume) * 10) / 10;
    return { frequencyHz, source: 'room', reverberationTimeS: t };
  }
  if (input.toHz !== undefined) return { frequencyHz: input.toHz, source: 'toHz', reverberationTimeS: null };
  warnings.push({
    code: 'transitionFrequencyAssumed',
    message: `No room was given, so the correction stops at ${EQ_FIT_DEFAULTS.transitionHz} Hz. Give room (volume and reverberation time) for its transition frequency, or toHz.`,
  });
  return { frequencyHz: EQ_FIT_DEFAULTS.transitionHz, source: 'assumed', reverberationTimeS: null };
}

function fitBand(
  input: EqFitInput,
  lowest: number,
  highest: number,
  transitionHz: number,
  warnings: EqFitWarning[],
): { fromHz: number; toHz: number } {
  const fromRequested = input.fromHz ?? Math.max(20, lowest);
  const toRequested = input.toHz ?? transitionHz;
  requireInRange(fromRequested, { min: 1, max: MAX_FREQUENCY_HZ, unit: 'Hz' }, 'fromHz', '/fromHz');
  // A transition at or below the low end (a crossover above it) leaves nothing to correct; not an error.
  requireInRange(
    input.toHz ?? Math.max(toRequested, fromRequested + 1),
    { min: fromRequested, exclusiveMin: true, max: MAX_FREQUENCY_HZ, unit: 'Hz' },
    'toHz',
    '/toHz',
  );
  if (
    input.fromHz !== undefined &&
    input.toHz !== undefined &&
    (input.fromHz >= highest || input.toHz <= lowest)
  ) {
    throw new CalculationInputError(
      `the fit band ${input.fromHz}..${input.toHz} Hz does not overlap the measurement (${lowest}..${round1(highest)} Hz)`,
      '/fromHz',
    );
  }
  const fromHz = Math.min(Math.max(fromRequested, lowest), highest);
  const toHz = Math.max(Math.min(toRequested, highest), fromHz);
  if (
    (input.fromHz !== undefined && fromHz !== fromRequested) ||
    (input.toHz !== undefined && toHz !== toRequested)
  ) {
    warnings.push({
      code: 'fitRangeClipped',
      message: `The fit band was narrowed to ${round1(fromHz)}..${round1(toHz)} Hz, the part of ${fromRequested}..${toRequested} Hz the measurement covers (at most 0.45 × the sample rate).`,
    });
  }
  return { fromHz, toHz };
}

/**
 * A band on the processor's grid: frequency and Q to the nearest step inside their ranges (inward at the
 * ends), gain truncated toward 0 dB to its step so no limit is crossed by rounding.
 */
function roundBand(band: Band, bounds: BandBounds): Band {
  const { steps } = bounds;
  const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
  // No step inside the range: the band cannot be set on this processor, so it gets no gain (and is dropped).
  let settable = true;
  const onGrid = (v: number, step: number, lo: number, hi: number) => {
    if (!(step > 0)) return clamp(v, lo, hi);
    const fix = (x: number) => Math.round(x * 1e9) / 1e9;
    const first = fix(Math.ceil(lo / step - 1e-9) * step);
    const last = fix(Math.floor(hi / step + 1e-9) * step);
    if (first > last) {
      settable = false;
      return clamp(v, lo, hi);
    }
    return clamp(fix(Math.round(v / step) * step), first, last);
  };
  let frequencyHz: number;
  if (steps.frequencyUnit === 'octave' && steps.frequencyHz > 0) {
    const octaves = onGrid(
      Math.log2(band.frequencyHz / 1000),
      steps.frequencyHz,
      Math.log2(bounds.fromHz / 1000),
      Math.log2(bounds.toHz / 1000),
    );
    frequencyHz = Math.round(1000 * Math.pow(2, octaves) * 1e6) / 1e6;
    frequencyHz = clamp(frequencyHz, bounds.fromHz, bounds.toHz);
  } else {
    frequencyHz = onGrid(band.frequencyHz, steps.frequencyHz, bounds.fromHz, bounds.toHz);
  }
  const q = onGrid(band.q, steps.q, bounds.qMin, bounds.qMax);
  const gainDb = clamp(truncateToStep(band.gainDb, steps.gainDb), bounds.minGainDb, bounds.maxGainDb);
  return { frequencyHz, gainDb: settable ? gainDb : 0, q };
}

function requireSteps(steps: EqFitInput['bandSteps']): BandSteps {
  const step = (value: number | undefined, fallback: number, max: number, name: string) =>
    requireInRange(value ?? fallback, { min: 0, max }, `bandSteps.${name}`, `/bandSteps/${name}`);
  return {
    frequencyHz: step(steps?.frequencyHz, 0.1, LIMITS['BandSteps.frequencyHz'].maximum, 'frequencyHz'),
    frequencyUnit: steps?.frequencyStepUnit === 'octave' ? 'octave' : 'hz',
    gainDb: step(steps?.gainDb, 0.01, LIMITS['BandSteps.gainDb'].maximum, 'gainDb'),
    q: step(steps?.q, 0.001, LIMITS['BandSteps.q'].maximum, 'q'),
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
  fitted: Fitted[],
  errorDb: Float64Array,
  eqDb: Float64Array,
  maxBands: number,
  combined: { maxBoostDb: number; maxCutDb: number },
  maxCutDb: number,
  maxBoostDb: number,
): EqFitWarning[] {
  const warnings: EqFitWarning[] = [];
  const cutAtLimit = fitted.length > 0 && combined.maxCutDb >= maxCutDb - 0.05;
  const boostAtLimit = maxBoostDb > 0 && combined.maxBoostDb >= maxBoostDb - 0.05;
  if (cutAtLimit || boostAtLimit) {
    warnings.push({
      code: 'gainLimitReached',
      message: `The bands together reach the ${cutAtLimit ? `cut limit (${maxCutDb} dB)` : ''}${cutAtLimit && boostAtLimit ? ' and the ' : ''}${boostAtLimit ? `boost limit (${maxBoostDb} dB)` : ''}; the response was not corrected further there.`,
    });
  }
  let remainingPeak = 0;
  for (let i = 0; i < errorDb.length; i++) remainingPeak = Math.max(remainingPeak, errorDb[i] + eqDb[i]);
  if (maxBands > 0 && fitted.length >= maxBands && remainingPeak >= REMAINING_PEAK_WARNING_DB) {
    warnings.push({
      code: 'bandLimitReached',
      message: `All ${maxBands} bands are used and a peak of ${remainingPeak.toFixed(1)} dB above the target remains.`,
    });
  }
  return warnings;
}

function requirePositions(input: EqFitInput, fs: number): Position[] {
  if (input.positions !== undefined) {
    if (input.measured !== undefined) {
      throw new CalculationInputError('give either measured or positions, not both', '/positions');
    }
    if (
      !Array.isArray(input.positions) ||
      input.positions.length < 1 ||
      input.positions.length > EQ_FIT_LIMITS.maxPositions
    ) {
      throw new CalculationInputError(
        `positions must list 1..${EQ_FIT_LIMITS.maxPositions} microphone positions`,
        '/positions',
      );
    }
    return input.positions.map((p, k) => ({
      label: p.label,
      ...requireMeasured(p.measured, fs, `/positions/${k}/measured`),
    }));
  }
  if (input.measured === undefined) {
    throw new CalculationInputError('give measured (one position) or positions (several)', '/measured');
  }
  return [{ label: 'measured', ...requireMeasured(input.measured, fs, '/measured') }];
}

function requireMeasured(
  measured: MeasuredResponse | undefined,
  fs: number,
  field: string,
): { frequenciesHz: number[]; magnitudeDb: number[] } {
  const { frequenciesHz, magnitudeDb } = measured ?? ({} as Partial<MeasuredResponse>);
  if (
    !Array.isArray(frequenciesHz) ||
    frequenciesHz.length < 2 ||
    frequenciesHz.length > EQ_FIT_LIMITS.maxPoints
  ) {
    throw new CalculationInputError(
      `${field.slice(1).replace(/\//g, '.')}.frequenciesHz must list 2..${EQ_FIT_LIMITS.maxPoints} frequencies`,
      `${field}/frequenciesHz`,
    );
  }
  if (!Array.isArray(magnitudeDb) || magnitudeDb.length !== frequenciesHz.length) {
    throw new CalculationInputError(
      `magnitudeDb must have one value per frequency (${frequenciesHz.length}); received ${Array.isArray(magnitudeDb) ? magnitudeDb.length : 'none'}`,
      `${field}/magnitudeDb`,
    );
  }
  frequenciesHz.forEach((f, i) => {
    requireInRange(
      f,
      { min: 0, exclusiveMin: true, max: fs / 2, exclusiveMax: true, unit: 'Hz' },
      'frequency',
      `${field}/frequenciesHz/${i}`,
    );
    if (i > 0 && f <= frequenciesHz[i - 1]) {
      throw new CalculationInputError(
        `frequencies must ascend; ${f} Hz follows ${frequenciesHz[i - 1]} Hz`,
        `${field}/frequenciesHz/${i}`,
      );
    }
  });
  magnitudeDb.forEach((db, i) =>
    requireInRange(
      db,
      { min: LIMITS['magnitudeDb[]'].minimum, max: LIMITS['magnitudeDb[]'].maximum, unit: 'dB' },
      'magnitude',
      `${field}/magnitudeDb/${i}`,
    ),
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

function requireBandRange(
  range: EqFitInput['bandFrequencyRangeHz'],
  fs: number,
): { min: number; max: number } {
  if (!range) return { min: 0, max: fs / 2 };
  const min = requireInRange(
    range.fromHz,
    { min: 1, max: MAX_FREQUENCY_HZ, unit: 'Hz' },
    'bandFrequencyRangeHz.fromHz',
    '/bandFrequencyRangeHz/fromHz',
  );
  const max = requireInRange(
    range.toHz,
    { min, exclusiveMin: true, max: MAX_FREQUENCY_HZ, unit: 'Hz' },
    'bandFrequencyRangeHz.toHz',
    '/bandFrequencyRangeHz/toHz',
  );
  return { min, max };
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
  if (spacings.length === 0) return qRange.max;
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
  return values.length > 0 ? Math.sqrt(s / values.length) : 0;
};
const round1 = (v: number): number => Math.round(v * 10) / 10;
const signed = (v: number): string => `${v >= 0 ? '+' : '−'}${Math.abs(v).toFixed(1)}`;
