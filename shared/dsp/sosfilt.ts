import { CalculationInputError } from '../errors';
import type { Sos } from './sos';

/**
 * Runs a signal through a cascade of sections (transposed direct form II, double precision, zero initial
 * state), as scipy.signal.sosfilt does.
 * @returns a new array; the input is not changed.
 */
export function sosfilt(sections: readonly Sos[], samples: ArrayLike<number>): Float64Array {
  if (sections.length === 0) throw new CalculationInputError('at least one section is needed', '/sections');
  const out = Float64Array.from(samples);
  for (const { b0, b1, b2, a1, a2 } of sections) {
    let z1 = 0;
    let z2 = 0;
    for (let i = 0; i < out.length; i++) {
      const x = out[i];
      const y = b0 * x + z1;
      z1 = b1 * x - a1 * y + z2;
      z2 = b2 * x - a2 * y;
      out[i] = y;
    }
  }
  return out;
}
