import { CalculationInputError } from '../errors';
import { irfft, nextPowerOfTwo, rfft, type HalfSpectrum } from '../dsp/fft';
import { SignalProblemError } from '../analysis/signal-problem';
import { exponentialSweep, inverseFilterEnvelope, sweepLength, type SweepSpec } from './sweep';

/**
 * How the recording is turned into an impulse response:
 * - `regularizedDivision` (default): `H = Y·conj(X) / (|X|² + ε(f))`, the sweep's spectrum divided out with a
 *   small regularisation ε inside f1..f2 and a large one outside, so the answer is band-limited to the
 *   sweep instead of amplifying noise where the sweep has no energy (Müller & Massarani,
 *   "Transfer-function measurement with sweeps", JAES 49(6), 2001; the regularisation after Kirkeby and
 *   Nelson). Circular, so the transform only needs to hold the recording.
 * - `inverseFilter`: linear convolution with Farina's inverse filter (the time-reversed sweep with a
 *   −6 dB/octave envelope; Farina, AES 108th Convention, 2000, preprint 5093), normalised to unit gain at
 *   √(f1·f2). Needs a transform of recording + sweep length.
 */
export type DeconvolutionMethod = 'regularizedDivision' | 'inverseFilter';

/** ε inside the sweep's band, relative to the largest |X|²: −60 dB, far below |X|² at f2 for any f2/f1 ≤ 10^5. */
const IN_BAND_REGULARISATION = 1e-6;
/** ε outside the band, relative to the largest |X|²: the answer falls away beyond f1 and f2. */
const OUT_OF_BAND_REGULARISATION = 1;
/** Width of the raised-cosine change of ε at each band edge, in octaves (outside the band). */
const EDGE_OCTAVES = 1;
/** 2^(−1/3): how far beyond f1 and f2 the small ε reaches. */
const BAND_MARGIN = Math.pow(2, -1 / 3);

/** A sweep prepared for deconvolving recordings of one length: its spectrum at that transform size. */
export interface PreparedSweep {
  spec: SweepSpec;
  method: DeconvolutionMethod;
  /** Transform size N. */
  size: number;
  /** Multiplier per bin: `conj(X)/(|X|²+ε)` or the normalised inverse filter's spectrum. */
  filter: HalfSpectrum;
  /** Lag of the zero-delay response in the transform output (0, or n − 1 for the inverse filter). */
  zeroLag: number;
}

/**
 * Prepares the deconvolution of recordings of `recordingLength` samples made with the sweep `spec`.
 * @throws SignalProblemError `tooShort` when the recording is shorter than the sweep.
 */
export function prepareSweep(
  spec: SweepSpec,
  recordingLength: number,
  method: DeconvolutionMethod = 'regularizedDivision',
): PreparedSweep {
  const n = sweepLength(spec);
  if (recordingLength < n) {
    throw new SignalProblemError(
      `The recording has ${recordingLength} samples (${(recordingLength / spec.sampleRateHz).toFixed(3)} s); the sweep alone lasts ${n} samples (${spec.durationS} s). Record the whole sweep and the decay after it.`,
      'tooShort',
    );
  }
  const sweep = exponentialSweep({ ...spec, silenceAfterS: 0 });
  if (method === 'inverseFilter') {
    const size = nextPowerOfTwo(recordingLength + n - 1);
    const inverse = rfft(inverseFilterEnvelope(spec, sweep), size);
    const x = rfft(sweep, size);
    // Gain of sweep ⊛ inverse at √(f1·f2), read as the mean over a sixth of an octave there.
    const mid = Math.sqrt(spec.startHz * spec.endHz);
    const binHz = spec.sampleRateHz / size;
    const lo = Math.max(1, Math.floor((mid * Math.pow(2, -1 / 12)) / binHz));
    const hi = Math.max(lo, Math.ceil((mid * Math.pow(2, 1 / 12)) / binHz));
    let sum = 0;
    for (let k = lo; k <= hi; k++) {
      sum += Math.hypot(
        x.re[k] * inverse.re[k] - x.im[k] * inverse.im[k],
        x.re[k] * inverse.im[k] + x.im[k] * inverse.re[k],
      );
    }
    const gain = sum / (hi - lo + 1);
    for (let k = 0; k < inverse.re.length; k++) {
      inverse.re[k] /= gain;
      inverse.im[k] /= gain;
    }
    return { spec, method, size, filter: inverse, zeroLag: n - 1 };
  }
  const size = nextPowerOfTwo(recordingLength);
  const x = rfft(sweep, size);
  const bins = x.re.length;
  const power = new Float64Array(bins);
  let maxPower = 0;
  for (let k = 0; k < bins; k++) {
    power[k] = x.re[k] * x.re[k] + x.im[k] * x.im[k];
    if (power[k] > maxPower) maxPower = power[k];
  }
  const binHz = spec.sampleRateHz / size;
  const re = new Float64Array(bins);
  const im = new Float64Array(bins);
  for (let k = 0; k < bins; k++) {
    const epsilon = maxPower * regularisationShape(k * binHz, spec.startHz, spec.endHz);
    const denominator = power[k] + epsilon;
    re[k] = x.re[k] / denominator;
    im[k] = -x.im[k] / denominator;
  }
  return { spec, method, size, filter: { size, re, im }, zeroLag: 0 };
}

/** ε/max|X|² at `f`: small inside f1..f2 (and a third of an octave beyond), rising on a raised cosine over {@link EDGE_OCTAVES} outside. */
function regularisationShape(f: number, sweepF1: number, sweepF2: number): number {
  // The small ε reaches a third of an octave past each end: the sweep still has energy there, and the
  // response's band limit then lies far enough outside f1..f2 not to colour it.
  const f1 = sweepF1 * BAND_MARGIN;
  const f2 = sweepF2 / BAND_MARGIN;
  if (f >= f1 && f <= f2) return IN_BAND_REGULARISATION;
  const octavesOut = f < f1 ? (f <= 0 ? Infinity : Math.log2(f1 / f)) : Math.log2(f / f2);
  if (octavesOut >= EDGE_OCTAVES) return OUT_OF_BAND_REGULARISATION;
  const w = 0.5 * (1 - Math.cos((Math.PI * octavesOut) / EDGE_OCTAVES));
  return IN_BAND_REGULARISATION + (OUT_OF_BAND_REGULARISATION - IN_BAND_REGULARISATION) * w;
}

/**
 * Deconvolves one recording: its response to the sweep as a circular sequence of `size` samples, with
 * lag 0 (the sweep's first sample leaving the output) at index 0 and negative lags — where the harmonic
 * responses land — at the end.
 */
export function deconvolve(recording: Float64Array, prepared: PreparedSweep): Float64Array {
  const { size, filter, zeroLag } = prepared;
  if (recording.length > size) {
    throw new CalculationInputError(
      `the recording (${recording.length} samples) is longer than the prepared transform (${size})`,
      '/file',
    );
  }
  const y = rfft(recording, size);
  for (let k = 0; k < y.re.length; k++) {
    const r = y.re[k] * filter.re[k] - y.im[k] * filter.im[k];
    y.im[k] = y.re[k] * filter.im[k] + y.im[k] * filter.re[k];
    y.re[k] = r;
  }
  const h = irfft(y);
  if (zeroLag === 0) return h;
  const rotated = new Float64Array(size);
  rotated.set(h.subarray(zeroLag));
  rotated.set(h.subarray(0, zeroLag), size - zeroLag);
  return rotated;
}
