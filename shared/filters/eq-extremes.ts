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

const round2 = (value: number): number => Math.round(value * 100) / 100;

/**
 * The boost caution of an EQ, or null when its designed response never rises above 0 dB: the largest
 * boost of the bands together (eqExtremes) and where, not the gain of the largest single band (a +9 dB
 * shelf under a +12 dB peak boosts more than 12 dB). `subject` names what boosts ("This EQ",
 * "M+030's EQ").
 */
export function eqBoostCaution(
  filters: readonly FilterSpec[],
  sampleRateHz: number,
  subject = 'This EQ',
): { code: 'eqBoost'; message: string } | null {
  const { maxBoostDb, maxBoostHz } = eqExtremes(filters, sampleRateHz);
  if (maxBoostDb <= 0 || maxBoostHz === null) return null;
  return {
    code: 'eqBoost',
    message:
      `${subject} boosts by up to ${round2(maxBoostDb)} dB at ${round2(maxBoostHz)} Hz (its bands together, as designed). ` +
      'Boosts, especially at low frequencies, can overdrive amplifiers and drivers; prefer cuts and check headroom.',
  };
}
