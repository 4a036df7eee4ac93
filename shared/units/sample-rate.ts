import { requireInRange } from '../errors';

/** Lowest and highest processor sample rates the calculations accept, in hertz. */
export const SAMPLE_RATE_MIN_HZ = 8000;
export const SAMPLE_RATE_MAX_HZ = 384000;
/** The sample rate used when a request gives none (the common rate of studio processors). */
export const DEFAULT_SAMPLE_RATE_HZ = 48000;

/**
 * Checks a sample rate in hertz against 8 kHz..384 kHz and returns it.
 * @param field JSON-pointer-like path used in the error.
 */
export function requireSampleRate(sampleRateHz: unknown, field = '/sampleRateHz'): number {
  return requireInRange(
    sampleRateHz,
    { min: SAMPLE_RATE_MIN_HZ, max: SAMPLE_RATE_MAX_HZ, unit: 'Hz' },
    'sampleRateHz',
    field,
  );
}
