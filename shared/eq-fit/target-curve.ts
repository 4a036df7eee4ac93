import { CalculationInputError, requireInRange } from '../errors';
import { LIMITS } from '../limits';

/**
 * The response a channel should reach, in dB relative to its own level (the fitter matches levels first).
 * - `flat`: 0 dB everywhere.
 * - `tilt`: a straight line in dB per octave through 0 dB at `pivotHz` (default 1 kHz).
 * - `lowFrequencyLift`: `gainDb` at low frequencies falling to 0 dB above `cornerHz`, shaped like a
 *   second-order low shelf (Audio EQ Cookbook analogue prototype, S = 1) whose midpoint is at `cornerHz`.
 */
export type TargetCurve =
  | { kind: 'flat' }
  | { kind: 'tilt'; dbPerOctave: number; pivotHz?: number }
  | { kind: 'lowFrequencyLift'; gainDb: number; cornerHz: number }
  | { kind: 'points'; points: readonly TargetPoint[] };

/** One point of a target curve given as points: level in dB at a frequency. */
export interface TargetPoint {
  frequencyHz: number;
  gainDb: number;
}

/** Ranges of a target curve's parameters: the contract's bounds (shared/limits.ts), which the core checks too. */
export const TARGET_LIMITS = {
  tiltMinDbPerOctave: LIMITS.dbPerOctave.minimum,
  tiltMaxDbPerOctave: LIMITS.dbPerOctave.maximum,
  pivotMinHz: LIMITS.pivotHz.minimum,
  pivotMaxHz: LIMITS.pivotHz.maximum,
  liftMinDb: LIMITS['TargetCurve|object.gainDb'].minimum,
  liftMaxDb: LIMITS['TargetCurve|object.gainDb'].maximum,
  cornerMinHz: LIMITS.cornerHz.minimum,
  cornerMaxHz: LIMITS.cornerHz.maximum,
  pointsMin: LIMITS.TargetPoints.minItems,
  pointsMax: LIMITS.TargetPoints.maxItems,
  pointMinHz: LIMITS.frequencyHz.minimum,
  pointMaxHz: LIMITS.frequencyHz.maximum,
  pointMinDb: LIMITS['TargetPoint.gainDb'].minimum,
  pointMaxDb: LIMITS['TargetPoint.gainDb'].maximum,
} as const;

/**
 * Checks a target curve's parameters and returns it. Errors name the field under `field`
 * (default `/target`).
 */
export function requireTargetCurve(curve: TargetCurve, field = '/target'): TargetCurve {
  switch (curve.kind) {
    case 'flat':
      return curve;
    case 'tilt':
      requireInRange(
        curve.dbPerOctave,
        { min: TARGET_LIMITS.tiltMinDbPerOctave, max: TARGET_LIMITS.tiltMaxDbPerOctave, unit: 'dB/octave' },
        'dbPerOctave',
        `${field}/dbPerOctave`,
      );
      if (curve.pivotHz !== undefined) {
        requireInRange(
          curve.pivotHz,
          { min: TARGET_LIMITS.pivotMinHz, max: TARGET_LIMITS.pivotMaxHz, unit: 'Hz' },
          'pivotHz',
          `${field}/pivotHz`,
        );
      }
      return curve;
    case 'lowFrequencyLift':
      requireInRange(
        curve.gainDb,
        { min: TARGET_LIMITS.liftMinDb, max: TARGET_LIMITS.liftMaxDb, unit: 'dB' },
        'gainDb',
        `${field}/gainDb`,
      );
      requireInRange(
        curve.cornerHz,
        { min: TARGET_LIMITS.cornerMinHz, max: TARGET_LIMITS.cornerMaxHz, unit: 'Hz' },
        'cornerHz',
        `${field}/cornerHz`,
      );
      return curve;
    case 'points':
      requirePoints(curve.points, `${field}/points`);
      return curve;
    default:
      throw new CalculationInputError(
        `kind must be flat, tilt, lowFrequencyLift or points; received ${String((curve as { kind: unknown }).kind)}`,
        `${field}/kind`,
      );
  }
}

/**
 * Target level at one frequency, dB.
 * - tilt: `dbPerOctave · log2(f / pivotHz)`.
 * - lowFrequencyLift: `20·log10|H(jΩ)|`, Ω = f/cornerHz, of the cookbook low-shelf prototype
 *   `H(s) = A·(s² + (√A/Q)s + A)/(A·s² + (√A/Q)s + 1)` with A = 10^(gainDb/40) and Q = 1/√2 (S = 1):
 *   `gainDb` at DC, `gainDb/2` at the corner, 0 dB far above.
 * - points: dB interpolated linearly in log frequency between neighbouring points, held at the first
 *   point's level below it and the last point's above it.
 * @param curve a checked target curve.
 * @param frequencyHz frequency in hertz (> 0).
 */
export function targetDb(curve: TargetCurve, frequencyHz: number): number {
  switch (curve.kind) {
    case 'flat':
      return 0;
    case 'tilt':
      return curve.dbPerOctave * Math.log2(frequencyHz / (curve.pivotHz ?? 1000));
    case 'lowFrequencyLift': {
      const A = Math.pow(10, curve.gainDb / 40);
      const omega = frequencyHz / curve.cornerHz;
      // (√A/Q)² with Q = 1/√2.
      const damping = 2 * A;
      const w2 = omega * omega;
      const numerator = (A - w2) ** 2 + damping * w2;
      const denominator = (1 - A * w2) ** 2 + damping * w2;
      return 10 * Math.log10((A * A * numerator) / denominator);
    }
    case 'points':
      return interpolatePoints(curve.points, frequencyHz);
  }
}

function interpolatePoints(points: readonly TargetPoint[], frequencyHz: number): number {
  if (frequencyHz <= points[0].frequencyHz) return points[0].gainDb;
  const last = points[points.length - 1];
  if (frequencyHz >= last.frequencyHz) return last.gainDb;
  let lo = 0;
  let hi = points.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid].frequencyHz <= frequencyHz) lo = mid;
    else hi = mid;
  }
  const a = points[lo];
  const b = points[hi];
  const t = Math.log(frequencyHz / a.frequencyHz) / Math.log(b.frequencyHz / a.frequencyHz);
  return a.gainDb + t * (b.gainDb - a.gainDb);
}

/** Checks a list of target points: count, frequencies and levels within TARGET_LIMITS, frequencies strictly ascending. */
export function requirePoints(points: readonly TargetPoint[], field: string): readonly TargetPoint[] {
  if (
    !Array.isArray(points) ||
    points.length < TARGET_LIMITS.pointsMin ||
    points.length > TARGET_LIMITS.pointsMax
  ) {
    throw new CalculationInputError(
      `a target curve needs ${TARGET_LIMITS.pointsMin}..${TARGET_LIMITS.pointsMax} points`,
      field,
    );
  }
  points.forEach((point, i) => {
    requireInRange(
      point.frequencyHz,
      { min: TARGET_LIMITS.pointMinHz, max: TARGET_LIMITS.pointMaxHz, unit: 'Hz' },
      'frequencyHz',
      `${field}/${i}/frequencyHz`,
    );
    requireInRange(
      point.gainDb,
      { min: TARGET_LIMITS.pointMinDb, max: TARGET_LIMITS.pointMaxDb, unit: 'dB' },
      'gainDb',
      `${field}/${i}/gainDb`,
    );
    if (i > 0 && !(point.frequencyHz > points[i - 1].frequencyHz)) {
      throw new CalculationInputError(
        `target points must ascend in frequency; ${point.frequencyHz} Hz follows ${points[i - 1].frequencyHz} Hz`,
        `${field}/${i}/frequencyHz`,
      );
    }
  });
  return points;
}
