import { LIMITS, MAX_RESPONSE_POINTS } from '../limits';
import { OCTAVE_RATIO_G, REFERENCE_FREQUENCY_HZ } from '../analysis/iec-bands';
import { CalculationInputError, requireInRange, requireInteger } from '../errors';

/**
 * Where a logarithmic grid's points sit:
 * - `ends`: `fromHz` and `toHz` are both points, with `round(log2(toHz/fromHz) · pointsPerOctave)` equal
 *   steps in log frequency between them (numpy.geomspace with the step count rounded to the nearest
 *   whole number). For sweeps between two given frequencies.
 * - `iec`: the fixed series `1000·G^(k/pointsPerOctave)`, G = 10^(3/10) (the IEC 61260-1:2014 base-ten
 *   octave), for every integer k whose frequency lies in [fromHz, toHz]. With 3 points per octave these are
 *   the one-third-octave mid-band frequencies; grids of different ranges share their points, so
 *   responses on them can be compared point by point.
 */
export type GridAlignment = 'ends' | 'iec';

/**
 * The core's one logarithmic frequency grid.
 * @param fromHz lowest frequency, hertz (> 0).
 * @param toHz highest frequency, hertz (≥ fromHz).
 * @param pointsPerOctave density, 1..96 (an octave is 2:1 for `ends` and G:1 for `iec`).
 * @returns ascending frequencies in hertz, all within [fromHz, toHz].
 */
export function logFrequencyGrid(
  fromHz: number,
  toHz: number,
  pointsPerOctave: number,
  alignment: GridAlignment = 'ends',
): number[] {
  requireInRange(fromHz, { min: 0, exclusiveMin: true, unit: 'Hz' }, 'fromHz', '/fromHz');
  requireInRange(toHz, { min: fromHz, unit: 'Hz' }, 'toHz', '/toHz');
  requireInRange(
    pointsPerOctave,
    { min: LIMITS.pointsPerOctave.minimum, max: LIMITS.pointsPerOctave.maximum },
    'pointsPerOctave',
    '/pointsPerOctave',
  );
  if (alignment === 'ends') {
    const steps = Math.round(Math.log2(toHz / fromHz) * pointsPerOctave);
    if (steps === 0) return [fromHz];
    const ratio = toHz / fromHz;
    return Array.from({ length: steps + 1 }, (_, k) =>
      k === steps ? toHz : fromHz * Math.pow(ratio, k / steps),
    );
  }
  const step = Math.log(OCTAVE_RATIO_G) / pointsPerOctave;
  const first = Math.ceil(Math.log(fromHz / REFERENCE_FREQUENCY_HZ) / step - 1e-9);
  const last = Math.floor(Math.log(toHz / REFERENCE_FREQUENCY_HZ) / step + 1e-9);
  const grid: number[] = [];
  // The tolerance above admits end points that round a hair outside the range; pin them to it.
  for (let k = first; k <= last; k++) {
    grid.push(Math.min(toHz, Math.max(fromHz, REFERENCE_FREQUENCY_HZ * Math.exp(k * step))));
  }
  return grid;
}

/** Frequencies at which to evaluate a response: listed, or a sweep between two ends. */
export type ResponseGridSpec =
  { frequenciesHz: number[] } | { fromHz: number; toHz: number; pointsPerOctave?: number };

export { MAX_RESPONSE_POINTS };
export const DEFAULT_POINTS_PER_OCTAVE = 12;

/**
 * Frequencies for a requested response: the listed ones (each 0 < f ≤ Nyquist), or the `ends` grid of
 * {@link logFrequencyGrid} from `fromHz` to `toHz` (default 12 points per octave). At most 4096 points.
 * @returns frequencies in hertz.
 */
export function responseGrid(grid: ResponseGridSpec, sampleRateHz: number): number[] {
  const nyquist = sampleRateHz / 2;
  if ('frequenciesHz' in grid) {
    const list = grid.frequenciesHz;
    if (!Array.isArray(list) || list.length === 0 || list.length > MAX_RESPONSE_POINTS) {
      throw new CalculationInputError(
        `frequenciesHz must list 1 to ${MAX_RESPONSE_POINTS} frequencies`,
        '/frequenciesHz',
      );
    }
    return list.map((f, i) =>
      requireInRange(
        f,
        { min: 0, exclusiveMin: true, max: nyquist, unit: 'Hz' },
        'frequenciesHz',
        `/frequenciesHz/${i}`,
      ),
    );
  }
  const fromHz = requireInRange(
    grid.fromHz,
    { min: 0, exclusiveMin: true, max: nyquist, unit: 'Hz' },
    'fromHz',
    '/fromHz',
  );
  const toHz = requireInRange(grid.toHz, { min: fromHz, max: nyquist, unit: 'Hz' }, 'toHz', '/toHz');
  const pointsPerOctave = requireInteger(
    grid.pointsPerOctave ?? DEFAULT_POINTS_PER_OCTAVE,
    { min: LIMITS.pointsPerOctave.minimum, max: LIMITS.pointsPerOctave.maximum },
    'pointsPerOctave',
    '/pointsPerOctave',
  );
  const points = Math.round(Math.log2(toHz / fromHz) * pointsPerOctave) + 1;
  if (points > MAX_RESPONSE_POINTS) {
    throw new CalculationInputError(
      `the sweep from ${fromHz} Hz to ${toHz} Hz at ${pointsPerOctave} points per octave has ${points} points; at most ${MAX_RESPONSE_POINTS} are allowed`,
      '/pointsPerOctave',
    );
  }
  return logFrequencyGrid(fromHz, toHz, pointsPerOctave, 'ends');
}
