import { CalculationInputError, requireInRange, requireInteger } from '../errors';
import { MAX_RESPONSE_POINTS } from '../limits';
import type { BiquadSection } from './biquad-design';

export interface CascadeResponse {
  /** Magnitude in dB, clamped to ±300 dB (a true zero, e.g. a notch exactly at its centre, reads −300). */
  magnitudeDb: number[];
  /** Phase in degrees, wrapped to (−180, 180]. Wrapped so the value does not depend on the grid. */
  phaseDeg: number[];
  /** Group delay in milliseconds. */
  groupDelayMs: number[];
}

export interface FrequencyResponse extends CascadeResponse {
  frequenciesHz: number[];
}

export type ResponseGridSpec =
  { frequenciesHz: number[] } | { fromHz: number; toHz: number; pointsPerOctave?: number };

export const MAGNITUDE_LIMIT_DB = 300;
export { MAX_RESPONSE_POINTS };
export const DEFAULT_POINTS_PER_OCTAVE = 12;

/** Below this distance from 1, a root's radius counts as on the unit circle (see groupDelayOfRoot). */
const UNIT_CIRCLE_TOLERANCE = 1e-9;

/**
 * Frequency response of a cascade of normalised sections, evaluated on the unit circle at
 * z = e^(jω), ω = 2π f / sampleRateHz.
 *
 * Group delay is analytic: each section's numerator and denominator are factored into first-order
 * terms (1 − r z⁻¹), and a term whose root is r = ρe^(jθ) delays by
 * `(ρ² − ρ cos(ω−θ)) / (1 − 2ρ cos(ω−θ) + ρ²)` samples (numerator roots add, poles subtract, and a
 * leading zero coefficient adds one sample). A zero on the unit circle contributes its regular part,
 * half a sample, also at the frequency where the phase jumps by 180°.
 *
 * @param sections the cascade (a0 = 1, `+a1, +a2` denominator).
 * @param frequenciesHz evaluation frequencies in hertz, 0 ≤ f ≤ sampleRateHz/2.
 * @param sampleRateHz sample rate in hertz.
 */
export function cascadeResponse(
  sections: BiquadSection[],
  frequenciesHz: number[],
  sampleRateHz: number,
): CascadeResponse {
  const fs = sampleRateHz;
  requireFiniteSections(sections);
  const magnitudeDb: number[] = [];
  const phaseDeg: number[] = [];
  const groupDelayMs: number[] = [];
  frequenciesHz.forEach((f, i) => {
    requireInRange(f, { min: 0, max: fs / 2, unit: 'Hz' }, 'frequenciesHz', `/frequenciesHz/${i}`);
    const w = (2 * Math.PI * f) / fs;
    let magDb = 0;
    let phase = 0;
    let delaySamples = 0;
    for (const s of sections) {
      const num = evaluatePolynomial([s.b0, s.b1, s.b2], w);
      const den = evaluatePolynomial([1, s.a1, s.a2], w);
      magDb += safeDb(Math.hypot(num.re, num.im)) - safeDb(Math.hypot(den.re, den.im));
      phase += Math.atan2(num.im, num.re) - Math.atan2(den.im, den.re);
      delaySamples += polynomialGroupDelay([s.b0, s.b1, s.b2], w) - polynomialGroupDelay([1, s.a1, s.a2], w);
    }
    magnitudeDb.push(clampDb(magDb));
    phaseDeg.push(wrapDegrees((phase * 180) / Math.PI));
    groupDelayMs.push((delaySamples / fs) * 1000);
  });
  return { magnitudeDb, phaseDeg, groupDelayMs };
}

/** Response of a cascade on a grid, with the grid's frequencies included. */
export function frequencyResponse(
  sections: BiquadSection[],
  grid: ResponseGridSpec,
  sampleRateHz: number,
): FrequencyResponse {
  const frequenciesHz = responseGrid(grid, sampleRateHz);
  return { frequenciesHz, ...cascadeResponse(sections, frequenciesHz, sampleRateHz) };
}

/** One branch of a parallel sum: a cascade and a linear gain (negative for inverted polarity). */
export interface ParallelBranch {
  sections: BiquadSection[];
  gain: number;
}

/**
 * Response of branches played together (Σ gain·H_branch, a complex sum — phase matters, so a
 * crossover's outputs can cancel or sum flat). Group delay is `−Im(H'(ω)/H(ω))` with H' differentiated
 * analytically; where the sum is an exact null (|H| below 1e-12) group delay is undefined and
 * reported as 0, as scipy.signal.group_delay does at singular points.
 */
export function parallelResponse(
  branches: ParallelBranch[],
  frequenciesHz: number[],
  sampleRateHz: number,
): CascadeResponse {
  const fs = sampleRateHz;
  branches.forEach((b) => requireFiniteSections(b.sections));
  const magnitudeDb: number[] = [];
  const phaseDeg: number[] = [];
  const groupDelayMs: number[] = [];
  frequenciesHz.forEach((f, i) => {
    requireInRange(f, { min: 0, max: fs / 2, unit: 'Hz' }, 'frequenciesHz', `/frequenciesHz/${i}`);
    const w = (2 * Math.PI * f) / fs;
    let re = 0;
    let im = 0;
    let dRe = 0;
    let dIm = 0;
    for (const branch of branches) {
      const { h, dh } = cascadeWithDerivative(branch.sections, w);
      re += branch.gain * h.re;
      im += branch.gain * h.im;
      dRe += branch.gain * dh.re;
      dIm += branch.gain * dh.im;
    }
    const magnitudeSquared = re * re + im * im;
    magnitudeDb.push(clampDb(safeDb(Math.sqrt(magnitudeSquared))));
    phaseDeg.push(wrapDegrees((Math.atan2(im, re) * 180) / Math.PI));
    // −Im(H'/H) = −(dIm·re − dRe·im)/|H|²
    const delaySamples = magnitudeSquared < 1e-24 ? 0 : -(dIm * re - dRe * im) / magnitudeSquared;
    groupDelayMs.push((delaySamples / fs) * 1000);
  });
  return { magnitudeDb, phaseDeg, groupDelayMs };
}

/**
 * Frequencies for a response: either the listed ones (each 0 < f ≤ Nyquist) or a log-spaced sweep
 * from `fromHz` to `toHz`, both ends included, with `round(log2(toHz/fromHz) · pointsPerOctave)`
 * equal steps in log frequency (default 12 per octave). At most 4096 points.
 * @returns frequencies in hertz.
 */
export function responseGrid(grid: ResponseGridSpec, sampleRateHz: number): number[] {
  const nyquist = sampleRateHz / 2;
  if ('frequenciesHz' in grid) {
    const list = grid.frequenciesHz;
    if (!Array.isArray(list) || list.length === 0 || list.length > MAX_RESPONSE_POINTS) {
      throw new CalculationInputError(
        `frequenciesHz must list 1 to ${MAX_RESPONSE_POINTS} frequencies`,
        '/frequenciesHz',
      );
    }
    return list.map((f, i) =>
      requireInRange(
        f,
        { min: 0, exclusiveMin: true, max: nyquist, unit: 'Hz' },
        'frequenciesHz',
        `/frequenciesHz/${i}`,
      ),
    );
  }
  const fromHz = requireInRange(
    grid.fromHz,
    { min: 0, exclusiveMin: true, max: nyquist, unit: 'Hz' },
    'fromHz',
    '/fromHz',
  );
  const toHz = requireInRange(grid.toHz, { min: fromHz, max: nyquist, unit: 'Hz' }, 'toHz', '/toHz');
  const pointsPerOctave = requireInteger(
    grid.pointsPerOctave ?? DEFAULT_POINTS_PER_OCTAVE,
    { min: 1, max: 96 },
    'pointsPerOctave',
    '/pointsPerOctave',
  );
  const steps = Math.round(Math.log2(toHz / fromHz) * pointsPerOctave);
  if (steps + 1 > MAX_RESPONSE_POINTS) {
    throw new CalculationInputError(
      `the sweep from ${fromHz} Hz to ${toHz} Hz at ${pointsPerOctave} points per octave has ${steps + 1} points; at most ${MAX_RESPONSE_POINTS} are allowed`,
      '/pointsPerOctave',
    );
  }
  if (steps === 0) return [fromHz];
  const ratio = toHz / fromHz;
  return Array.from({ length: steps + 1 }, (_, k) =>
    k === steps ? toHz : fromHz * Math.pow(ratio, k / steps),
  );
}

/**
 * True when both poles of the section lie strictly inside the unit circle, by the second-order
 * stability triangle |a2| < 1 and |a1| < 1 + a2 (Jury's criterion; a first-order section, a2 = 0,
 * reduces to |a1| < 1).
 */
export function isStable(section: BiquadSection): boolean {
  const { a1, a2 } = section;
  return Number.isFinite(a1) && Number.isFinite(a2) && Math.abs(a2) < 1 && Math.abs(a1) < 1 + a2;
}

interface Complex {
  re: number;
  im: number;
}

/** Σ c_k e^(−jωk). */
function evaluatePolynomial(c: number[], w: number): Complex {
  let re = 0;
  let im = 0;
  c.forEach((ck, k) => {
    re += ck * Math.cos(w * k);
    im -= ck * Math.sin(w * k);
  });
  return { re, im };
}

/** d/dω Σ c_k e^(−jωk) = Σ −jk·c_k e^(−jωk). */
function evaluatePolynomialDerivative(c: number[], w: number): Complex {
  let re = 0;
  let im = 0;
  c.forEach((ck, k) => {
    re -= k * ck * Math.sin(w * k);
    im -= k * ck * Math.cos(w * k);
  });
  return { re, im };
}

function cascadeWithDerivative(sections: BiquadSection[], w: number): { h: Complex; dh: Complex } {
  let h: Complex = { re: 1, im: 0 };
  let dh: Complex = { re: 0, im: 0 };
  for (const s of sections) {
    const b = [s.b0, s.b1, s.b2];
    const a = [1, s.a1, s.a2];
    const num = evaluatePolynomial(b, w);
    const den = evaluatePolynomial(a, w);
    const dNum = evaluatePolynomialDerivative(b, w);
    const dDen = evaluatePolynomialDerivative(a, w);
    const section = divide(num, den);
    // (N/D)' = (N'·D − N·D') / D²
    const dSection = divide(subtract(multiply(dNum, den), multiply(num, dDen)), multiply(den, den));
    // (h·s)' = h'·s + h·s'
    dh = add(multiply(dh, section), multiply(h, dSection));
    h = multiply(h, section);
  }
  return { h, dh };
}

/**
 * Group delay in samples of c0 + c1 z⁻¹ + c2 z⁻², from its roots (see cascadeResponse).
 */
function polynomialGroupDelay(c: number[], w: number): number {
  let leadingZeros = 0;
  while (leadingZeros < c.length && c[leadingZeros] === 0) leadingZeros++;
  const rest = c.slice(leadingZeros);
  while (rest.length > 0 && rest[rest.length - 1] === 0) rest.pop();
  if (rest.length <= 1) return leadingZeros;
  return leadingZeros + rootsOf(rest).reduce((sum, r) => sum + groupDelayOfRoot(r, w), 0);
}

/** Roots r of the factors (1 − r x) of q0 + q1 x (+ q2 x²), q0 ≠ 0, i.e. roots of q0 r² + q1 r + q2. */
function rootsOf(q: number[]): Complex[] {
  if (q.length === 2) return [{ re: -q[1] / q[0], im: 0 }];
  const [q0, q1, q2] = q;
  const discriminant = q1 * q1 - 4 * q0 * q2;
  if (discriminant < 0) {
    const re = -q1 / (2 * q0);
    const im = Math.sqrt(-discriminant) / (2 * q0);
    return [
      { re, im },
      { re, im: -im },
    ];
  }
  // Avoids cancellation: one root from the stable quadratic formula, the other from r1·r2 = q2/q0.
  const t = -0.5 * (q1 + Math.sign(q1 || 1) * Math.sqrt(discriminant));
  const r1 = t / q0;
  const r2 = t === 0 ? 0 : q2 / t;
  return [
    { re: r1, im: 0 },
    { re: r2, im: 0 },
  ];
}

function groupDelayOfRoot(r: Complex, w: number): number {
  const rho = Math.hypot(r.re, r.im);
  if (Math.abs(rho - 1) < UNIT_CIRCLE_TOLERANCE) return 0.5;
  const theta = Math.atan2(r.im, r.re);
  const halfSin = Math.sin((w - theta) / 2);
  // 1 − cos φ = 2 sin²(φ/2) keeps precision when the root is close to the circle near ω.
  const oneMinusCos = 2 * halfSin * halfSin;
  return (rho * (rho - 1) + rho * oneMinusCos) / ((1 - rho) * (1 - rho) + 2 * rho * oneMinusCos);
}

function requireFiniteSections(sections: BiquadSection[]): void {
  sections.forEach((s, i) => {
    for (const key of ['b0', 'b1', 'b2', 'a1', 'a2'] as const) {
      if (!Number.isFinite(s[key])) {
        throw new CalculationInputError(
          `${key} must be a finite number; received ${String(s[key])}`,
          `/sections/${i}/${key}`,
        );
      }
    }
  });
}

function safeDb(magnitude: number): number {
  return 20 * Math.log10(Math.max(magnitude, 1e-300));
}

function clampDb(db: number): number {
  return Math.min(MAGNITUDE_LIMIT_DB, Math.max(-MAGNITUDE_LIMIT_DB, db));
}

/** Wraps to (−180, 180]. */
function wrapDegrees(deg: number): number {
  const wrapped = deg - 360 * Math.ceil((deg - 180) / 360);
  return wrapped === -180 ? 180 : wrapped;
}

function add(x: Complex, y: Complex): Complex {
  return { re: x.re + y.re, im: x.im + y.im };
}

function subtract(x: Complex, y: Complex): Complex {
  return { re: x.re - y.re, im: x.im - y.im };
}

function multiply(x: Complex, y: Complex): Complex {
  return { re: x.re * y.re - x.im * y.im, im: x.re * y.im + x.im * y.re };
}

function divide(x: Complex, y: Complex): Complex {
  const d = y.re * y.re + y.im * y.im;
  return { re: (x.re * y.re + x.im * y.im) / d, im: (x.im * y.re - x.re * y.im) / d };
}
