/**
 * Helpers for finding and sampling filter sections in API answers. The response itself is evaluated by
 * the shared calculation core (`shared/filters/response.ts`), the same code the API uses.
 */

/** One normalised second-order section, a0 = 1: H(z) = (b0 + b1 z⁻¹ + b2 z⁻²) / (1 + a1 z⁻¹ + a2 z⁻²). */
export interface Section {
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
}

/**
 * Log-spaced frequencies from `fromHz` to `toHz` inclusive with `pointsPerOctave` steps per octave.
 * The last point is `toHz` exactly.
 */
export function logFrequencies(fromHz: number, toHz: number, pointsPerOctave = 24): number[] {
  if (!(fromHz > 0) || !(toHz > fromHz)) return [];
  const steps = Math.ceil(Math.log2(toHz / fromHz) * pointsPerOctave);
  return Array.from({ length: steps + 1 }, (_, i) =>
    i === steps ? toHz : fromHz * 2 ** (i / pointsPerOctave),
  );
}

/** Whether a value has the five numeric coefficients of a normalised section. */
export function isSection(value: unknown): value is Section {
  if (typeof value !== 'object' || value === null) return false;
  const record = value as Record<string, unknown>;
  return ['b0', 'b1', 'b2', 'a1', 'a2'].every(
    (key) => typeof record[key] === 'number' && Number.isFinite(record[key]),
  );
}
