import { CalculationInputError } from '../errors';
import type { ProcessorProfileSettings, SteppedRange } from './profile';

const REQUIRED_COEFFICIENTS = ['b0', 'b1', 'b2', 'a1', 'a2'] as const;

function orderedRange(range: SteppedRange, field: string): void {
  if (range.min > range.max) {
    throw new CalculationInputError(
      `min (${range.min}) must not be above max (${range.max})`,
      `${field}/min`,
    );
  }
}

/**
 * What the contract cannot say about a profile: each range's min at most its max, the coefficient
 * order naming b0, b1, b2, a1 and a2, decimal places given for the decimal format.
 * @throws CalculationInputError naming the field (`/eq/gainDb/min`, `/coefficients/order`).
 */
export function checkProcessorProfile(profile: ProcessorProfileSettings): void {
  orderedRange(profile.delay, '/delay');
  orderedRange(profile.trimDb, '/trimDb');
  orderedRange(profile.eq.frequencyHz, '/eq/frequencyHz');
  orderedRange(profile.eq.gainDb, '/eq/gainDb');
  orderedRange(profile.eq.q, '/eq/q');
  const missing = REQUIRED_COEFFICIENTS.filter((c) => !profile.coefficients.order.includes(c));
  if (missing.length > 0) {
    throw new CalculationInputError(
      `order must list b0, b1, b2, a1 and a2 (and a0 if the processor wants it written); missing ${missing.join(', ')}`,
      '/coefficients/order',
    );
  }
  if (profile.coefficients.numberFormat === 'decimal' && profile.coefficients.decimalPlaces === undefined) {
    throw new CalculationInputError(
      'decimalPlaces is required with the decimal number format',
      '/coefficients/decimalPlaces',
    );
  }
}
