import { presentDb, presentHz } from '../present';
import { logFrequencyGrid } from '../dsp/grid';
import { EXTREMES_EQUAL_DB, sosMagnitudeExtremes, unitCircle, type UnitCircle } from '../dsp/response';
import { designBiquads, type FilterSpec } from './biquad-design';

/** Grid density for finding the largest boost and cut: 1/48 octave, plus every filter's own frequency. */
const POINTS_PER_OCTAVE = 48;
const LOWEST_HZ = 10;

export interface EqExtremes {
  /** Largest gain of the summed response, dB (0 when it never rises above 0 dB), and where. */
  maxBoostDb: number;
  maxBoostHz: number | null;
  /** Largest attenuation of the summed response as a positive number, dB, and where. */
  maxCutDb: number;
  maxCutHz: number | null;
}

/**
 * The 1/48-octave grid from 10 Hz to just below Nyquist and its points on the unit circle, worked out once
 * per sample rate: it depends on nothing else, and building it (≈540 points, four sines and cosines each)
 * cost more than evaluating a few filters on it. Bounded: a caller cycling through many sample rates
 * starts the cache afresh.
 */
const GRIDS = new Map<number, UnitCircle>();
const MAX_CACHED_GRIDS = 16;

function extremesGrid(sampleRateHz: number): UnitCircle {
  let grid = GRIDS.get(sampleRateHz);
  if (grid === undefined) {
    if (GRIDS.size >= MAX_CACHED_GRIDS) GRIDS.clear();
    const nyquist = sampleRateHz / 2;
    grid = unitCircle(logFrequencyGrid(LOWEST_HZ, nyquist * 0.999, POINTS_PER_OCTAVE), sampleRateHz);
    GRIDS.set(sampleRateHz, grid);
  }
  return grid;
}

/**
 * The largest boost and the largest cut of an EQ as designed: the magnitude of the cascade of all its
 * filters (a resonant high-pass boosts too; a notch next to a peak lowers it), evaluated on a 1/48-octave grid from 10 Hz to Nyquist and at each filter's own frequency. Bands
 * that overlap add up: a +9 dB low shelf and a +12 dB peak together boost more than either.
 * Accuracy: the grid can miss the top of a peak that is narrower than 1/48 octave between two points
 * only when it is not at a filter's frequency; the summed maximum of overlapping bands lies between them.
 * Of extremes equal within rounding (a plateau: a shelf's flat side) the lowest frequency is named; a
 * boost or cut an answer would show as 0 dB counts as none. The grid is shared per sample rate and only the
 * extremes are turned into dB (sosMagnitudeExtremes), so this costs a few microseconds per filter.
 */
export function eqExtremes(filters: readonly FilterSpec[], sampleRateHz: number): EqExtremes {
  if (filters.length === 0) return { maxBoostDb: 0, maxBoostHz: null, maxCutDb: 0, maxCutHz: null };
  const nyquist = sampleRateHz / 2;
  const sections = designBiquads([...filters], sampleRateHz);
  const grid = extremesGrid(sampleRateHz);
  const own = filters
    .map((f) => f.frequencyHz)
    .filter((f) => f < nyquist)
    .sort((a, b) => a - b);
  const onGrid = sosMagnitudeExtremes(sections, grid);
  const atOwn = sosMagnitudeExtremes(sections, unitCircle(own, sampleRateHz));
  // The grid is never empty; a filter's own frequency wins when higher, or equal and lower in frequency.
  const ownFirst = (ownDb: number, gridDb: number, ownHz: number, gridHz: number, sign: 1 | -1) =>
    sign * (ownDb - gridDb) > EXTREMES_EQUAL_DB ||
    (Math.abs(ownDb - gridDb) <= EXTREMES_EQUAL_DB && ownHz < gridHz);
  const gridHz = grid.frequenciesHz;
  const [maxDb, maxHz] =
    atOwn.maxIndex >= 0 &&
    ownFirst(atOwn.maxDb, onGrid.maxDb, own[atOwn.maxIndex], gridHz[onGrid.maxIndex], 1)
      ? [atOwn.maxDb, own[atOwn.maxIndex]]
      : [onGrid.maxDb, gridHz[onGrid.maxIndex]];
  const [minDb, minHz] =
    atOwn.minIndex >= 0 &&
    ownFirst(atOwn.minDb, onGrid.minDb, own[atOwn.minIndex], gridHz[onGrid.minIndex], -1)
      ? [atOwn.minDb, own[atOwn.minIndex]]
      : [onGrid.minDb, gridHz[onGrid.minIndex]];
  // What an answer would show as 0 dB (an all-pass, whose 0 dB the arithmetic rounds to ±1e-11) is
  // neither a boost nor a cut: it would otherwise be named "a boost of +0 dB".
  const boosts = presentDb(maxDb) > 0;
  const cuts = presentDb(minDb) < 0;
  return {
    maxBoostDb: boosts ? maxDb : 0,
    maxBoostHz: boosts ? maxHz : null,
    maxCutDb: cuts ? -minDb : 0,
    maxCutHz: cuts ? minHz : null,
  };
}

/** One output whose boosts a caution names: its EQ (as designed) and, for stored tunings, its trim. */
export interface BoostSource {
  /** The channel's label; absent for a lone EQ (`POST /v1/biquads`, `POST /v1/eq/fit`). */
  channel?: string;
  filters: readonly FilterSpec[];
  trimDb?: number;
}

/**
 * The one boost caution of every answer (biquads, EQ fits, plans, tunings, exports), or null when
 * nothing boosts: per output the largest boost of its EQ bands together as designed (eqExtremes) and
 * where, not the gain of the largest single band (a +9 dB shelf at 30 Hz under a +12 dB peak at 40 Hz
 * boosts 14.35 dB at 39.7 Hz), and a positive trim. `forExport`: the settings are about to reach a
 * processor.
 */
export function eqBoostCaution(
  sources: readonly BoostSource[],
  sampleRateHz: number,
  forExport = false,
): { code: 'eqBoost'; message: string } | null {
  const parts = sources.flatMap((source) => {
    const { maxBoostDb, maxBoostHz } = eqExtremes(source.filters, sampleRateHz);
    const figures = [
      ...(maxBoostDb > 0 && maxBoostHz !== null
        ? [`EQ +${presentDb(maxBoostDb)} dB at ${presentHz(maxBoostHz)} Hz`]
        : []),
      ...(source.trimDb !== undefined && source.trimDb > 0 ? [`trim +${presentDb(source.trimDb)} dB`] : []),
    ];
    if (figures.length === 0) return [];
    return [source.channel === undefined ? figures.join(', ') : `${source.channel} (${figures.join(', ')})`];
  });
  if (parts.length === 0) return null;
  return {
    code: 'eqBoost',
    message:
      (forExport ? 'Loading these settings puts boosts into the processor: ' : 'Boosts: ') +
      `${parts.join('; ')} (EQ figures are the bands together, as designed). ` +
      'Boosts, especially at low frequencies, can overdrive amplifiers and drivers: check headroom, prefer cuts, and raise the level with the system turned down.',
  };
}
