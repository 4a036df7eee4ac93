import { expectWithin } from '../filters/test-helpers';
import { sosfilt } from './sosfilt';

describe('sosfilt (transposed direct form II)', () => {
  it('gives the impulse response of y[n] = x[n] + 0.5·y[n−1], 0.5^n (difference equation)', () => {
    const x = new Float64Array(10);
    x[0] = 1;
    const y = sosfilt([{ b0: 1, b1: 0, b2: 0, a1: -0.5, a2: 0 }], x);
    y.forEach((v, n) => expectWithin(v, Math.pow(0.5, n), 1e-15, `h[${n}]`));
  });

  it('runs sections in series without changing the input: FIR [1, 2, 1] twice is [1, 4, 6, 4, 1]', () => {
    const x = new Float64Array(6);
    x[0] = 1;
    const fir = { b0: 1, b1: 2, b2: 1, a1: 0, a2: 0 };
    expect(Array.from(sosfilt([fir, fir], x))).toEqual([1, 4, 6, 4, 1, 0]);
    expect(x[0]).toBe(1);
  });

  it('refuses an empty cascade', () => {
    expect(() => sosfilt([], [1])).toThrow(/at least one section/);
  });
});
