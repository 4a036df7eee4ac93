import type { Layout } from '../layouts';
import type { Caution } from '../notices';
import type { TuningSettings } from './tuning';

/** Cautions to show with a stored tuning: loud test signals, boosts, bass summing, overhead mounting. */
export function tuningCautions(settings: TuningSettings, layout: Layout | undefined): Caution[] {
  const cautions: Caution[] = [
    {
      code: 'testSignalLevel',
      message:
        'Checking a tuning plays test signals at the reference level. Start with the system turned down and raise it gradually; protect hearing (NIOSH recommends at most 85 dBA over 8 hours, halving the time for every 3 dB more).',
    },
  ];
  const boosted = settings.channels
    .filter((c) => c.trimDb > 0 || c.eq.some((f) => (f.gainDb ?? 0) > 0))
    .map((c) => c.id);
  if (boosted.length > 0) {
    cautions.push({
      code: 'boost',
      message: `${boosted.join(', ')} ${boosted.length === 1 ? 'has' : 'have'} a positive trim or EQ boost; boosts, especially at low frequencies, can overdrive amplifiers and drivers. Check headroom, prefer cuts.`,
    });
  }
  if (settings.subwoofer?.headroomDb !== undefined && settings.channels.some((c) => c.bassManaged)) {
    cautions.push({
      code: 'bassSumming',
      message: `Bass management sums the managed channels and the LFE into the subwoofer feed, which needs up to ${settings.subwoofer.headroomDb.toFixed(1)} dB more headroom than one channel.`,
    });
  }
  if (layout?.channels.some((c) => c.layer === 'upper' || c.layer === 'upperHigh' || c.layer === 'top')) {
    cautions.push({
      code: 'overheadMounting',
      message:
        'Mounting loudspeakers overhead and running their power and signal cabling are for qualified installers working to local building and electrical codes; Isochron computes settings and does not certify a room.',
    });
  }
  return cautions;
}
