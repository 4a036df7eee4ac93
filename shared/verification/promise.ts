import type { RoomPlan } from '../plan/plan-room';
import type { TargetCurve } from '../eq-fit/target-curve';

/**
 * What a tuning version promised when it was stored from a plan: the level every channel should reach,
 * the target curve and the range over which its EQ corrects, and the crossover. Verification holds the
 * "after" measurements to these.
 */
export interface TuningPromise {
  referenceDb: number | null;
  crossoverHz: number | null;
  targetCurve: TargetCurve | null;
  channels: Array<{
    id: string;
    role: 'managed' | 'fullRange' | 'lfe';
    /** Level expected at the listening position with the trim applied, dB; null without SPL readings. */
    expectedDb: number | null;
    /** Range the EQ was fitted over, Hz; null when no response was measured. */
    correctedFromHz: number | null;
    correctedToHz: number | null;
  }>;
}

/** The engineer's sign-off of a verified tuning version. */
export interface SignOff {
  engineer: string;
  /** Day of the verification, YYYY-MM-DD. */
  date: string;
  referenceLevelDb: number;
  weighting: 'A' | 'C' | 'Z';
  microphone: string;
  /** The microphone positions measured. */
  positions: string[];
  notes?: string;
  /** Verification outcome when signed, as the verification answered it. */
  verdict?: 'pass' | 'warn' | 'fail' | 'incomplete';
  signedAt?: string;
}

/** The promise of a plan, as stored with the tuning version made from it. */
export function promiseOfPlan(plan: RoomPlan, targetCurve: TargetCurve | null): TuningPromise {
  const managed = plan.channels.some((c) => c.role === 'managed');
  return {
    referenceDb: plan.referenceDb,
    crossoverHz: managed && plan.subwoofer ? plan.subwoofer.lowPass.frequencyHz : null,
    targetCurve,
    channels: plan.channels.map((c) => ({
      id: c.id,
      role: c.role,
      expectedDb: c.expectedDb,
      correctedFromHz: c.eq.fromHz,
      correctedToHz: c.eq.toHz,
    })),
  };
}
