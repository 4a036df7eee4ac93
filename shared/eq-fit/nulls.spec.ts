import { findNulls } from './nulls';

const grid = Array.from({ length: 241 }, (_, k) => 20 * Math.pow(2, k / 48));
/** A dip of the given depth (dB) and half-depth width (octaves) as a raised-cosine in log frequency. */
const dip = (centreHz: number, depthDb: number, widthOctaves: number) =>
  grid.map((f) => {
    const x = Math.log2(f / centreHz) / widthOctaves;
    return Math.abs(x) < 1 ? (-depthDb * (1 + Math.cos(Math.PI * x))) / 2 : 0;
  });

describe('null detection (≥ 6 dB deep, ≤ 1/3 octave wide at half depth; product choice)', () => {
  it('finds a narrow deep dip at its bottom and reports depth and width', () => {
    const [found, ...rest] = findNulls(grid, dip(100, 15, 0.2));
    expect(rest).toEqual([]);
    // The grid steps 1/48 octave, so the bottom lies within half a step of 100 Hz.
    expect(Math.abs(Math.log2(found.frequencyHz / 100))).toBeLessThanOrEqual(1 / 96);
    expect(Math.abs(found.depthDb - 15)).toBeLessThan(0.2);
    // A raised cosine spanning ±w is below half depth over ±w/2: width w.
    expect(found.widthOctaves).toBeGreaterThan(0.15);
    expect(found.widthOctaves).toBeLessThan(0.25);
    expect(grid[found.first]).toBeLessThan(100 * Math.pow(2, -0.1));
    expect(grid[found.last]).toBeGreaterThan(100 * Math.pow(2, 0.1));
  });

  it('ignores shallow dips and broad ones', () => {
    expect(findNulls(grid, dip(100, 5, 0.2))).toEqual([]);
    expect(findNulls(grid, dip(100, 15, 1))).toEqual([]);
  });

  it('finds two separate nulls', () => {
    const a = dip(60, 12, 0.2);
    const b = dip(250, 9, 0.15);
    expect(
      findNulls(
        grid,
        a.map((v, i) => v + b[i]),
      ).map((n) => Math.round(n.frequencyHz)),
    ).toEqual([60, 250]);
  });
});
