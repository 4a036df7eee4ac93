import { isSection, logFrequencies } from './biquad-response';

describe('logFrequencies', () => {
  it('spaces points evenly per octave and ends exactly at the upper frequency', () => {
    const grid = logFrequencies(20, 20000, 3);
    expect(grid[0]).toBe(20);
    expect(grid[3]).toBeCloseTo(40, 12);
    expect(grid[grid.length - 1]).toBe(20000);
    expect(grid.length).toBe(Math.ceil(Math.log2(1000) * 3) + 1);
    expect(logFrequencies(100, 50)).toEqual([]);
  });
});

describe('isSection', () => {
  it('requires five finite numbers', () => {
    expect(isSection({ b0: 1, b1: 0, b2: 0, a1: 0, a2: 0, type: 'peaking' })).toBe(true);
    expect(isSection({ b0: 1, b1: 0, b2: 0, a1: 0 })).toBe(false);
    expect(isSection({ b0: 1, b1: 0, b2: 0, a1: 0, a2: Number.NaN })).toBe(false);
    expect(isSection(null)).toBe(false);
  });
});
