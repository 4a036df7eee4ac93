import { unit, type Unit } from 'mathjs';
import { CalculationInputError, requireInRange } from '../errors';
import { LIMITS } from '../limits';

/** A distance as a request gives it: metres as a number, or a string with a length unit. */
export type DistanceInput = number | string;

/** Longest distance accepted, in metres. */
export const DISTANCE_MAX_M = LIMITS['Distance|number'].maximum;
const DISTANCE_STRING_MAX_LENGTH = LIMITS['Distance|string'].maxLength;
const METRE = unit('m');

/**
 * Converts a distance to metres. A number is metres; a string is a value and a length unit parsed
 * by mathjs (`"3.2 m"`, `"10.5 ft"`, `"126 in"`, `"320 cm"`; mathjs uses the international foot,
 * 0.3048 m). Only a single value with a unit is parsed, never an expression.
 * @param field JSON-pointer-like path of the input, used in errors.
 * @returns metres, greater than 0 and at most 1000.
 * @throws CalculationInputError when the string is not a length or the value is out of range.
 */
export function parseDistanceM(distance: DistanceInput, field: string): number {
  if (typeof distance === 'number') {
    return requireInRange(
      distance,
      { min: 0, exclusiveMin: true, max: DISTANCE_MAX_M, unit: 'm' },
      'distance',
      field,
    );
  }
  if (typeof distance !== 'string' || distance.length > DISTANCE_STRING_MAX_LENGTH) {
    throw new CalculationInputError(
      `distance must be a number of metres or a string such as "3.2 m" or "10.5 ft" (at most ${DISTANCE_STRING_MAX_LENGTH} characters)`,
      field,
    );
  }
  let parsed: Unit;
  try {
    parsed = unit(distance);
  } catch {
    throw notALength(distance, field);
  }
  if (parsed.value === null || !parsed.equalBase(METRE)) throw notALength(distance, field);
  const metres = parsed.toNumber('m');
  if (!Number.isFinite(metres) || metres <= 0 || metres > DISTANCE_MAX_M) {
    throw new CalculationInputError(
      `distance must be greater than 0 m and at most ${DISTANCE_MAX_M} m; received "${distance}"`,
      field,
    );
  }
  return metres;
}

function notALength(distance: string, field: string): CalculationInputError {
  return new CalculationInputError(
    `distance must be a length with a unit, such as "3.2 m", "10.5 ft" or "126 in"; received "${distance}"`,
    field,
  );
}
