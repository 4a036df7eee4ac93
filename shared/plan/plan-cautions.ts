import { eqBoostCaution } from '../filters/eq-extremes';
import type { Layout } from '../layouts';
import type { Caution } from '../notices';
import type { PlanChannel } from './plan-room';
import { fullRangeNoHighPassCaution } from './tuning-cautions';

/**
 * Cautions for acting on a plan: those of the level and bass-management steps, EQ boosts (the bands
 * of each channel together), outputs fed full range without a high-pass, and overhead mounting
 * whenever the layout has loudspeakers above the listener.
 */
export function planCautions(
  layout: Layout,
  channels: readonly PlanChannel[],
  levelCautions: readonly Caution[],
  bassCautions: readonly Caution[],
  sampleRateHz: number,
): Caution[] {
  const cautions: Caution[] = [...levelCautions, ...bassCautions];
  const boost = eqBoostCaution(
    channels.map((c) => ({ channel: c.id, filters: c.eq.bands })),
    sampleRateHz,
  );
  if (boost) cautions.push(boost);
  const fullRange = fullRangeNoHighPassCaution(
    channels.filter((c) => c.role === 'fullRange').map((c) => c.id),
  );
  if (fullRange) cautions.push(fullRange);
  if (layout.channels.some((c) => c.layer === 'upper' || c.layer === 'upperHigh' || c.layer === 'top')) {
    cautions.push({
      code: 'overheadMounting',
      message:
        'This layout has loudspeakers above the listener. Mounting loudspeakers overhead and running their power and signal cabling are for qualified installers working to local building and electrical codes; Isochron computes settings and does not certify a room.',
    });
  }
  return cautions;
}
