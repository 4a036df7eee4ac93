import { CalculationInputError } from '../errors';
import { logFrequencyGrid } from '../dsp/grid';
import { smoothMagnitudeDb } from './smoothing';

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

/**
 * Power average of responses on different frequency grids: each is first brought to a common
 * logarithmic grid (`pointsPerOctave`, over the range every response covers) by 1/pointsPerOctave-octave
 * power smoothing, then averaged as {@link powerAverage} does.
 * @throws CalculationInputError when the responses share less than two grid points.
 */
export function powerAverageResampled(
  responses: readonly MagnitudeResponse[],
  pointsPerOctave = 48,
): { frequenciesHz: number[]; magnitudeDb: number[] } {
  if (responses.length === 0) {
    throw new CalculationInputError('at least one response is needed to average', '/responses');
  }
  const fromHz = Math.max(...responses.map((r) => r.frequenciesHz[0]));
  const toHz = Math.min(...responses.map((r) => r.frequenciesHz[r.frequenciesHz.length - 1]));
  const grid = toHz > fromHz ? logFrequencyGrid(fromHz, toHz, pointsPerOctave, 'iec') : [];
  if (grid.length < 2) {
    throw new CalculationInputError(
      `the responses do not share a frequency range (common part ${fromHz}..${toHz} Hz)`,
      '/responses',
    );
  }
  return powerAverage(
    responses.map((r) => ({
      frequenciesHz: grid,
      magnitudeDb: smoothMagnitudeDb(r.frequenciesHz, r.magnitudeDb, 1 / pointsPerOctave, grid),
    })),
  );
}
