/**
 * Sample rates the console offers for a processor (a room's rate, an export without a profile): the
 * common studio rates, the 44.1 kHz and 48 kHz families up to 4×. Every one lies within the contract's
 * SAMPLE_RATE_MIN_HZ..SAMPLE_RATE_MAX_HZ and the list holds DEFAULT_SAMPLE_RATE_HZ (sample-rates.spec.ts).
 */
export const COMMON_SAMPLE_RATES_HZ: readonly number[] = [44100, 48000, 88200, 96000, 176400, 192000];
