import { requireInRange } from '../errors';
import { requireFiniteSos, type Sos } from './sos';

/**
 * Frequency response of sections on the unit circle, z = e^(jω), ω = 2π·f/sampleRateHz — the core's one
 * evaluator of magnitude, phase and group delay (in the manner of scipy.signal.sosfreqz and group_delay).
 *
 * Every section is evaluated the same way: its numerator N = b0 + b1·z⁻¹ + b2·z⁻² and denominator D, and
 * their delay-weighted sums N_k = b1·z⁻¹ + 2·b2·z⁻² and D_k (the polynomials' ω-derivatives divided by −j).
 * Group delay is `−Im(H′/H) = Re(τ̃)` with `τ̃ = Σ (N_k/N − D_k/D)` over a cascade; the product
 * `H·τ̃` is carried through the cascade by the product rule so nothing is divided by a numerator, and a
 * parallel sum of cascades has `τ̃ = Σ g·H·τ̃ / Σ g·H`. Where the response is a numerical zero (a
 * section's numerator within rounding of 0, as at a notch's centre, or branches that cancel to 1e-12 of
 * their size), group delay is undefined and reported as 0, as scipy.signal.group_delay does at singular
 * points.
 */

export interface SosResponse {
  /** Magnitude in dB, clamped to ±300 dB (a true zero, e.g. a notch exactly at its centre, reads −300). */
  magnitudeDb: number[];
  /** Phase in degrees, wrapped to (−180, 180]. Wrapped so the value does not depend on the grid. */
  phaseDeg: number[];
  /** Group delay in milliseconds. */
  groupDelayMs: number[];
}

export interface FrequencyResponse extends SosResponse {
  frequenciesHz: number[];
}

/** One branch of a parallel sum: a cascade and a linear gain (negative for inverted polarity). */
export interface ParallelBranch {
  sections: readonly Sos[];
  gain: number;
}

export const MAGNITUDE_LIMIT_DB = 300;

/** The points z⁻¹ and z⁻² on the unit circle for a list of frequencies, computed once per grid. */
export interface UnitCircle {
  readonly frequenciesHz: readonly number[];
  readonly sampleRateHz: number;
  readonly cos1: Float64Array;
  readonly sin1: Float64Array;
  readonly cos2: Float64Array;
  readonly sin2: Float64Array;
}

/**
 * @param frequenciesHz evaluation frequencies, 0 ≤ f ≤ sampleRateHz/2 (named `/frequenciesHz/i` when not).
 * @param sampleRateHz sample rate in hertz.
 */
export function unitCircle(frequenciesHz: readonly number[], sampleRateHz: number): UnitCircle {
  const n = frequenciesHz.length;
  const cos1 = new Float64Array(n);
  const sin1 = new Float64Array(n);
  const cos2 = new Float64Array(n);
  const sin2 = new Float64Array(n);
  frequenciesHz.forEach((f, i) => {
    requireInRange(f, { min: 0, max: sampleRateHz / 2, unit: 'Hz' }, 'frequenciesHz', `/frequenciesHz/${i}`);
    const w = (2 * Math.PI * f) / sampleRateHz;
    cos1[i] = Math.cos(w);
    sin1[i] = Math.sin(w);
    cos2[i] = Math.cos(2 * w);
    sin2[i] = Math.sin(2 * w);
  });
  return { frequenciesHz, sampleRateHz, cos1, sin1, cos2, sin2 };
}

/** Scratch slots filled by evaluateSection. */
const N_RE = 0;
const N_IM = 1;
const D_RE = 2;
const D_IM = 3;
const NK_RE = 4;
const NK_IM = 5;
const DK_RE = 6;
const DK_IM = 7;

/** N, D, N_k and D_k of one section at point i of the grid, written into `t` (see the module comment). */
function evaluateSection(s: Sos, at: UnitCircle, i: number, t: Float64Array): void {
  const c1 = at.cos1[i];
  const s1 = at.sin1[i];
  const c2 = at.cos2[i];
  const s2 = at.sin2[i];
  t[N_RE] = s.b0 + s.b1 * c1 + s.b2 * c2;
  t[N_IM] = -(s.b1 * s1 + s.b2 * s2);
  t[D_RE] = 1 + s.a1 * c1 + s.a2 * c2;
  t[D_IM] = -(s.a1 * s1 + s.a2 * s2);
  t[NK_RE] = s.b1 * c1 + 2 * s.b2 * c2;
  t[NK_IM] = -(s.b1 * s1 + 2 * s.b2 * s2);
  t[DK_RE] = s.a1 * c1 + 2 * s.a2 * c2;
  t[DK_IM] = -(s.a1 * s1 + 2 * s.a2 * s2);
}

/** Where a cascade's magnitude is largest and smallest on a grid, and those magnitudes in dB. */
export interface MagnitudeExtremes {
  /** Index of the largest magnitude (the first of equals, in grid order; see EXTREMES_EQUAL_DB). */
  maxIndex: number;
  maxDb: number;
  /** Index of the smallest magnitude (the first of equals, in grid order). */
  minIndex: number;
  minDb: number;
}

/** ±300 dB as power ratios: the clamp of sosMagnitudeDb, applied before the one logarithm. */
const POWER_LIMIT_HIGH = 10 ** (MAGNITUDE_LIMIT_DB / 10);
const POWER_LIMIT_LOW = 1 / POWER_LIMIT_HIGH;
/**
 * Magnitudes closer than this count as equal when looking for extremes (as a power ratio, 1 + 1e-12:
 * about 4e-12 dB). On a plateau — a shelf's flat side, a pass band — the points differ only by rounding,
 * which differs with the order of the arithmetic; so the first point of the plateau is named, not the one
 * rounding happens to favour.
 */
export const EXTREMES_EQUAL_DB = 10 * Math.log10(1 + 1e-12);
const EQUAL_POWER = 1 + 1e-12;

/**
 * The largest and smallest magnitude of a cascade over a grid, as `sosMagnitudeDb` would give them and
 * at the same points, without an array of dB: each point's power ratio Π |N|²/|D|² is multiplied through
 * the sections (N and D evaluated as evaluateSection does, |N|² floored at 1e-300 as there) and clamped
 * to ±300 dB, and only the two extremes are turned into dB. A logarithm per point and section is most of
 * the cost of the dB array, and finding extremes needs none (log is monotonic). Of magnitudes equal
 * within EXTREMES_EQUAL_DB the first is named. An empty grid gives index −1.
 */
export function sosMagnitudeExtremes(sections: readonly Sos[], at: UnitCircle): MagnitudeExtremes {
  const n = at.cos1.length;
  let maxIndex = -1;
  let minIndex = -1;
  let maxPower = 0;
  let minPower = 0;
  for (let i = 0; i < n; i++) {
    const c1 = at.cos1[i];
    const s1 = at.sin1[i];
    const c2 = at.cos2[i];
    const s2 = at.sin2[i];
    let power = 1;
    for (let k = 0; k < sections.length; k++) {
      const s = sections[k];
      const nRe = s.b0 + s.b1 * c1 + s.b2 * c2;
      const nIm = -(s.b1 * s1 + s.b2 * s2);
      const dRe = 1 + s.a1 * c1 + s.a2 * c2;
      const dIm = -(s.a1 * s1 + s.a2 * s2);
      power *= Math.max(nRe * nRe + nIm * nIm, 1e-300) / (dRe * dRe + dIm * dIm);
    }
    power = Math.min(POWER_LIMIT_HIGH, Math.max(POWER_LIMIT_LOW, power));
    if (i === 0 || power > maxPower * EQUAL_POWER) {
      maxPower = power;
      maxIndex = i;
    }
    if (i === 0 || power * EQUAL_POWER < minPower) {
      minPower = power;
      minIndex = i;
    }
  }
  return {
    maxIndex,
    maxDb: n === 0 ? 0 : 10 * Math.log10(maxPower),
    minIndex,
    minDb: n === 0 ? 0 : 10 * Math.log10(minPower),
  };
}

/**
 * Magnitude in dB of a cascade at every point of the grid, without phase or group delay (the fast path for
 * fitting): `Σ 10·log10(|N|²/|D|²)`, clamped to ±300 dB.
 * @param out where to write (a new array when absent).
 */
export function sosMagnitudeDb(
  sections: readonly Sos[],
  at: UnitCircle,
  out: Float64Array = new Float64Array(at.frequenciesHz.length),
): Float64Array {
  const t = new Float64Array(8);
  out.fill(0);
  for (const s of sections) {
    for (let i = 0; i < out.length; i++) {
      evaluateSection(s, at, i, t);
      const num = t[N_RE] * t[N_RE] + t[N_IM] * t[N_IM];
      const den = t[D_RE] * t[D_RE] + t[D_IM] * t[D_IM];
      out[i] += 10 * Math.log10(Math.max(num, 1e-300) / den);
    }
  }
  for (let i = 0; i < out.length; i++) out[i] = clampDb(out[i]);
  return out;
}

/** A numerator this close to 0, relative to Σ|b_k|, is a zero of the section (a few ulps of rounding). */
const NUMERICAL_ZERO = 64 * Number.EPSILON;

/** H, H·τ̃ and whether a section is at a zero, for a cascade at one point: [hRe, hIm, tRe, tIm, singular]. */
function cascadeAt(
  sections: readonly Sos[],
  at: UnitCircle,
  i: number,
  t: Float64Array,
  out: Float64Array,
): void {
  let hRe = 1;
  let hIm = 0;
  let tRe = 0;
  let tIm = 0;
  let singular = 0;
  for (const s of sections) {
    evaluateSection(s, at, i, t);
    const size = Math.abs(s.b0) + Math.abs(s.b1) + Math.abs(s.b2);
    if (Math.hypot(t[N_RE], t[N_IM]) <= NUMERICAL_ZERO * size) singular = 1;
    const dd = t[D_RE] * t[D_RE] + t[D_IM] * t[D_IM];
    // S = N/D
    const sRe = (t[N_RE] * t[D_RE] + t[N_IM] * t[D_IM]) / dd;
    const sIm = (t[N_IM] * t[D_RE] - t[N_RE] * t[D_IM]) / dd;
    // S·τ̃_S = (N_k·D − N·D_k)/D²
    const xRe = t[NK_RE] * t[D_RE] - t[NK_IM] * t[D_IM] - (t[N_RE] * t[DK_RE] - t[N_IM] * t[DK_IM]);
    const xIm = t[NK_RE] * t[D_IM] + t[NK_IM] * t[D_RE] - (t[N_RE] * t[DK_IM] + t[N_IM] * t[DK_RE]);
    const d2Re = (t[D_RE] * t[D_RE] - t[D_IM] * t[D_IM]) / (dd * dd);
    const d2Im = (-2 * t[D_RE] * t[D_IM]) / (dd * dd);
    const uRe = xRe * d2Re - xIm * d2Im;
    const uIm = xRe * d2Im + xIm * d2Re;
    // (h·S)·τ̃ = t·S + h·(S·τ̃_S), then h = h·S.
    const nextTRe = tRe * sRe - tIm * sIm + hRe * uRe - hIm * uIm;
    const nextTIm = tRe * sIm + tIm * sRe + hRe * uIm + hIm * uRe;
    const nextHRe = hRe * sRe - hIm * sIm;
    const nextHIm = hRe * sIm + hIm * sRe;
    tRe = nextTRe;
    tIm = nextTIm;
    hRe = nextHRe;
    hIm = nextHIm;
  }
  out[0] = hRe;
  out[1] = hIm;
  out[2] = tRe;
  out[3] = tIm;
  out[4] = singular;
}

/**
 * Complex response Σ gain·H of parallel cascades at every point of the grid, with phase and group delay.
 * A single branch of gain 1 is a plain cascade.
 */
export function parallelResponseAt(branches: readonly ParallelBranch[], at: UnitCircle): SosResponse {
  branches.forEach((b) => requireFiniteSos(b.sections));
  const n = at.frequenciesHz.length;
  const magnitudeDb: number[] = new Array(n);
  const phaseDeg: number[] = new Array(n);
  const groupDelayMs: number[] = new Array(n);
  const t = new Float64Array(8);
  const c = new Float64Array(5);
  for (let i = 0; i < n; i++) {
    let hRe = 0;
    let hIm = 0;
    let tRe = 0;
    let tIm = 0;
    let size = 0;
    let regular = false;
    for (const branch of branches) {
      cascadeAt(branch.sections, at, i, t, c);
      hRe += branch.gain * c[0];
      hIm += branch.gain * c[1];
      tRe += branch.gain * c[2];
      tIm += branch.gain * c[3];
      size += Math.abs(branch.gain) * Math.hypot(c[0], c[1]);
      if (branch.gain !== 0 && c[4] === 0) regular = true;
    }
    const magnitudeSquared = hRe * hRe + hIm * hIm;
    magnitudeDb[i] = clampDb(10 * Math.log10(Math.max(magnitudeSquared, 1e-300)));
    phaseDeg[i] = wrapDegrees((Math.atan2(hIm, hRe) * 180) / Math.PI);
    const singular = !regular || !(magnitudeSquared > 1e-24 * size * size);
    // Re(τ̃) = Re((H·τ̃)·conj(H))/|H|²
    const delaySamples = singular ? 0 : (tRe * hRe + tIm * hIm) / magnitudeSquared;
    groupDelayMs[i] = (delaySamples / at.sampleRateHz) * 1000;
  }
  return { magnitudeDb, phaseDeg, groupDelayMs };
}

/**
 * Response of a cascade (magnitude, phase, group delay) at the given frequencies.
 * @param sections the cascade (a0 = 1, `+a1, +a2` denominator).
 * @param frequenciesHz evaluation frequencies in hertz, 0 ≤ f ≤ sampleRateHz/2.
 * @param sampleRateHz sample rate in hertz.
 */
export function cascadeResponse(
  sections: readonly Sos[],
  frequenciesHz: readonly number[],
  sampleRateHz: number,
): SosResponse {
  return parallelResponseAt([{ sections, gain: 1 }], unitCircle(frequenciesHz, sampleRateHz));
}

/**
 * Response of branches played together (Σ gain·H_branch, a complex sum — phase matters, so a crossover's
 * outputs can cancel or sum flat).
 */
export function parallelResponse(
  branches: readonly ParallelBranch[],
  frequenciesHz: readonly number[],
  sampleRateHz: number,
): SosResponse {
  return parallelResponseAt(branches, unitCircle(frequenciesHz, sampleRateHz));
}

/**
 * Complex response H(e^(jω)) of a cascade at each frequency (scipy.signal.sosfreqz at given frequencies).
 */
export function sosfreqz(
  sections: readonly Sos[],
  frequenciesHz: readonly number[],
  sampleRateHz: number,
): { re: Float64Array; im: Float64Array } {
  requireFiniteSos(sections);
  const at = unitCircle(frequenciesHz, sampleRateHz);
  const re = new Float64Array(frequenciesHz.length);
  const im = new Float64Array(frequenciesHz.length);
  const t = new Float64Array(8);
  const c = new Float64Array(5);
  for (let i = 0; i < re.length; i++) {
    cascadeAt(sections, at, i, t, c);
    re[i] = c[0];
    im[i] = c[1];
  }
  return { re, im };
}

function clampDb(db: number): number {
  return Math.min(MAGNITUDE_LIMIT_DB, Math.max(-MAGNITUDE_LIMIT_DB, db));
}

/** Wraps to (−180, 180]. */
export function wrapDegrees(deg: number): number {
  const wrapped = deg - 360 * Math.ceil((deg - 180) / 360);
  return wrapped === -180 ? 180 : wrapped;
}
