import { CalculationInputError, requireInRange } from '../errors';
import { LIMITS } from '../limits';

/**
 * Narrowest and widest smoothing windows accepted, in octaves (1/48 to 1/1 octave). The narrowest is
 * exactly 1/48 here; the contract states it rounded (0.0208), a little wider, so it cannot be read from there.
 */
export const MIN_SMOOTHING_OCTAVES = 1 / 48;
export const MAX_SMOOTHING_OCTAVES = LIMITS.smoothingOctaves.maximum;

/**
 * Mean of a quantity over fractional-octave windows `[f·2^(−w/2), f·2^(+w/2)]` around each output
 * frequency f, where w is the window width in octaves. The input is treated as piecewise linear in
 * frequency and integrated exactly, so an evenly spaced FFT grid gets the plain bin average (the common
 * power-averaging form of fractional-octave smoothing [practice]) and a window narrower than one bin
 * falls back to linear interpolation. Windows are clipped at the ends of the input.
 *
 * Average power (|H|²) for magnitude smoothing; average real and imaginary parts for complex smoothing.
 *
 * @param frequenciesHz ascending input frequencies, hertz (at least 2).
 * @param values the quantity at each input frequency.
 * @param widthOctaves window width w in octaves, 1/48..1.
 * @param outputHz frequencies to evaluate, hertz, each inside the input range.
 * @returns the window means, one per output frequency.
 */
export function fractionalOctaveMean(
  frequenciesHz: ArrayLike<number>,
  values: ArrayLike<number>,
  widthOctaves: number,
  outputHz: readonly number[],
): Float64Array {
  requireInRange(
    widthOctaves,
    { min: MIN_SMOOTHING_OCTAVES - 1e-12, max: MAX_SMOOTHING_OCTAVES },
    'smoothingOctaves',
    '/smoothingOctaves',
  );
  const n = frequenciesHz.length;
  if (n < 2 || values.length !== n) {
    throw new CalculationInputError(
      `smoothing needs at least 2 points and as many values as frequencies; received ${n} frequencies and ${values.length} values`,
      '/frequenciesHz',
    );
  }
  const cumulative = new Float64Array(n);
  for (let i = 1; i < n; i++) {
    const df = frequenciesHz[i] - frequenciesHz[i - 1];
    if (!(df > 0)) {
      throw new CalculationInputError(
        `frequencies must ascend strictly; index ${i} does not`,
        `/frequenciesHz/${i}`,
      );
    }
    cumulative[i] = cumulative[i - 1] + (df * (values[i] + values[i - 1])) / 2;
  }
  const first = frequenciesHz[0];
  const last = frequenciesHz[n - 1];
  const halfRatio = Math.pow(2, widthOctaves / 2);

  const segmentOf = (x: number): number => {
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (frequenciesHz[mid] <= x) lo = mid;
      else hi = mid;
    }
    return lo;
  };
  const valueAt = (k: number, x: number): number =>
    values[k] +
    ((values[k + 1] - values[k]) * (x - frequenciesHz[k])) / (frequenciesHz[k + 1] - frequenciesHz[k]);
  const integralTo = (x: number): number => {
    const k = segmentOf(x);
    return cumulative[k] + ((x - frequenciesHz[k]) * (values[k] + valueAt(k, x))) / 2;
  };

  const out = new Float64Array(outputHz.length);
  outputHz.forEach((f, i) => {
    if (!(f >= first && f <= last)) {
      throw new CalculationInputError(
        `output frequency ${f} Hz lies outside the input range ${first}..${last} Hz`,
        `/outputHz/${i}`,
      );
    }
    const lo = Math.max(first, f / halfRatio);
    const hi = Math.min(last, f * halfRatio);
    out[i] = hi - lo > 1e-12 * f ? (integralTo(hi) - integralTo(lo)) / (hi - lo) : valueAt(segmentOf(f), f);
  });
  return out;
}

/**
 * Fractional-octave smoothing of a magnitude response given in decibels, by power averaging
 * (see {@link fractionalOctaveMean}).
 * @returns smoothed magnitude in dB at each output frequency.
 */
export function smoothMagnitudeDb(
  frequenciesHz: readonly number[],
  magnitudeDb: readonly number[],
  widthOctaves: number,
  outputHz: readonly number[] = frequenciesHz,
): number[] {
  const power = magnitudeDb.map((db) => Math.pow(10, db / 10));
  return Array.from(
    fractionalOctaveMean(frequenciesHz, power, widthOctaves, outputHz),
    (p) => 10 * Math.log10(p),
  );
}
