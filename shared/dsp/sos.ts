import { CalculationInputError } from '../errors';

/**
 * One normalised second-order section (a0 = 1), the core's one section type:
 * `H(z) = (b0 + b1·z⁻¹ + b2·z⁻²) / (1 + a1·z⁻¹ + a2·z⁻²)`. A first-order section has b2 = a2 = 0.
 * `type` names the design it came from (`peaking`, `lowPass`, ...) when there is one. A cascade is an
 * array of sections applied in order, as scipy.signal's `sos` arrays are.
 */
export interface Sos {
  type?: string;
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
}

const COEFFICIENTS = ['b0', 'b1', 'b2', 'a1', 'a2'] as const;

/** Whether a value carries the five finite coefficients of a section (for reading JSON of unknown shape). */
export function isSos(value: unknown): value is Sos {
  if (typeof value !== 'object' || value === null) return false;
  const record = value as Record<string, unknown>;
  return COEFFICIENTS.every((key) => typeof record[key] === 'number' && Number.isFinite(record[key]));
}

/**
 * True when both poles of the section lie strictly inside the unit circle, by the second-order
 * stability triangle |a2| < 1 and |a1| < 1 + a2 (Jury's criterion; a first-order section, a2 = 0,
 * reduces to |a1| < 1).
 */
export function isStable(section: Sos): boolean {
  const { a1, a2 } = section;
  return Number.isFinite(a1) && Number.isFinite(a2) && Math.abs(a2) < 1 && Math.abs(a1) < 1 + a2;
}

/** Throws naming `/sections/i/<coefficient>` unless every coefficient is finite. */
export function requireFiniteSos(sections: readonly Sos[]): void {
  sections.forEach((s, i) => {
    for (const key of COEFFICIENTS) {
      if (!Number.isFinite(s[key])) {
        throw new CalculationInputError(
          `${key} must be a finite number; received ${String(s[key])}`,
          `/sections/${i}/${key}`,
        );
      }
    }
  });
}
