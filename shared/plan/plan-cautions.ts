import type { Layout } from '../layouts';
import type { Caution } from '../notices';
import type { PlanChannel } from './plan-room';

/**
 * Cautions for acting on a plan: those of the level and bass-management steps, EQ boosts, and
 * overhead mounting whenever the layout has loudspeakers above the listener (PRODUCT.md §8).
 */
export function planCautions(
  layout: Layout,
  channels: readonly PlanChannel[],
  levelCautions: readonly Caution[],
  bassCautions: readonly Caution[],
): Caution[] {
  const cautions: Caution[] = [...levelCautions, ...bassCautions];
  const boosted = channels.filter((c) => c.eq.bands.some((b) => b.gainDb > 0));
  if (boosted.length > 0) {
    const figures = boosted.map((c) => `${c.id} by up to ${(c.eq.combined?.maxBoostDb ?? 0).toFixed(1)} dB`);
    cautions.push({
      code: 'eqBoost',
      message: `The EQ boosts ${figures.join(', ')} (all bands together). Boosts, especially at low frequencies, can overdrive amplifiers and drivers. Prefer cuts and check headroom.`,
    });
  }
  if (layout.channels.some((c) => c.layer === 'upper' || c.layer === 'upperHigh' || c.layer === 'top')) {
    cautions.push({
      code: 'overheadMounting',
      message:
        'This layout has loudspeakers above the listener. Mounting loudspeakers overhead and running their power and signal cabling are for qualified installers working to local building and electrical codes; Isochron computes settings and does not certify a room.',
    });
  }
  return cautions;
}
