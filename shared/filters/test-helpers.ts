/**
 * Helpers for the calculation tests: a float comparison with a stated tolerance, and a direct
 * frequency-response evaluator written independently of dsp/response.ts (it evaluates each section's
 * polynomials with Math.cos/Math.sin at each frequency and multiplies the complex values in the
 * textbook way; only the data types are shared).
 */
import type { Complex } from '../dsp/complex';
import type { Sos } from '../dsp/sos';
import { CalculationInputError } from '../errors';

/** Fails with a readable message unless |actual − expected| ≤ tolerance. */
export function expectWithin(actual: number, expected: number, tolerance: number, what = 'value'): void {
  if (!Number.isFinite(actual) || !(Math.abs(actual - expected) <= tolerance)) {
    throw new Error(
      `${what}: expected ${expected} ± ${tolerance}, received ${actual} (off by ${actual - expected})`,
    );
  }
}

/** H(e^(jω)) of a cascade, evaluated directly. */
export function referenceResponse(sections: Sos[], frequencyHz: number, sampleRateHz: number): Complex {
  const w = (2 * Math.PI * frequencyHz) / sampleRateHz;
  let re = 1;
  let im = 0;
  for (const s of sections) {
    const nRe = s.b0 + s.b1 * Math.cos(w) + s.b2 * Math.cos(2 * w);
    const nIm = -s.b1 * Math.sin(w) - s.b2 * Math.sin(2 * w);
    const dRe = 1 + s.a1 * Math.cos(w) + s.a2 * Math.cos(2 * w);
    const dIm = -s.a1 * Math.sin(w) - s.a2 * Math.sin(2 * w);
    const d = dRe * dRe + dIm * dIm;
    const hRe = (nRe * dRe + nIm * dIm) / d;
    const hIm = (nIm * dRe - nRe * dIm) / d;
    [re, im] = [re * hRe - im * hIm, re * hIm + im * hRe];
  }
  return { re, im };
}

export function referenceDb(sections: Sos[], frequencyHz: number, sampleRateHz: number): number {
  const h = referenceResponse(sections, frequencyHz, sampleRateHz);
  return 20 * Math.log10(Math.hypot(h.re, h.im));
}

/** Poles of 1 + a1 z^-1 + a2 z^-2 as complex numbers, by the quadratic formula. */
export function polesOf(section: Sos): Complex[] {
  const { a1, a2 } = section;
  const disc = a1 * a1 - 4 * a2;
  if (disc >= 0) {
    return [
      { re: (-a1 + Math.sqrt(disc)) / 2, im: 0 },
      { re: (-a1 - Math.sqrt(disc)) / 2, im: 0 },
    ];
  }
  return [
    { re: -a1 / 2, im: Math.sqrt(-disc) / 2 },
    { re: -a1 / 2, im: -Math.sqrt(-disc) / 2 },
  ];
}

/** Log-spaced frequencies from fromHz up to (not above) toHz, `perOctave` per octave. */
export function logSweep(fromHz: number, toHz: number, perOctave: number): number[] {
  const out: number[] = [];
  for (let k = 0; fromHz * Math.pow(2, k / perOctave) <= toHz; k++)
    out.push(fromHz * Math.pow(2, k / perOctave));
  return out;
}

/** Runs fn and returns the CalculationInputError it throws; fails when it throws nothing or something else. */
export function catchInputError(fn: () => unknown): CalculationInputError {
  try {
    fn();
  } catch (error) {
    if (error instanceof CalculationInputError) return error;
    throw error;
  }
  throw new Error('expected a CalculationInputError');
}

/**
 * Magnitude in dB of one peaking section at `frequencyHz`, written straight from the Audio EQ Cookbook
 * (W3C Working Group Note, 2021) for building synthetic measurements and reference curves in tests:
 * A = 10^(g/40), w0 = 2π f0/fs, α = sin(w0)/(2Q); b = [1 + αA, −2cos w0, 1 − αA], a = [1 + α/A, −2cos w0, 1 − α/A].
 * It does not call biquad-design.ts, so it can check it.
 */
export function cookbookPeakingDb(
  centreHz: number,
  gainDb: number,
  q: number,
  frequencyHz: number,
  sampleRateHz: number,
): number {
  const A = Math.pow(10, gainDb / 40);
  const w0 = (2 * Math.PI * centreHz) / sampleRateHz;
  const alpha = Math.sin(w0) / (2 * q);
  const b = [1 + alpha * A, -2 * Math.cos(w0), 1 - alpha * A];
  const a = [1 + alpha / A, -2 * Math.cos(w0), 1 - alpha / A];
  const [b0, b1, b2] = b.map((x) => x / a[0]);
  return referenceDb([{ b0, b1, b2, a1: a[1] / a[0], a2: a[2] / a[0] }], frequencyHz, sampleRateHz);
}
