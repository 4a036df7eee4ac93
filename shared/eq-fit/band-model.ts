import { sosMagnitudeDb, unitCircle, type UnitCircle } from '../dsp/response';
import { designBiquad } from '../filters/biquad-design';
import { levenbergMarquardt, type LeastSquaresProblem } from './least-squares';

/** One peaking band while it is being fitted. */
export interface Band {
  frequencyHz: number;
  gainDb: number;
  q: number;
}

/** The processor's setting steps a band is rounded to. */
export interface BandSteps {
  /** Frequency step: hertz, or a fraction of an octave (from 1 kHz) with `frequencyUnit` `octave`. */
  frequencyHz: number;
  frequencyUnit: 'hz' | 'octave';
  gainDb: number;
  q: number;
}

/** Where one band may go: centre frequency, gain and Q bounds, and the steps it is rounded to. */
export interface BandBounds {
  fromHz: number;
  toHz: number;
  minGainDb: number;
  maxGainDb: number;
  qMin: number;
  qMax: number;
  steps: BandSteps;
}

/** The data a set of bands is fitted to, on one grid. */
export interface FitData {
  grid: readonly number[];
  /** Departure of the response from the target at its level, dB (positive: above the target). */
  errorDb: Float64Array;
  /** Weight of each point in the fit, 0..1 (agreement between microphone positions). */
  weight: Float64Array;
  /** 1 where the EQ must not boost (a null, or a dip the positions disagree on). */
  noBoost: Uint8Array;
  /**
   * 1 at guard points above the correction range: there the response is taken as on target (error 0), so
   * the fit keeps bands from spilling over what it was not asked to correct; they do not set the level.
   */
  guard: Uint8Array;
  /** EQ already decided on this grid (bands fitted earlier), dB; added to every evaluation. */
  baseDb: Float64Array;
  /** Combined limits: the summed EQ may not rise above `maxBoostDb` or fall below `−maxCutDb`. */
  maxBoostDb: number;
  maxCutDb: number;
  /**
   * When true the target's level follows the corrected response (its weighted mean outside no-boost
   * points): used with cuts only when no level reference band was measured, so cuts bring peaks down to
   * the response between them instead of to a median the peaks themselves raised.
   */
  freeLevel: boolean;
}

/** Weight of the penalty on a boost into a no-boost point and on the summed EQ past its limit. */
const PENALTY = 10;
/** Joint refinement of every band at once up to this many bands; beyond it, band by band. */
const JOINT_REFINEMENT_MAX_BANDS = 16;

/**
 * The dB response of cookbook peaking bands on a fit grid, and their refinement by bounded
 * Levenberg–Marquardt on (ln f, gain, ln Q). The cost is Σ wᵢ·(errorᵢ + EQᵢ)² plus penalties on any
 * boost into a no-boost point and on the summed EQ beyond the combined limits.
 */
export class BandModel {
  readonly circle: UnitCircle;

  constructor(
    readonly data: FitData,
    readonly sampleRateHz: number,
  ) {
    this.circle = unitCircle([...data.grid], sampleRateHz);
  }

  /** dB response of one cookbook peaking section on the grid, written into `out`. */
  bandDb(band: Band, out: Float64Array): Float64Array {
    return sosMagnitudeDb([designBiquad({ type: 'peaking', ...band }, this.sampleRateHz)], this.circle, out);
  }

  /** Summed dB response of the bands on the grid, without the base. */
  totalDb(bands: readonly Band[]): Float64Array {
    const total = new Float64Array(this.data.grid.length);
    const scratch = new Float64Array(this.data.grid.length);
    for (const band of bands) {
      this.bandDb(band, scratch);
      for (let i = 0; i < total.length; i++) total[i] += scratch[i];
    }
    return total;
  }

  /** The level shift of a free-level fit for a total EQ curve (without the base), dB; 0 otherwise. */
  levelOf(eq: ArrayLike<number>): number {
    const { freeLevel, errorDb, baseDb, weight, noBoost, guard } = this.data;
    if (!freeLevel) return 0;
    let sum = 0;
    let total = 0;
    for (let i = 0; i < eq.length; i++) {
      if (noBoost[i] || guard[i]) continue;
      sum += weight[i] * (errorDb[i] + baseDb[i] + eq[i]);
      total += weight[i];
    }
    return total > 0 ? sum / total : 0;
  }

  /** Residual error after the bands (and the base), dB, at every grid point. */
  residualDb(bands: readonly Band[]): Float64Array {
    const eq = this.totalDb(bands);
    const level = this.levelOf(eq);
    const { errorDb, baseDb, guard } = this.data;
    return eq.map((v, i) => errorDb[i] + baseDb[i] + v - (guard[i] ? 0 : level));
  }

  /** Weighted RMS of the residual after the bands, dB. */
  weightedRms(bands: readonly Band[]): number {
    return weightedRms(this.residualDb(bands), this.data.weight);
  }

  /** Residuals of a total EQ curve (without the base): weighted error, then the penalties. */
  fillResiduals(eq: Float64Array, out: Float64Array): Float64Array {
    const { errorDb, weight, noBoost, baseDb, maxBoostDb, maxCutDb } = this.data;
    const { guard } = this.data;
    const m = eq.length;
    const level = this.levelOf(eq);
    for (let i = 0; i < m; i++) {
      const total = eq[i] + baseDb[i];
      out[i] = Math.sqrt(weight[i]) * (errorDb[i] + total - (guard[i] ? 0 : level));
      out[m + i] =
        PENALTY *
        ((noBoost[i] ? Math.max(0, total) : 0) +
          Math.max(0, total - maxBoostDb) +
          Math.max(0, -maxCutDb - total));
    }
    return out;
  }

  /**
   * Refines the bands, each within its own bounds; jointly up to 16 bands, beyond that one at a time.
   * `onlyLast`: only the last band moves (the greedy step; the joint refinement follows at the end).
   */
  refine(bands: Band[], bounds: BandBounds[], maxIterations: number, onlyLast = false): Band[] {
    if (bands.length === 0) return bands;
    if (onlyLast) return this.refineSubset(bands, bounds, [bands.length - 1], maxIterations);
    if (bands.length <= JOINT_REFINEMENT_MAX_BANDS) {
      return this.refineSubset(
        bands,
        bounds,
        bands.map((_, i) => i),
        maxIterations,
      );
    }
    let current = this.refineSubset(bands, bounds, [bands.length - 1], maxIterations);
    for (let sweep = 0; sweep < 2; sweep++) {
      for (let i = 0; i < current.length; i++)
        current = this.refineSubset(current, bounds, [i], maxIterations);
    }
    return current;
  }

  private refineSubset(bands: Band[], bounds: BandBounds[], free: number[], maxIterations: number): Band[] {
    const m = this.data.grid.length;
    const n = 3 * free.length;
    const fixed = this.totalDb(bands.filter((_, i) => !free.includes(i)));
    const bandAt = (p: Float64Array, j: number): Band => ({
      frequencyHz: Math.exp(p[3 * j]),
      gainDb: p[3 * j + 1],
      q: Math.exp(p[3 * j + 2]),
    });
    const responses = free.map(() => new Float64Array(m));
    const eq = new Float64Array(m);
    const probe = new Float64Array(m);
    const probeEq = new Float64Array(m);
    const probeResiduals = new Float64Array(2 * m);
    const evaluate = (p: Float64Array): void => {
      eq.set(fixed);
      responses.forEach((response, j) => {
        this.bandDb(bandAt(p, j), response);
        for (let i = 0; i < m; i++) eq[i] += response[i];
      });
    };
    const lower = Float64Array.from(
      free.flatMap((i) => [Math.log(bounds[i].fromHz), bounds[i].minGainDb, Math.log(bounds[i].qMin)]),
    );
    const upper = Float64Array.from(
      free.flatMap((i) => [Math.log(bounds[i].toHz), bounds[i].maxGainDb, Math.log(bounds[i].qMax)]),
    );
    const problem: LeastSquaresProblem = {
      lower,
      upper,
      residuals: (p) => {
        evaluate(p);
        return this.fillResiduals(eq, new Float64Array(2 * m));
      },
      jacobian: (p, r) => {
        evaluate(p);
        const J = new Float64Array(2 * m * n);
        const shifted = Float64Array.from(p);
        for (let k = 0; k < n; k++) {
          const j = Math.floor(k / 3);
          // Forward differences, stepping inward at an upper bound so the probe stays a valid filter.
          const h = k % 3 === 1 ? 1e-3 : 1e-5;
          const step = p[k] + h > upper[k] ? -h : h;
          shifted[k] = p[k] + step;
          this.bandDb(bandAt(shifted, j), probe);
          shifted[k] = p[k];
          const response = responses[j];
          for (let i = 0; i < m; i++) probeEq[i] = eq[i] - response[i] + probe[i];
          this.fillResiduals(probeEq, probeResiduals);
          for (let i = 0; i < 2 * m; i++) J[i * n + k] = (probeResiduals[i] - r[i]) / step;
        }
        return J;
      },
    };
    const start = Float64Array.from(
      free.flatMap((i) => [Math.log(bands[i].frequencyHz), bands[i].gainDb, Math.log(bands[i].q)]),
    );
    const { p } = levenbergMarquardt(problem, start, { maxIterations, relativeTolerance: 1e-4 });
    return bands.map((band, i) => (free.includes(i) ? bandAt(p, free.indexOf(i)) : band));
  }
}

export function weightedRms(values: ArrayLike<number>, weight: ArrayLike<number>): number {
  let s = 0;
  let w = 0;
  for (let i = 0; i < values.length; i++) {
    s += weight[i] * values[i] * values[i];
    w += weight[i];
  }
  return w > 0 ? Math.sqrt(s / w) : 0;
}
