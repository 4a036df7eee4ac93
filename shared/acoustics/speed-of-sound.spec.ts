import { catchInputError, expectWithin } from '../filters/test-helpers';
import { resolveSpeedOfSound, speedOfSoundMps } from './speed-of-sound';

describe('speedOfSoundMps', () => {
  // pyfar (ISO 9613-1 form): 343.2 m/s at the 20 °C reference temperature.
  it('is 343.2 m/s at 20 °C', () => {
    expectWithin(speedOfSoundMps(20), 343.2, 1e-9, 'c(20 °C)');
  });

  // The textbook form 331.3·sqrt(1 + t/273.15) agrees within 0.005 %.
  it('agrees with 331.3·sqrt(1 + t/273.15) within 0.005 % from −40 °C to +60 °C', () => {
    for (let t = -40; t <= 60; t += 2.5) {
      const textbook = 331.3 * Math.sqrt(1 + t / 273.15);
      expectWithin(speedOfSoundMps(t) / textbook, 1, 5e-5, `ratio at ${t} °C`);
    }
  });

  // From memory: about 331.3 m/s at 0 °C and about 346 m/s at 25 °C (handbook tables).
  it('gives about 331.3 m/s at 0 °C and 346.1 m/s at 25 °C', () => {
    expectWithin(speedOfSoundMps(0), 331.3, 0.05, 'c(0 °C)');
    expectWithin(speedOfSoundMps(25), 346.1, 0.1, 'c(25 °C)');
  });

  it.each([-40.01, 60.01])('refuses temperature %d °C, naming the range and the value', (t) => {
    const error = catchInputError(() => speedOfSoundMps(t));
    expect(error.field).toBe('/temperatureC');
    expect(error.message).toBe(`temperatureC must be at least -40 °C and at most 60 °C; received ${t} °C`);
  });

  it.each([NaN, Infinity])('refuses a temperature of %d', (t) => {
    expect(catchInputError(() => speedOfSoundMps(t)).message).toBe(
      `temperatureC must be a finite number; received ${t}`,
    );
  });
});

describe('resolveSpeedOfSound', () => {
  it('uses the given speed, else the temperature, else 20 °C', () => {
    expect(resolveSpeedOfSound({ speedOfSoundMps: 340 })).toBe(340);
    expect(resolveSpeedOfSound({ temperatureC: 20 })).toBe(speedOfSoundMps(20));
    expect(resolveSpeedOfSound({})).toBe(speedOfSoundMps(20));
    expectWithin(
      resolveSpeedOfSound({ temperatureC: 30 }),
      343.2 * Math.sqrt(303.15 / 293.15),
      1e-9,
      'c(30 °C)',
    );
  });

  it('refuses both a temperature and a speed, and speeds outside 300..400 m/s', () => {
    expect(catchInputError(() => resolveSpeedOfSound({ temperatureC: 20, speedOfSoundMps: 343 })).field).toBe(
      '/speedOfSoundMps',
    );
    expect(catchInputError(() => resolveSpeedOfSound({ speedOfSoundMps: 299 })).field).toBe(
      '/speedOfSoundMps',
    );
    expect(catchInputError(() => resolveSpeedOfSound({ speedOfSoundMps: 401 })).field).toBe(
      '/speedOfSoundMps',
    );
  });
});
