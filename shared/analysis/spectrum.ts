import { ZERO_DB } from './level';
import FFT from 'fft.js';
import { CalculationInputError, requireInRange } from '../errors';
import { wrapDegrees } from '../dsp/response';
import { fractionalOctaveMean } from './smoothing';

/** One-sided spectrum of a real signal: bins 0..fftSize/2, bin k at k·sampleRateHz/fftSize. */
export interface RealSpectrum {
  sampleRateHz: number;
  fftSize: number;
  re: Float64Array;
  im: Float64Array;
}

/** Largest transform used, so that a 30 s file at 192 kHz still fits (2^23 points). */
const MAX_FFT_SIZE = 1 << 23;

/** fft.js plans by size: building one computes its twiddle table, which costs as much as a transform. */
const plans = new Map<number, FFT>();
function planFor(size: number): FFT {
  let plan = plans.get(size);
  if (!plan) {
    if (plans.size >= 4) plans.clear();
    plan = new FFT(size);
    plans.set(size, plan);
  }
  return plan;
}

/**
 * Discrete Fourier transform `X[k] = Σ x[n]·e^(−j2πkn/N)` of a real signal, zero-padded to the next
 * power of two, computed with the `fft.js` package.
 * @param samples the signal (full scale ±1).
 * @param sampleRateHz sample rate in hertz.
 * @returns bins 0..N/2 of the transform.
 */
export function realSpectrum(samples: ArrayLike<number>, sampleRateHz: number): RealSpectrum {
  requireInRange(sampleRateHz, { min: 0, exclusiveMin: true, unit: 'Hz' }, 'sampleRateHz', '/sampleRateHz');
  if (samples.length < 2) {
    throw new CalculationInputError(
      `a spectrum needs at least 2 samples; received ${samples.length}`,
      '/samples',
    );
  }
  let fftSize = 4;
  while (fftSize < samples.length) fftSize *= 2;
  if (fftSize > MAX_FFT_SIZE) {
    throw new CalculationInputError(
      `at most ${MAX_FFT_SIZE} samples can be transformed; received ${samples.length}`,
      '/samples',
    );
  }
  const input = new Float64Array(fftSize);
  input.set(samples as ArrayLike<number>);
  const fft = planFor(fftSize);
  const out: number[] = fft.createComplexArray();
  fft.realTransform(out, input);
  const bins = fftSize / 2 + 1;
  const re = new Float64Array(bins);
  const im = new Float64Array(bins);
  for (let k = 0; k < bins; k++) {
    re[k] = out[2 * k];
    im[k] = out[2 * k + 1];
  }
  return { sampleRateHz, fftSize, re, im };
}

export interface SmoothedResponse {
  frequenciesHz: number[];
  /** Power-smoothed magnitude, dB re a full-scale unit impulse (a single sample of 1.0 reads 0 dB). */
  magnitudeDb: number[];
  /** Phase of the complex-smoothed response with the arrival delay removed, degrees in (−180, 180]. */
  phaseDeg: number[];
}

/**
 * Fractional-octave smoothed frequency response of a spectrum on the given grid. Magnitude is the power
 * average of |X|² over each window; phase is taken from the complex average of X after removing the
 * linear phase of `delaySamples`, so it shows the response relative to the arrival.
 *
 * @param spectrum the transform of an impulse response.
 * @param delaySamples bulk delay to remove from the phase, in samples (normally the detected arrival).
 * @param smoothingOctaves window width in octaves, 1/48..1.
 * @param gridHz output frequencies, hertz, above 0 and at most Nyquist.
 */
export function smoothedResponse(
  spectrum: RealSpectrum,
  delaySamples: number,
  smoothingOctaves: number,
  gridHz: readonly number[],
): SmoothedResponse {
  const { re, im, fftSize, sampleRateHz } = spectrum;
  const bins = re.length;
  const binHz = new Float64Array(bins);
  const power = new Float64Array(bins);
  const alignedRe = new Float64Array(bins);
  const alignedIm = new Float64Array(bins);
  for (let k = 0; k < bins; k++) {
    binHz[k] = (k * sampleRateHz) / fftSize;
    power[k] = re[k] * re[k] + im[k] * im[k];
    const turn = (2 * Math.PI * k * delaySamples) / fftSize;
    const c = Math.cos(turn);
    const s = Math.sin(turn);
    alignedRe[k] = re[k] * c - im[k] * s;
    alignedIm[k] = re[k] * s + im[k] * c;
  }
  const smoothPower = fractionalOctaveMean(binHz, power, smoothingOctaves, gridHz);
  const smoothRe = fractionalOctaveMean(binHz, alignedRe, smoothingOctaves, gridHz);
  const smoothIm = fractionalOctaveMean(binHz, alignedIm, smoothingOctaves, gridHz);
  return {
    frequenciesHz: [...gridHz],
    // −300 dB only for a true zero (no energy in the window); anything else reads its own level.
    magnitudeDb: Array.from(smoothPower, (p) => (p > 0 ? 10 * Math.log10(p) : ZERO_DB)),
    phaseDeg: Array.from(smoothRe, (r, i) => wrapDegrees((Math.atan2(smoothIm[i], r) * 180) / Math.PI)),
  };
}
