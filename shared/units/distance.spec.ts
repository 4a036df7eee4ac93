import { catchInputError, expectWithin } from '../filters/test-helpers';
import { parseDistanceM } from './distance';

describe('parseDistanceM', () => {
  // International yard and pound agreement (1959): 1 ft = 0.3048 m, 1 in = 0.0254 m exactly.
  it.each([
    ['10.5 ft', 10.5 * 0.3048],
    ['126 in', 126 * 0.0254],
    ['3.2 m', 3.2],
    ['320 cm', 3.2],
    ['3200 mm', 3.2],
    [' 3.2  m ', 3.2],
    [3.2, 3.2],
    [0.01, 0.01],
    [1000, 1000],
  ])('reads %p as %d m', (input, metres) => {
    expectWithin(parseDistanceM(input, '/d'), metres, 1e-12, String(input));
  });

  it.each([
    ['3.2', 'no unit'],
    ['m', 'no value'],
    ['5 kg', 'a mass'],
    ['3 s', 'a time'],
    ['3 m^2', 'an area'],
    ['3 m + 2 ft', 'an expression'],
    ['NaN m', 'NaN'],
    ['Infinity m', 'Infinity'],
    ['1e400 m', 'an overflowing value'],
    ['-3 m', 'a negative length'],
    ['0 m', 'zero'],
    ['2 km', 'more than 1000 m'],
    ['3,2 m', 'a decimal comma'],
    ['', 'an empty string'],
    ['1'.repeat(41) + ' m', 'a string over 40 characters'],
    [0, 'zero metres'],
    [-1, 'negative metres'],
    [1000.5, 'more than 1000 m'],
    [NaN, 'NaN'],
    [Infinity, 'Infinity'],
    [{ value: 3 }, 'an object'],
  ])('refuses %p (%s), naming the field', (input, _why) => {
    const error = catchInputError(() => parseDistanceM(input as never, '/channels/2/distance'));
    expect(error.field).toBe('/channels/2/distance');
    expect(error.message).toMatch(/distance must be/);
  });
});
