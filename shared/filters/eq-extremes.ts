import { presentDb, presentHz } from '../present';
import { logFrequencyGrid } from '../dsp/grid';
import { sosMagnitudeDb, unitCircle } from '../dsp/response';
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
 * The largest boost and the largest cut of an EQ as designed: the magnitude of the cascade of all its
 * filters (a resonant high-pass boosts too; a notch next to a peak lowers it), evaluated on a 1/48-octave grid from 10 Hz to Nyquist and at each filter's own frequency. Bands
 * that overlap add up: a +9 dB low shelf and a +12 dB peak together boost more than either.
 * Accuracy: the grid can miss the top of a peak that is narrower than 1/48 octave between two points
 * only when it is not at a filter's frequency; the summed maximum of overlapping bands lies between them.
 */
export function eqExtremes(filters: readonly FilterSpec[], sampleRateHz: number): EqExtremes {
  if (filters.length === 0) return { maxBoostDb: 0, maxBoostHz: null, maxCutDb: 0, maxCutHz: null };
  const nyquist = sampleRateHz / 2;
  const grid = [
    ...logFrequencyGrid(LOWEST_HZ, nyquist * 0.999, POINTS_PER_OCTAVE),
    ...filters.map((f) => f.frequencyHz).filter((f) => f < nyquist),
  ].sort((a, b) => a - b);
  const sections = designBiquads([...filters], sampleRateHz);
  const db = sosMagnitudeDb(sections, unitCircle(grid, sampleRateHz));
  let hi = 0;
  let lo = 0;
  for (let i = 1; i < db.length; i++) {
    if (db[i] > db[hi]) hi = i;
    if (db[i] < db[lo]) lo = i;
  }
  return {
    maxBoostDb: Math.max(0, db[hi]),
    maxBoostHz: db[hi] > 0 ? grid[hi] : null,
    maxCutDb: Math.max(0, -db[lo]),
    maxCutHz: db[lo] < 0 ? grid[lo] : null,
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
