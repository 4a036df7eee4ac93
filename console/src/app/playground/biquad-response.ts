/** One normalised second-order section, a0 = 1: H(z) = (b0 + b1 z⁻¹ + b2 z⁻²) / (1 + a1 z⁻¹ + a2 z⁻²). */
export interface Section {
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
}

/** A complex number as [real, imaginary]. */
export type Complex = [number, number];

/** The floor used for a true zero of the magnitude (a notch at its centre), in dB. */
export const MAGNITUDE_FLOOR_DB = -300;

function multiply([a, b]: Complex, [c, d]: Complex): Complex {
  return [a * c - b * d, a * d + b * c];
}

function divide([a, b]: Complex, [c, d]: Complex): Complex {
  const denominator = c * c + d * d;
  return [(a * c + b * d) / denominator, (b * c - a * d) / denominator];
}

/**
 * Complex response of a cascade at one frequency, evaluated on the unit circle at z = e^(jω) with
 * ω = 2π·f/fs (the bilinear-transform designs of the RBJ Audio EQ Cookbook are defined this way).
 */
export function cascadeAt(sections: readonly Section[], frequencyHz: number, sampleRateHz: number): Complex {
  const w = (2 * Math.PI * frequencyHz) / sampleRateHz;
  const z1: Complex = [Math.cos(w), -Math.sin(w)];
  const z2: Complex = [Math.cos(2 * w), -Math.sin(2 * w)];
  let total: Complex = [1, 0];
  for (const s of sections) {
    const numerator: Complex = [s.b0 + s.b1 * z1[0] + s.b2 * z2[0], s.b1 * z1[1] + s.b2 * z2[1]];
    const denominator: Complex = [1 + s.a1 * z1[0] + s.a2 * z2[0], s.a1 * z1[1] + s.a2 * z2[1]];
    total = multiply(total, divide(numerator, denominator));
  }
  return total;
}

/** Magnitude in dB of a complex response, floored at −300 dB. */
export function magnitudeDb([re, im]: Complex): number {
  const magnitude = Math.hypot(re, im);
  return magnitude > 0 ? Math.max(MAGNITUDE_FLOOR_DB, 20 * Math.log10(magnitude)) : MAGNITUDE_FLOOR_DB;
}

/** Phase in degrees wrapped to (−180, 180]. */
export function phaseDeg([re, im]: Complex): number {
  const degrees = (Math.atan2(im, re) * 180) / Math.PI;
  return degrees === -180 ? 180 : degrees;
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
