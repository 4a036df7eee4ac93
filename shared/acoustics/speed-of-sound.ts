import { CalculationInputError, requireInRange } from '../errors';

/** Air temperatures accepted, in °C (outdoor extremes are far outside any studio). */
export const TEMPERATURE_MIN_C = -40;
export const TEMPERATURE_MAX_C = 60;
/** Speeds of sound accepted when given directly, in m/s (dry air from about −50 °C to +90 °C). */
export const SPEED_OF_SOUND_MIN_MPS = 300;
export const SPEED_OF_SOUND_MAX_MPS = 400;
/** The air temperature assumed when a request gives neither a temperature nor a speed of sound. */
export const DEFAULT_TEMPERATURE_C = 20;

/**
 * Speed of sound in air from the air temperature:
 * `c = 343.2 · sqrt((t + 273.15) / 293.15)` m/s — the ISO 9613-1 form as implemented in the pyfar
 * library (343.2 m/s at the 20 °C reference). It ignores humidity and pressure, which change c by
 * well under 0.5 % indoors.
 * @param temperatureC air temperature in °C, −40..+60.
 * @returns speed of sound in metres per second.
 */
export function speedOfSoundMps(temperatureC: number, field = '/temperatureC'): number {
  const t = requireInRange(
    temperatureC,
    { min: TEMPERATURE_MIN_C, max: TEMPERATURE_MAX_C, unit: '°C' },
    'temperatureC',
    field,
  );
  return 343.2 * Math.sqrt((t + 273.15) / 293.15);
}

/**
 * The speed of sound a calculation uses: `speedOfSoundMps` when given (300..400 m/s), else from
 * `temperatureC`, else from 20 °C. Giving both is refused, since they could disagree.
 * @returns speed of sound in metres per second.
 */
export function resolveSpeedOfSound(input: { temperatureC?: number; speedOfSoundMps?: number }): number {
  if (input.speedOfSoundMps !== undefined) {
    if (input.temperatureC !== undefined) {
      throw new CalculationInputError(
        'give either temperatureC or speedOfSoundMps, not both',
        '/speedOfSoundMps',
      );
    }
    return requireInRange(
      input.speedOfSoundMps,
      { min: SPEED_OF_SOUND_MIN_MPS, max: SPEED_OF_SOUND_MAX_MPS, unit: 'm/s' },
      'speedOfSoundMps',
      '/speedOfSoundMps',
    );
  }
  return speedOfSoundMps(input.temperatureC ?? DEFAULT_TEMPERATURE_C);
}
