import { expectWithin } from '../filters/test-helpers';
import { levenbergMarquardt, type LeastSquaresProblem } from './least-squares';

/** y = a·exp(−b·x) sampled at x = 0..19, with numeric Jacobian. */
function exponentialProblem(a: number, b: number, lower: number[], upper: number[]): LeastSquaresProblem {
  const xs = Array.from({ length: 20 }, (_, i) => i / 4);
  const ys = xs.map((x) => a * Math.exp(-b * x));
  const residuals = (p: Float64Array) => Float64Array.from(xs, (x, i) => p[0] * Math.exp(-p[1] * x) - ys[i]);
  return {
    lower: Float64Array.from(lower),
    upper: Float64Array.from(upper),
    residuals,
    jacobian: (p) => {
      const J = new Float64Array(xs.length * 2);
      xs.forEach((x, i) => {
        J[i * 2] = Math.exp(-p[1] * x);
        J[i * 2 + 1] = -p[0] * x * Math.exp(-p[1] * x);
      });
      return J;
    },
  };
}

describe('bounded Levenberg–Marquardt', () => {
  it('recovers the parameters of an exact exponential from a poor start', () => {
    const { p, cost } = levenbergMarquardt(
      exponentialProblem(3, 0.7, [0, 0], [10, 5]),
      Float64Array.from([1, 2]),
      {
        maxIterations: 200,
        relativeTolerance: 1e-15,
      },
    );
    expectWithin(p[0], 3, 1e-6, 'a');
    expectWithin(p[1], 0.7, 1e-6, 'b');
    expect(cost).toBeLessThan(1e-12);
  });

  it('stays inside the bounds, ending on the bound nearest the unconstrained answer', () => {
    const { p } = levenbergMarquardt(
      exponentialProblem(3, 0.7, [0, 0], [2, 5]),
      Float64Array.from([1, 0.1]),
      {
        maxIterations: 200,
        relativeTolerance: 1e-15,
      },
    );
    expect(p[0]).toBe(2);
    expect(p[1]).toBeGreaterThanOrEqual(0);
    expect(p[1]).toBeLessThanOrEqual(5);
  });

  it('returns the start when there is nothing to fit', () => {
    const { p } = levenbergMarquardt(exponentialProblem(3, 0.7, [], []), new Float64Array(0), {
      maxIterations: 10,
      relativeTolerance: 1e-9,
    });
    expect(p).toHaveLength(0);
  });
});
