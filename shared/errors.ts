/**
 * A calculation input that is well formed but cannot be used (out of range, not a length, a
 * frequency at or above Nyquist). `field` is a JSON-pointer-like path to the bad input, relative to
 * the object the calculation received (for example `/channels/2/distance`); the API layer turns it
 * into a problem document naming that field.
 */
export class CalculationInputError extends Error {
  override readonly name = 'CalculationInputError';

  constructor(
    message: string,
    readonly field: string,
  ) {
    super(message);
  }
}

/**
 * Runs `fn` and re-throws any CalculationInputError with `prefix` put in front of its field, so a
 * function that validates one item (`/frequencyHz`) can be reused for a list (`/filters/3/frequencyHz`).
 */
export function withFieldPrefix<T>(prefix: string, fn: () => T): T {
  try {
    return fn();
  } catch (error) {
    if (error instanceof CalculationInputError) {
      throw new CalculationInputError(error.message, prefix + error.field);
    }
    throw error;
  }
}

/** Throws unless `value` is a finite number. `name` is the parameter name used in the message. */
export function requireFinite(value: unknown, name: string, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new CalculationInputError(`${name} must be a finite number; received ${String(value)}`, field);
  }
  return value;
}

export interface RangeBounds {
  min?: number;
  max?: number;
  /** When true, `min` itself is not allowed. */
  exclusiveMin?: boolean;
  /** When true, `max` itself is not allowed. */
  exclusiveMax?: boolean;
  /** Unit appended to the bounds in the message, e.g. `Hz`. */
  unit?: string;
}

/**
 * Throws unless `value` is finite and inside the bounds. The message names the parameter, the valid
 * range and the value received.
 */
export function requireInRange(value: unknown, bounds: RangeBounds, name: string, field: string): number {
  const v = requireFinite(value, name, field);
  const { min, max, exclusiveMin = false, exclusiveMax = false, unit } = bounds;
  const belowMin = min !== undefined && (exclusiveMin ? v <= min : v < min);
  const aboveMax = max !== undefined && (exclusiveMax ? v >= max : v > max);
  if (belowMin || aboveMax) {
    throw new CalculationInputError(
      `${name} must be ${describeRange(bounds)}; received ${v}${unit ? ' ' + unit : ''}`,
      field,
    );
  }
  return v;
}

function describeRange({ min, max, exclusiveMin, exclusiveMax, unit }: RangeBounds): string {
  const u = unit ? ' ' + unit : '';
  const low = min === undefined ? undefined : `${exclusiveMin ? 'greater than' : 'at least'} ${min}${u}`;
  const high = max === undefined ? undefined : `${exclusiveMax ? 'below' : 'at most'} ${max}${u}`;
  return [low, high].filter((part) => part !== undefined).join(' and ');
}

/** Throws unless `value` is an integer inside the bounds. */
export function requireInteger(value: unknown, bounds: RangeBounds, name: string, field: string): number {
  const v = requireInRange(value, bounds, name, field);
  if (!Number.isInteger(v)) {
    throw new CalculationInputError(`${name} must be an integer; received ${v}`, field);
  }
  return v;
}
