import { eqBoostCaution } from '../filters/eq-extremes';
import type { Layout } from '../layouts';
import type { Caution } from '../notices';
import { presentDb } from '../present';
import { HEARING_CAUTION } from './hearing';
import type { TuningSettings } from './tuning';
import type { RoomLimits } from './tuning-limits';

const LFE_LABEL = /^LFE\d*$/;

export interface TuningCautionContext {
  layout?: Layout;
  /** The room's limits: a trim at its limit gets a caution of its own. */
  limits?: RoomLimits | null;
  /** For an export: the settings are about to reach a processor. */
  forExport?: boolean;
}

/**
 * Cautions to show with a stored tuning, with true figures: loud test signals (deferring to local
 * occupational limits), boosts (each channel's largest boost of its EQ bands together, as designed,
 * and positive trims), a full-range channel without a high-pass, a trim run into the room's limit,
 * bass summing, overhead mounting; at export, that the boosts reach the processor now.
 */
export function tuningCautions(settings: TuningSettings, context: TuningCautionContext = {}): Caution[] {
  const { layout, limits, forExport = false } = context;
  const cautions: Caution[] = [
    {
      code: 'testSignalLevel',
      message: `Checking a tuning plays test signals at the reference level. Start with the system turned down and raise it gradually. ${HEARING_CAUTION}`,
    },
  ];
  const boost = eqBoostCaution(
    settings.channels.map((c) => ({ channel: c.id, filters: c.eq, trimDb: c.trimDb })),
    settings.sampleRateHz,
    forExport,
  );
  if (boost) cautions.push(boost);
  const subChannel = settings.subwoofer?.channel;
  const fullRange = settings.channels
    .filter((c) => c.highPass === null && c.id !== subChannel && !LFE_LABEL.test(c.id))
    .map((c) => c.id);
  const fullRangeCaution = fullRangeNoHighPassCaution(fullRange);
  if (fullRangeCaution) cautions.push(fullRangeCaution);
  const atLimit = settings.channels.filter(
    (c) => limits?.trimMaxDb !== undefined && limits.trimMaxDb > 0 && c.trimDb >= limits.trimMaxDb,
  );
  if (atLimit.length > 0) {
    cautions.push({
      code: 'trimAtLimit',
      message: `${atLimit.map((c) => `${c.id} (+${presentDb(c.trimDb)} dB)`).join(', ')} ${atLimit.length === 1 ? 'is' : 'are'} trimmed up to the room's limit of +${presentDb(limits?.trimMaxDb ?? 0)} dB: a channel that reads this low usually has a fault. Check the loudspeaker and its wiring before adding gain.`,
    });
  }
  if (settings.subwoofer?.headroomDb !== undefined && settings.channels.some((c) => c.bassManaged)) {
    cautions.push({
      code: 'bassSumming',
      message: `Bass management sums the managed channels and the LFE into the subwoofer feed, which needs up to ${settings.subwoofer.headroomDb.toFixed(2)} dB more headroom than one channel.`,
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

/**
 * The caution for outputs fed full range without a high-pass (plans and tunings say it the same way),
 * or null when there are none.
 */
export function fullRangeNoHighPassCaution(ids: readonly string[]): Caution | null {
  if (ids.length === 0) return null;
  return {
    code: 'fullRangeNoHighPass',
    message: `${ids.join(', ')} ${ids.length === 1 ? 'has' : 'have'} no high-pass and will be fed full range. Make sure each loudspeaker can take the low end at the calibration level (check its specified low-frequency limit), or give it a high-pass and bass-manage it.`,
  };
}
