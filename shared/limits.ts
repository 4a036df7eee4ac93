/**
 * Every bound and default that the contract, the calculation core, the API and the console share,
 * written once. Each entry uses JSON Schema's keyword names; a schema in `openapi/` that carries a
 * bound names its entry with `x-limit: <name>`, and `tests/contract/limits.test.ts` checks that every
 * bound in the contract equals the entry it names (and that no bound goes without one).
 */
export interface Bound {
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
  minLength?: number;
  maxLength?: number;
  default?: number | string | boolean;
}

const MiB = 1024 * 1024;

/** Most channels (loudspeaker feeds) one request may carry. */
export const MAX_CHANNELS = 128;
/** Most EQ sections one channel or one `/v1/biquads` request may carry. */
export const MAX_EQ_BANDS = 64;

export const LIMITS = {
  sampleRateHz: { minimum: 8000, maximum: 384000, default: 48000 },
  channels: { minItems: 1, maxItems: MAX_CHANNELS },
  eqBands: { maxItems: MAX_EQ_BANDS },
} as const satisfies Record<string, Bound>;

/** The sample rate used when a request gives none (the common rate of studio processors). */
export const DEFAULT_SAMPLE_RATE_HZ = LIMITS.sampleRateHz.default;
export const SAMPLE_RATE_MIN_HZ = LIMITS.sampleRateHz.minimum;
export const SAMPLE_RATE_MAX_HZ = LIMITS.sampleRateHz.maximum;

/** Largest uploaded file (a WAV impulse response or a text frequency response), bytes. */
export const MAX_UPLOAD_BYTES = 20 * MiB;

/** multer's limits for one uploaded file and a few short text fields. */
export const UPLOAD_LIMITS = {
  fileSize: MAX_UPLOAD_BYTES,
  files: 1,
  fields: 16,
  fieldSize: 4096,
  parts: 18,
} as const;
