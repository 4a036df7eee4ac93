/**
 * A bounded nonlinear least-squares problem: minimise Σ rᵢ(p)² with lower ≤ p ≤ upper.
 * `jacobian` returns the m×n matrix row-major in one array (element [i][k] at i·n + k).
 */
export interface LeastSquaresProblem {
  residuals(p: Float64Array): Float64Array;
  jacobian(p: Float64Array, residuals: Float64Array): Float64Array;
  lower: Float64Array;
  upper: Float64Array;
}

export interface LeastSquaresOptions {
  maxIterations: number;
  /** Stop when one accepted step lowers the cost by less than this fraction. */
  relativeTolerance: number;
}

const sumOfSquares = (r: Float64Array): number => {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i] * r[i];
  return s;
};

/**
 * Levenberg–Marquardt with Marquardt's diagonal scaling (K. Levenberg 1944, D. W. Marquardt 1963), each
 * trial step projected onto the bounds. Deterministic: the same start always gives the same answer.
 * @returns the best parameters found (a new array) and their cost Σ r².
 */
export function levenbergMarquardt(
  problem: LeastSquaresProblem,
  start: Float64Array,
  options: LeastSquaresOptions,
): { p: Float64Array; cost: number } {
  const n = start.length;
  let p = clampToBounds(Float64Array.from(start), problem);
  let r = problem.residuals(p);
  let cost = sumOfSquares(r);
  let lambda = 1e-3;
  for (let iteration = 0; iteration < options.maxIterations && n > 0; iteration++) {
    const J = problem.jacobian(p, r);
    const normal = Array.from({ length: n }, () => new Float64Array(n));
    const gradient = new Float64Array(n);
    for (let i = 0; i < r.length; i++) {
      const offset = i * n;
      for (let a = 0; a < n; a++) {
        const ja = J[offset + a];
        if (ja === 0) continue;
        gradient[a] += ja * r[i];
        const row = normal[a];
        for (let b = a; b < n; b++) row[b] += ja * J[offset + b];
      }
    }
    for (let a = 0; a < n; a++) for (let b = 0; b < a; b++) normal[a][b] = normal[b][a];

    let improved = false;
    while (lambda < 1e12) {
      const damped = normal.map((row, a) => {
        const copy = Float64Array.from(row);
        copy[a] += lambda * (row[a] + 1e-9);
        return copy;
      });
      const step = solve(
        damped,
        gradient.map((g) => -g),
      );
      if (!step) {
        lambda *= 10;
        continue;
      }
      const trial = clampToBounds(
        p.map((v, k) => v + step[k]),
        problem,
      );
      const trialResiduals = problem.residuals(trial);
      const trialCost = sumOfSquares(trialResiduals);
      if (trialCost < cost) {
        const gain = (cost - trialCost) / Math.max(cost, 1e-300);
        p = trial;
        r = trialResiduals;
        cost = trialCost;
        lambda = Math.max(lambda / 3, 1e-9);
        improved = gain > options.relativeTolerance;
        break;
      }
      lambda *= 4;
    }
    if (!improved) break;
  }
  return { p, cost };
}

function clampToBounds(p: Float64Array, { lower, upper }: LeastSquaresProblem): Float64Array {
  for (let k = 0; k < p.length; k++) p[k] = Math.min(upper[k], Math.max(lower[k], p[k]));
  return p;
}

/** Solves A x = b by Gaussian elimination with partial pivoting; null when A is singular. */
function solve(A: Float64Array[], b: Float64Array): Float64Array | null {
  const n = b.length;
  const m = A.map((row) => Float64Array.from(row));
  const x = Float64Array.from(b);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let row = col + 1; row < n; row++) if (Math.abs(m[row][col]) > Math.abs(m[pivot][col])) pivot = row;
    if (!(Math.abs(m[pivot][col]) > 1e-300)) return null;
    [m[col], m[pivot]] = [m[pivot], m[col]];
    [x[col], x[pivot]] = [x[pivot], x[col]];
    for (let row = col + 1; row < n; row++) {
      const factor = m[row][col] / m[col][col];
      if (factor === 0) continue;
      for (let k = col; k < n; k++) m[row][k] -= factor * m[col][k];
      x[row] -= factor * x[col];
    }
  }
  for (let row = n - 1; row >= 0; row--) {
    let sum = x[row];
    for (let k = row + 1; k < n; k++) sum -= m[row][k] * x[k];
    x[row] = sum / m[row][row];
  }
  return x.every(Number.isFinite) ? x : null;
}
