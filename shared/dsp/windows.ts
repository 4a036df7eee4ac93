import { CalculationInputError } from '../errors';

/** Window names, as scipy.signal.get_window spells the ones the core uses. */
export type WindowName = 'hann' | 'blackmanharris' | 'boxcar';

/**
 * A symmetric window of `length` points, like scipy.signal.get_window(name, length, fftbins=False):
 * - `hann`: 0.5 − 0.5·cos(2πn/(N−1)) (Harris, "On the use of windows for harmonic analysis with the DFT",
 *   Proc. IEEE 66(1), 1978);
 * - `blackmanharris`: the 4-term minimum Blackman-Harris, 0.35875 − 0.48829·cos + 0.14128·cos2 − 0.01168·cos3
 *   (Harris 1978, −92 dB side lobes);
 * - `boxcar`: all ones.
 */
export function getWindow(name: WindowName, length: number): Float64Array {
  if (!Number.isInteger(length) || length < 1) {
    throw new CalculationInputError(`a window needs at least 1 point; received ${length}`, '/windowLength');
  }
  const w = new Float64Array(length);
  if (length === 1) {
    w[0] = 1;
    return w;
  }
  const step = (2 * Math.PI) / (length - 1);
  for (let n = 0; n < length; n++) {
    const x = step * n;
    w[n] =
      name === 'hann'
        ? 0.5 - 0.5 * Math.cos(x)
        : name === 'blackmanharris'
          ? 0.35875 - 0.48829 * Math.cos(x) + 0.14128 * Math.cos(2 * x) - 0.01168 * Math.cos(3 * x)
          : 1;
  }
  return w;
}

/**
 * The falling half of a Hann window over `length` points (1 down to 0, exclusive of the 0): the taper
 * that ends a cut without a step.
 */
export function halfHannFall(length: number): Float64Array {
  const w = new Float64Array(length);
  for (let n = 0; n < length; n++) w[n] = 0.5 * (1 + Math.cos((Math.PI * (n + 1)) / (length + 1)));
  return w;
}
