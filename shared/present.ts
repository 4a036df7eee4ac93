/**
 * How answers present numbers, the rule the contract states once (openapi.yaml, "Numbers in answers"):
 * a value whose name carries a unit is rounded for people to read — milliseconds to 4 decimals (0.1 µs,
 * far below the 100 µs alignment tolerance of ITU-R BS.2051-3), decibels to 2, hertz to 2, samples
 * (fractional with ms-based processors) to 4, microseconds to 1. Everything else — biquad coefficients,
 * Q, distances, angles, counts — is answered at full precision.
 *
 * The unit is read from the property name as the project writes names (delayMs, trimDb, peakDbfs,
 * frequencyHz, frequenciesHz, delaySamples, quantizationErrorUs, delayMsDifference): a unit token is a
 * capitalised word followed by the next capitalised word or the end of the name. The parts of a
 * unit-named array or object without a unit of their own are in that unit (residualRmsDb.before).
 *
 * Pure and shared so that messages (which name numbers in words) round exactly as the values do.
 */

const UNIT_DECIMALS: ReadonlyArray<readonly [unit: string, decimals: number]> = [
  ['Ms', 4],
  ['Us', 1],
  ['Dbfs', 2],
  ['Db', 2],
  ['Hz', 2],
  ['Samples', 4],
];

const UNIT_TOKEN = new RegExp(`(${UNIT_DECIMALS.map(([u]) => u).join('|')})(?=[A-Z]|$)`);
const DECIMALS = new Map(UNIT_DECIMALS);

/** Decimals the answer shows for a property of this name, or undefined when it stays at full precision. */
export function presentationDecimals(name: string): number | undefined {
  // Answers use a few hundred property names, met again and again: worked out once each (a bounded
  // cache, so that the names of a caller's own objects cannot grow it without end).
  let decimals = decimalsByName.get(name);
  if (decimals === undefined) {
    const unit = UNIT_TOKEN.exec(name)?.[1];
    decimals = unit === undefined ? NONE : (DECIMALS.get(unit) ?? NONE);
    if (decimalsByName.size >= MAX_CACHED_NAMES) decimalsByName.clear();
    decimalsByName.set(name, decimals);
  }
  return decimals === NONE ? undefined : decimals;
}

const NONE = -1;
const MAX_CACHED_NAMES = 4096;
const decimalsByName = new Map<string, number>();

/**
 * `value` rounded half away from zero to `decimals`, without float noise (integer / 10^d is the double
 * nearest the decimal, so it prints as written); −0 becomes 0; non-finite values pass through.
 */
export function roundTo(value: number, decimals: number): number {
  if (!Number.isFinite(value)) return value;
  const scale = 10 ** decimals;
  const rounded = (Math.sign(value) * Math.round(Math.abs(value) * scale)) / scale;
  return rounded === 0 ? 0 : rounded;
}

/** Milliseconds as answers show them (4 decimals). */
export const presentMs = (ms: number): number => roundTo(ms, 4);
/** Decibels as answers show them (2 decimals). */
export const presentDb = (db: number): number => roundTo(db, 2);
/** Hertz as answers show them (2 decimals). */
export const presentHz = (hz: number): number => roundTo(hz, 2);
/** Samples as answers show them (4 decimals; whole unless an ms-based processor makes them fractional). */
export const presentSamples = (samples: number): number => roundTo(samples, 4);

/**
 * A JSON value with every unit-named number (and every number in a unit-named array) rounded by the
 * rule above; a new value, the input untouched. Strings are never changed: they may be the caller's own
 * text, so messages round their figures where they are written (presentMs/presentDb/presentHz).
 */
export function presentNumbers<T>(value: T): T {
  return present(value, undefined) as T;
}

function present(value: unknown, decimals: number | undefined): unknown {
  if (typeof value === 'number') return decimals === undefined ? value : roundTo(value, decimals);
  if (Array.isArray(value)) return value.map((item) => present(item, decimals));
  if (value === null || typeof value !== 'object') return value;
  // What serialises itself (a Date) is left to do so, as JSON.stringify would.
  if (typeof (value as { toJSON?: unknown }).toJSON === 'function') return value;
  const out: Record<string, unknown> = {};
  // A part of a unit-named object without a unit of its own is in that unit (residualRmsDb.before).
  for (const [key, child] of Object.entries(value)) {
    out[key] = present(child, presentationDecimals(key) ?? decimals);
  }
  return out;
}

/**
 * The same rule as a `JSON.stringify` replacer (and Express's `json replacer` setting): called with
 * each property name before its value is written. A unit-named array or object is presented whole
 * here, because its items are later visited under their index or own name, which may name no unit.
 */
export function presentationReplacer(this: unknown, key: string, value: unknown): unknown {
  if (key === '') return value;
  const decimals = presentationDecimals(key);
  if (decimals === undefined) return value;
  return present(value, decimals);
}
