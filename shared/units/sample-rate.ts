import { requireInRange } from '../errors';
import { DEFAULT_SAMPLE_RATE_HZ, SAMPLE_RATE_MAX_HZ, SAMPLE_RATE_MIN_HZ } from '../limits';

export { DEFAULT_SAMPLE_RATE_HZ, SAMPLE_RATE_MAX_HZ, SAMPLE_RATE_MIN_HZ };

/**
 * Checks a sample rate in hertz against 8 kHz..384 kHz and returns it. For callers outside the API
 * (the contract already checks every request); the calculations themselves only check physics.
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
