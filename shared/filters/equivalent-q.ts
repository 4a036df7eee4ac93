import type { FilterSpec } from './biquad-design';

/**
 * The Q of a filter however it was given (q, bandwidth in octaves, or shelf slope), from the Audio EQ
 * Cookbook's definitions of alpha (W3C Note, 2021): `alpha = sin(w0)/(2Q)`, so
 * - bandwidth: `1/Q = 2·sinh(ln2/2 · BW · w0/sin(w0))` (digital bandwidth, depends on the sample rate);
 * - shelf slope: `1/Q = sqrt((A + 1/A)(1/S − 1) + 2)`, A = 10^(gain/40);
 * - none given: Q = 1/√2 (S = 1 for shelves gives the same).
 * A processor that takes Q for every filter needs this to be told the same filter.
 */
export function equivalentQ(spec: FilterSpec, sampleRateHz: number): number {
  if (spec.q !== undefined) return spec.q;
  if (spec.bandwidthOctaves !== undefined) {
    const w0 = (2 * Math.PI * spec.frequencyHz) / sampleRateHz;
    return 1 / (2 * Math.sinh(((Math.LN2 / 2) * spec.bandwidthOctaves * w0) / Math.sin(w0)));
  }
  if (spec.shelfSlope !== undefined) {
    const A = Math.pow(10, (spec.gainDb ?? 0) / 40);
    return 1 / Math.sqrt((A + 1 / A) * (1 / spec.shelfSlope - 1) + 2);
  }
  return Math.SQRT1_2;
}
