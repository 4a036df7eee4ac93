import { catchInputError, expectWithin } from '../filters/test-helpers';
import { logFrequencyGrid, responseGrid } from './grid';

describe('logFrequencyGrid', () => {
  it('ends: both ends are points and every step is the same ratio (numpy.geomspace)', () => {
    const grid = logFrequencyGrid(20, 20000, 3);
    // log2(1000)·3 = 29.9 steps, rounded to 30.
    expect(grid).toHaveLength(31);
    expect(grid[0]).toBe(20);
    expect(grid[30]).toBe(20000);
    for (let i = 1; i < grid.length; i++)
      expectWithin(grid[i] / grid[i - 1], Math.pow(1000, 1 / 30), 1e-12, `step ${i}`);
    expect(logFrequencyGrid(1000, 1000, 12)).toEqual([1000]);
  });

  it('ends: a whole number of octaves from the start gives its octaves exactly (up to rounding)', () => {
    const grid = logFrequencyGrid(10, 10 * 2 ** 11, 24);
    expect(grid).toHaveLength(11 * 24 + 1);
    for (const k of [24, 72, 168]) expectWithin(grid[k], 10 * 2 ** (k / 24), 1e-9, `10·2^(${k}/24) Hz`);
  });

  it('iec: lays the one-third-octave grid on the IEC 61260-1 centres 1000·10^(x/10)', () => {
    const grid = logFrequencyGrid(19, 21000, 3, 'iec');
    expect(grid).toHaveLength(31);
    grid.forEach((f, i) => expectWithin(f, 1000 * Math.pow(10, (i - 17) / 10), 1e-9 * f, `x=${i - 17}`));
  });

  it('iec: grids of different ranges share their points', () => {
    const wide = logFrequencyGrid(20, 20000, 48, 'iec');
    const narrow = logFrequencyGrid(100, 1000, 48, 'iec');
    const offset = wide.findIndex((f) => f >= 100);
    narrow.forEach((f, i) => expect(wide[offset + i]).toBe(f));
  });

  it.each([
    [0, 100, 12, '/fromHz'],
    [200, 100, 12, '/toHz'],
    [20, 100, 0, '/pointsPerOctave'],
    [20, 100, 97, '/pointsPerOctave'],
  ])('refuses %p..%p Hz at %p points per octave, naming %s', (from, to, ppo, field) => {
    expect(catchInputError(() => logFrequencyGrid(from, to, ppo)).field).toBe(field);
  });
});

describe('responseGrid', () => {
  it('sweeps 20 Hz to 20480 Hz at 12 points per octave in 121 points with both ends included', () => {
    const grid = responseGrid({ fromHz: 20, toHz: 20480, pointsPerOctave: 12 }, 48000);
    expect(grid).toHaveLength(121);
    expect(grid[0]).toBe(20);
    expect(grid[120]).toBe(20480);
    for (let i = 1; i < grid.length; i++)
      expectWithin(grid[i] / grid[i - 1], Math.pow(2, 1 / 12), 1e-12, `step ${i}`);
  });

  it('defaults to 12 points per octave and returns listed frequencies as given', () => {
    expect(responseGrid({ fromHz: 100, toHz: 200 }, 48000)).toHaveLength(13);
    expect(responseGrid({ fromHz: 1000, toHz: 1000 }, 48000)).toEqual([1000]);
    expect(responseGrid({ frequenciesHz: [80, 1000, 24000] }, 48000)).toEqual([80, 1000, 24000]);
  });

  it.each([
    [{ fromHz: 0, toHz: 100 }, '/fromHz'],
    [{ fromHz: 200, toHz: 100 }, '/toHz'],
    [{ fromHz: 20, toHz: 30000 }, '/toHz'],
    [{ fromHz: 20, toHz: 20000, pointsPerOctave: 0 }, '/pointsPerOctave'],
    [{ fromHz: 20, toHz: 20000, pointsPerOctave: 97 }, '/pointsPerOctave'],
    [{ fromHz: 20, toHz: 20000, pointsPerOctave: 2.5 }, '/pointsPerOctave'],
    [{ fromHz: 1e-9, toHz: 24000, pointsPerOctave: 96 }, '/pointsPerOctave'],
    [{ frequenciesHz: [] }, '/frequenciesHz'],
    [{ frequenciesHz: new Array(4097).fill(100) }, '/frequenciesHz'],
    [{ frequenciesHz: [100, 0] }, '/frequenciesHz/1'],
    [{ frequenciesHz: [100, 24001] }, '/frequenciesHz/1'],
  ])('refuses %p', (grid, field) => {
    expect(catchInputError(() => responseGrid(grid, 48000)).field).toBe(field);
  });
});
