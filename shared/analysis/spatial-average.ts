import { CalculationInputError } from '../errors';

export interface MagnitudeResponse {
  frequenciesHz: readonly number[];
  magnitudeDb: readonly number[];
}

/**
 * Power average of several microphone positions' responses on one frequency grid,
 * `L = 10·log10((1/n)·Σ 10^(Lᵢ/10))` — the energy mean used for spatial averaging [practice].
 * @param responses at least one response; all on the same grid (frequencies equal to 1 part in 10⁹).
 * @returns the averaged response on that grid.
 */
export function powerAverage(responses: readonly MagnitudeResponse[]): {
  frequenciesHz: number[];
  magnitudeDb: number[];
} {
  if (responses.length === 0) {
    throw new CalculationInputError('at least one response is needed to average', '/responses');
  }
  const grid = responses[0].frequenciesHz;
  const sum = new Float64Array(grid.length);
  responses.forEach((response, r) => {
    if (response.frequenciesHz.length !== grid.length || response.magnitudeDb.length !== grid.length) {
      throw new CalculationInputError(
        `response ${r} has ${response.magnitudeDb.length} points on ${response.frequenciesHz.length} frequencies; the first has ${grid.length}`,
        `/responses/${r}`,
      );
    }
    response.frequenciesHz.forEach((f, i) => {
      if (Math.abs(f - grid[i]) > 1e-9 * Math.abs(grid[i])) {
        throw new CalculationInputError(
          `response ${r} is on another frequency grid (${f} Hz where the first has ${grid[i]} Hz)`,
          `/responses/${r}/frequenciesHz/${i}`,
        );
      }
      const db = response.magnitudeDb[i];
      if (!Number.isFinite(db)) {
        throw new CalculationInputError(
          `magnitude must be finite; received ${db}`,
          `/responses/${r}/magnitudeDb/${i}`,
        );
      }
      sum[i] += Math.pow(10, db / 10);
    });
  });
  return {
    frequenciesHz: [...grid],
    magnitudeDb: Array.from(sum, (s) => 10 * Math.log10(s / responses.length)),
  };
}
