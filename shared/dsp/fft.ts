import FFT from 'fft.js';
import { CalculationInputError } from '../errors';

/**
 * Real-input FFTs for the core, on the `fft.js` package (radix-4, power-of-two sizes), shaped like
 * numpy.fft.rfft / irfft: a real signal of N samples has N/2 + 1 complex bins, bin k at k·fs/N.
 */
export interface HalfSpectrum {
  /** Transform size N (a power of two). */
  size: number;
  /** Real parts of bins 0..N/2. */
  re: Float64Array;
  /** Imaginary parts of bins 0..N/2. */
  im: Float64Array;
}

/** Largest transform: 2^23 points (a 30 s file at 192 kHz plus its inverse filter fits 2^24 only halved). */
export const MAX_FFT_SIZE = 1 << 23;

/** fft.js plans by size: building one computes its twiddle table, which costs about one transform. */
const plans = new Map<number, FFT>();
function planFor(size: number): FFT {
  let plan = plans.get(size);
  if (!plan) {
    if (plans.size >= 6) plans.clear();
    plan = new FFT(size);
    plans.set(size, plan);
  }
  return plan;
}

/** cos and sin of 2πk/N for k < N/2, kept for the last few sizes like the plans. */
const twiddleTables = new Map<number, { cos: Float64Array; sin: Float64Array }>();
function twiddles(size: number): { cos: Float64Array; sin: Float64Array } {
  let table = twiddleTables.get(size);
  if (!table) {
    if (twiddleTables.size >= 6) twiddleTables.clear();
    const cos = new Float64Array(size / 2);
    const sin = new Float64Array(size / 2);
    for (let k = 0; k < size / 2; k++) {
      cos[k] = Math.cos((2 * Math.PI * k) / size);
      sin[k] = Math.sin((2 * Math.PI * k) / size);
    }
    table = { cos, sin };
    twiddleTables.set(size, table);
  }
  return table;
}

/** The smallest power of two ≥ `length` (at least 4, the smallest size fft.js plans). */
export function nextPowerOfTwo(length: number): number {
  let size = 4;
  while (size < length) size *= 2;
  return size;
}

function requireSize(size: number): void {
  if (!Number.isInteger(Math.log2(size)) || size < 4 || size > MAX_FFT_SIZE) {
    throw new CalculationInputError(
      `a transform size must be a power of two 4..${MAX_FFT_SIZE}; received ${size}`,
      '/fftSize',
    );
  }
}

/**
 * `X[k] = Σ x[n]·e^(−j2πkn/N)` for k = 0..N/2 of a real signal zero-padded (or cut) to N samples.
 * @param samples the signal.
 * @param size N, a power of two.
 */
export function rfft(samples: ArrayLike<number>, size: number): HalfSpectrum {
  requireSize(size);
  const input = new Float64Array(size);
  if (samples.length > size) input.set(Array.prototype.slice.call(samples, 0, size) as number[]);
  else input.set(samples);
  const fft = planFor(size);
  const out: number[] = fft.createComplexArray();
  fft.realTransform(out, input);
  const bins = size / 2 + 1;
  const re = new Float64Array(bins);
  const im = new Float64Array(bins);
  for (let k = 0; k < bins; k++) {
    re[k] = out[2 * k];
    im[k] = out[2 * k + 1];
  }
  return { size, re, im };
}

/**
 * Inverse of {@link rfft}: the real signal `x[n] = (1/N)·Σ X[k]·e^(j2πkn/N)` whose half spectrum is
 * given (the other half is its complex conjugate). Computed with one complex transform of N/2 points:
 * even and odd samples are packed as the real and imaginary parts of one sequence `z[n] = x[2n] + j·x[2n+1]`,
 * whose spectrum is `Z[k] = E[k] + j·O[k]` with `E[k] = (X[k] + conj(X[N/2−k]))/2` and
 * `O[k] = (X[k] − conj(X[N/2−k]))·e^(j2πk/N)/2` (the standard packing, e.g. Press et al., Numerical Recipes,
 * §12.3, "FFT of real functions").
 */
export function irfft(spectrum: HalfSpectrum): Float64Array {
  const { size, re, im } = spectrum;
  requireSize(size);
  if (re.length !== size / 2 + 1 || im.length !== size / 2 + 1) {
    throw new CalculationInputError(
      `a half spectrum of size ${size} has ${size / 2 + 1} bins; received ${re.length}`,
      '/spectrum',
    );
  }
  const half = size / 2;
  const fft = planFor(half);
  const { cos, sin } = twiddles(size);
  const packed: number[] = fft.createComplexArray();
  for (let k = 0; k < half; k++) {
    const ar = re[k];
    const ai = im[k];
    const br = re[half - k];
    const bi = -im[half - k];
    const er = (ar + br) / 2;
    const ei = (ai + bi) / 2;
    const dr = (ar - br) / 2;
    const di = (ai - bi) / 2;
    const c = cos[k];
    const s = sin[k];
    const or = dr * c - di * s;
    const oi = dr * s + di * c;
    packed[2 * k] = er - oi;
    packed[2 * k + 1] = ei + or;
  }
  const out: number[] = fft.createComplexArray();
  fft.inverseTransform(out, packed);
  // The interleaved complex output z[n] = x[2n] + j·x[2n+1] is the signal itself.
  return Float64Array.from(out);
}
