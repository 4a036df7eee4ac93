import { CalculationInputError, requireInRange, withFieldPrefix } from '../errors';
import type { Sos } from '../dsp/sos';
import { LIMITS } from '../limits';

export type FilterType =
  'peaking' | 'lowShelf' | 'highShelf' | 'lowPass' | 'highPass' | 'bandPass' | 'notch' | 'allPass';

export const FILTER_TYPES: readonly FilterType[] = [
  'peaking',
  'lowShelf',
  'highShelf',
  'lowPass',
  'highPass',
  'bandPass',
  'notch',
  'allPass',
];

/**
 * One filter as a person describes it. Give at most one of `q`, `bandwidthOctaves` (peaking,
 * bandPass, notch) or `shelfSlope` (shelves). Without any, Q = 1/√2 is used, or S = 1 for shelves.
 */
export interface FilterSpec {
  type: FilterType;
  /** Centre, corner or shelf-midpoint frequency in hertz. */
  frequencyHz: number;
  /** Gain in dB; required by peaking and the shelves, refused by the other types. */
  gainDb?: number;
  q?: number;
  bandwidthOctaves?: number;
  shelfSlope?: number;
}

/**
 * Ranges accepted by designBiquad (chosen to cover studio EQ and crossovers with margin), read from the
 * contract's bounds in shared/limits.ts so that the core and the API refuse the same values.
 */
export const FILTER_LIMITS = {
  frequencyMinHz: LIMITS.frequencyHz.minimum,
  gainMinDb: LIMITS['FilterSpec.gainDb'].minimum,
  gainMaxDb: LIMITS['FilterSpec.gainDb'].maximum,
  qMin: LIMITS.q.minimum,
  qMax: LIMITS.q.maximum,
  bandwidthMinOctaves: LIMITS.bandwidthOctaves.minimum,
  bandwidthMaxOctaves: LIMITS.bandwidthOctaves.maximum,
  shelfSlopeMin: LIMITS.shelfSlope.minimum,
  shelfSlopeMax: LIMITS.shelfSlope.maximum,
} as const;

const GAIN_TYPES: ReadonlySet<FilterType> = new Set(['peaking', 'lowShelf', 'highShelf']);
const BANDWIDTH_TYPES: ReadonlySet<FilterType> = new Set(['peaking', 'bandPass', 'notch']);
const SHELF_TYPES: ReadonlySet<FilterType> = new Set(['lowShelf', 'highShelf']);

/**
 * Designs one biquad section from the Audio EQ Cookbook (W3C Working Group Note, 8 June 2021, after
 * R. Bristow-Johnson), divided through by a0.
 *
 * - `A = 10^(gainDb/40)`, `w0 = 2π·frequencyHz/sampleRateHz`;
 * - `alpha = sin(w0)/(2Q)`, or from bandwidth `sin(w0)·sinh(ln2/2 · BW · w0/sin(w0))`, or from shelf
 *   slope `sin(w0)/2 · sqrt((A + 1/A)(1/S − 1) + 2)`.
 * - `bandPass` is the cookbook's constant 0 dB peak gain variant (b0 = alpha, b1 = 0, b2 = −alpha),
 *   so its gain at f0 is 0 dB whatever the Q (the same variant as the Web Audio `bandpass`).
 * - `1 − cos w0` and `1 + cos w0` are computed as `2 sin²(w0/2)` and `2 cos²(w0/2)` to keep their
 *   precision at low and near-Nyquist frequencies.
 *
 * @param spec the filter, each value within FILTER_LIMITS; frequencyHz in hertz, below sampleRateHz/2;
 *   shelfSlope S = 1 is the steepest monotonic shelf.
 * @param sampleRateHz processor sample rate in hertz (SAMPLE_RATE_MIN_HZ..SAMPLE_RATE_MAX_HZ; the API's contract checks the range,
 *   this function only that the filter lies below Nyquist).
 * @returns the normalised section, tagged with the filter type.
 * @throws CalculationInputError naming the bad field (`/frequencyHz`, `/q`, ...) relative to the spec.
 */
export function designBiquad(spec: FilterSpec, sampleRateHz: number): Sos {
  const fs = sampleRateHz;
  if (!FILTER_TYPES.includes(spec.type)) {
    throw new CalculationInputError(
      `type must be one of ${FILTER_TYPES.join(', ')}; received ${String(spec.type)}`,
      '/type',
    );
  }
  const f0 = requireInRange(
    spec.frequencyHz,
    { min: FILTER_LIMITS.frequencyMinHz, max: fs / 2, exclusiveMax: true, unit: 'Hz' },
    'frequencyHz',
    '/frequencyHz',
  );
  const gainDb = readGain(spec);
  const A = Math.pow(10, gainDb / 40);
  const w0 = (2 * Math.PI * f0) / fs;
  const sinW0 = Math.sin(w0);
  const cosW0 = Math.cos(w0);
  const oneMinusCos = 2 * Math.sin(w0 / 2) ** 2;
  const onePlusCos = 2 * Math.cos(w0 / 2) ** 2;
  const alpha = readAlpha(spec, A, w0, sinW0);

  const [b0, b1, b2, a0, a1, a2] = rawCoefficients(spec.type, { A, cosW0, oneMinusCos, onePlusCos, alpha });
  const section: Sos = {
    type: spec.type,
    b0: b0 / a0,
    b1: b1 / a0,
    b2: b2 / a0,
    a1: a1 / a0,
    a2: a2 / a0,
  };
  if (![section.b0, section.b1, section.b2, section.a1, section.a2].every(Number.isFinite)) {
    throw new CalculationInputError(
      `the filter cannot be realised at ${f0} Hz and ${fs} Hz sampling with these parameters`,
      '/frequencyHz',
    );
  }
  return section;
}

/**
 * Designs a list of filters; errors name the item, e.g. `/filters/2/q` with `pointerPrefix = '/filters'`.
 */
export function designBiquads(specs: FilterSpec[], sampleRateHz: number, pointerPrefix = '/filters'): Sos[] {
  return specs.map((spec, i) =>
    withFieldPrefix(`${pointerPrefix}/${i}`, () => designBiquad(spec, sampleRateHz)),
  );
}

function readGain(spec: FilterSpec): number {
  if (!GAIN_TYPES.has(spec.type)) {
    if (spec.gainDb !== undefined) {
      throw new CalculationInputError(
        `gainDb applies only to peaking, lowShelf and highShelf filters, not to ${spec.type}`,
        '/gainDb',
      );
    }
    return 0;
  }
  if (spec.gainDb === undefined) {
    throw new CalculationInputError(`gainDb is required for a ${spec.type} filter`, '/gainDb');
  }
  return requireInRange(
    spec.gainDb,
    { min: FILTER_LIMITS.gainMinDb, max: FILTER_LIMITS.gainMaxDb, unit: 'dB' },
    'gainDb',
    '/gainDb',
  );
}

function readAlpha(spec: FilterSpec, A: number, w0: number, sinW0: number): number {
  const given = (['q', 'bandwidthOctaves', 'shelfSlope'] as const).filter((key) => spec[key] !== undefined);
  if (given.length > 1) {
    throw new CalculationInputError(`give only one of q, bandwidthOctaves or shelfSlope`, `/${given[1]}`);
  }
  if (spec.bandwidthOctaves !== undefined) {
    if (!BANDWIDTH_TYPES.has(spec.type)) {
      throw new CalculationInputError(
        `bandwidthOctaves applies only to peaking, bandPass and notch filters, not to ${spec.type}`,
        '/bandwidthOctaves',
      );
    }
    const bw = requireInRange(
      spec.bandwidthOctaves,
      { min: FILTER_LIMITS.bandwidthMinOctaves, max: FILTER_LIMITS.bandwidthMaxOctaves, unit: 'octaves' },
      'bandwidthOctaves',
      '/bandwidthOctaves',
    );
    const alpha = sinW0 * Math.sinh(((Math.LN2 / 2) * bw * w0) / sinW0);
    // Past about 1e16, a2 = (1 − alpha)/(1 + alpha) rounds to −1: a pole on the unit circle, whose
    // response at 0 Hz is 0/0. Same cause as an infinite alpha, same answer.
    if (!Number.isFinite(alpha) || (1 - alpha) / (1 + alpha) <= -1) {
      throw new CalculationInputError(
        `bandwidthOctaves ${bw} is too wide this close to Nyquist; give a smaller bandwidth or a q`,
        '/bandwidthOctaves',
      );
    }
    return alpha;
  }
  if (spec.shelfSlope !== undefined) {
    if (!SHELF_TYPES.has(spec.type)) {
      throw new CalculationInputError(
        `shelfSlope applies only to lowShelf and highShelf filters, not to ${spec.type}`,
        '/shelfSlope',
      );
    }
    const s = requireInRange(
      spec.shelfSlope,
      { min: FILTER_LIMITS.shelfSlopeMin, max: FILTER_LIMITS.shelfSlopeMax },
      'shelfSlope',
      '/shelfSlope',
    );
    return (sinW0 / 2) * Math.sqrt((A + 1 / A) * (1 / s - 1) + 2);
  }
  if (spec.q !== undefined) {
    const q = requireInRange(spec.q, { min: FILTER_LIMITS.qMin, max: FILTER_LIMITS.qMax }, 'q', '/q');
    return sinW0 / (2 * q);
  }
  return SHELF_TYPES.has(spec.type) ? (sinW0 / 2) * Math.SQRT2 : sinW0 / (2 * Math.SQRT1_2);
}

interface Terms {
  A: number;
  cosW0: number;
  oneMinusCos: number;
  onePlusCos: number;
  alpha: number;
}

/** Cookbook table, before division by a0: [b0, b1, b2, a0, a1, a2]. */
function rawCoefficients(type: FilterType, t: Terms): [number, number, number, number, number, number] {
  const { A, cosW0, oneMinusCos, onePlusCos, alpha } = t;
  switch (type) {
    case 'lowPass':
      return [oneMinusCos / 2, oneMinusCos, oneMinusCos / 2, 1 + alpha, -2 * cosW0, 1 - alpha];
    case 'highPass':
      return [onePlusCos / 2, -onePlusCos, onePlusCos / 2, 1 + alpha, -2 * cosW0, 1 - alpha];
    case 'bandPass':
      return [alpha, 0, -alpha, 1 + alpha, -2 * cosW0, 1 - alpha];
    case 'notch':
      return [1, -2 * cosW0, 1, 1 + alpha, -2 * cosW0, 1 - alpha];
    case 'allPass':
      return [1 - alpha, -2 * cosW0, 1 + alpha, 1 + alpha, -2 * cosW0, 1 - alpha];
    case 'peaking':
      return [1 + alpha * A, -2 * cosW0, 1 - alpha * A, 1 + alpha / A, -2 * cosW0, 1 - alpha / A];
    case 'lowShelf': {
      const k = 2 * Math.sqrt(A) * alpha;
      return [
        A * (A + 1 - (A - 1) * cosW0 + k),
        2 * A * (A - 1 - (A + 1) * cosW0),
        A * (A + 1 - (A - 1) * cosW0 - k),
        A + 1 + (A - 1) * cosW0 + k,
        -2 * (A - 1 + (A + 1) * cosW0),
        A + 1 + (A - 1) * cosW0 - k,
      ];
    }
    case 'highShelf': {
      const k = 2 * Math.sqrt(A) * alpha;
      return [
        A * (A + 1 + (A - 1) * cosW0 + k),
        -2 * A * (A - 1 + (A + 1) * cosW0),
        A * (A + 1 + (A - 1) * cosW0 - k),
        A + 1 - (A - 1) * cosW0 + k,
        2 * (A - 1 - (A + 1) * cosW0),
        A + 1 - (A - 1) * cosW0 - k,
      ];
    }
  }
}
