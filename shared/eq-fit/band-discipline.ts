import { logFrequencyGrid } from '../dsp/grid';
import { sosMagnitudeDb, unitCircle } from '../dsp/response';
import { designBiquad } from '../filters/biquad-design';
import type { Band } from './band-model';

/** No two bands closer than this, octaves: closer ones do one job and are merged [product choice]. */
export const MIN_BAND_SPACING_OCTAVES = 1 / 6;

/**
 * Width of a peaking band in octaves between its half-gain (in dB) points, from its Q: the analogue
 * relation `1/Q = 2·sinh((ln 2 / 2)·BW)` of the Audio EQ Cookbook (W3C Note, 2021), inverted.
 */
export function bandwidthOctaves(q: number): number {
  return (2 / Math.LN2) * Math.asinh(1 / (2 * q));
}

/** Distance between two band centres, octaves. */
export function octavesApart(a: Band, b: Band): number {
  return Math.abs(Math.log2(a.frequencyHz / b.frequencyHz));
}

/**
 * Two bands overlap when their centres are closer than the mean of their widths (each between its
 * half-gain points): each then reaches into the other's half-gain region.
 */
export function bandsOverlap(a: Band, b: Band): boolean {
  return octavesApart(a, b) < (bandwidthOctaves(a.q) + bandwidthOctaves(b.q)) / 2;
}

/** The frequencies the combined limit is checked at: 1/96 octave from 10 Hz to just below Nyquist, plus every band centre. */
export function limitGrid(sampleRateHz: number, bands: readonly Band[]): number[] {
  const top = Math.min(24000, 0.499 * sampleRateHz);
  return [...logFrequencyGrid(10, top, 96, 'ends'), ...bands.map((b) => b.frequencyHz)].sort((a, b) => a - b);
}

/** Largest boost and largest cut (both ≥ 0) of the summed bands at the given frequencies, dB. */
export function combinedExtremes(
  bands: readonly Band[],
  sampleRateHz: number,
  frequenciesHz: readonly number[] = limitGrid(sampleRateHz, bands),
): { maxBoostDb: number; maxCutDb: number } {
  if (bands.length === 0) return { maxBoostDb: 0, maxCutDb: 0 };
  const total = sosMagnitudeDb(
    bands.map((b) => designBiquad({ type: 'peaking', ...b }, sampleRateHz)),
    unitCircle([...frequenciesHz], sampleRateHz),
  );
  let maxBoostDb = 0;
  let maxCutDb = 0;
  for (const v of total) {
    if (v > maxBoostDb) maxBoostDb = v;
    if (-v > maxCutDb) maxCutDb = -v;
  }
  return { maxBoostDb, maxCutDb };
}

/**
 * Scales the boosts (or the cuts) down together until the summed response stays within the limits at
 * every frequency of {@link limitGrid}. Gains are truncated toward 0 dB to the gain step, so rounding never
 * pushes a band back past a limit. Returns new bands; those scaled are listed in `scaled`.
 */
export function withinCombinedLimits(
  bands: readonly Band[],
  sampleRateHz: number,
  maxBoostDb: number,
  maxCutDb: number,
  gainStepDb = 0.01,
): { bands: Band[]; scaled: boolean } {
  let current = bands.map((b) => ({ ...b }));
  let scaled = false;
  const grid = limitGrid(sampleRateHz, bands);
  for (let attempt = 0; attempt < 60; attempt++) {
    const { maxBoostDb: boost, maxCutDb: cut } = combinedExtremes(current, sampleRateHz, grid);
    const boostOver = boost > maxBoostDb + 1e-9;
    const cutOver = cut > maxCutDb + 1e-9;
    if (!boostOver && !cutOver) return { bands: current, scaled };
    scaled = true;
    // Same-sign bands only add up where they overlap, so the ratio is a first guess; repeat until it holds.
    const boostFactor = boostOver ? (maxBoostDb / boost) * 0.999 : 1;
    const cutFactor = cutOver ? (maxCutDb / cut) * 0.999 : 1;
    current = current.map((b) => ({
      ...b,
      gainDb: truncateToStep(b.gainDb * (b.gainDb > 0 ? boostFactor : cutFactor), gainStepDb),
    }));
  }
  // Not reached in practice: the factors shrink every offending band each time.
  return { bands: current.map((b) => ({ ...b, gainDb: 0 })), scaled: true };
}

/** A gain truncated toward 0 dB to a multiple of the step (a step of 0: unchanged). */
export function truncateToStep(gainDb: number, stepDb: number): number {
  if (!(stepDb > 0)) return gainDb;
  const steps = Math.trunc(gainDb / stepDb + Math.sign(gainDb) * 1e-9);
  return Math.round(steps * stepDb * 1e9) / 1e9;
}
