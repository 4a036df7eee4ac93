import { getWindow, halfHannFall } from './windows';

describe('getWindow (scipy.signal.get_window, symmetric)', () => {
  it('hann is 0.5 − 0.5·cos(2πn/(N−1)): zero at both ends, 1 in the middle (Harris 1978)', () => {
    const w = getWindow('hann', 9);
    expect(w[0]).toBe(0);
    expect(w[8]).toBeCloseTo(0, 15);
    expect(w[4]).toBeCloseTo(1, 15);
    expect(w[2]).toBeCloseTo(0.5 - 0.5 * Math.cos(Math.PI / 2), 15);
    for (let n = 0; n < 9; n++) expect(w[n]).toBeCloseTo(w[8 - n], 15);
  });
  it('blackmanharris has the 4-term minimum coefficients: 6e-5 at the ends, 1 in the middle (Harris 1978)', () => {
    const w = getWindow('blackmanharris', 101);
    expect(w[0]).toBeCloseTo(0.35875 - 0.48829 + 0.14128 - 0.01168, 12);
    expect(w[50]).toBeCloseTo(1, 12);
  });
  it('boxcar is ones; a one-point window is 1; fewer points are refused', () => {
    expect(Array.from(getWindow('boxcar', 3))).toEqual([1, 1, 1]);
    expect(Array.from(getWindow('hann', 1))).toEqual([1]);
    expect(() => getWindow('hann', 0)).toThrow();
  });
  it('halfHannFall runs from just under 1 to just over 0', () => {
    const w = halfHannFall(4);
    expect(w[0]).toBeLessThan(1);
    expect(w[3]).toBeGreaterThan(0);
    for (let n = 1; n < 4; n++) expect(w[n]).toBeLessThan(w[n - 1]);
  });
});
