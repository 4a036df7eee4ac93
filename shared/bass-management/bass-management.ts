import { requireChannelList } from '../channel-list';
import { CalculationInputError, requireInRange, requireInteger, withFieldPrefix } from '../errors';
import {
  designCrossover,
  type CrossoverFamily,
  type CrossoverSpec,
  type Polarity,
} from '../filters/crossover';
import type { Sos } from '../dsp/sos';
import { LIMITS } from '../limits';
import type { Caution, CalculationWarning } from '../notices';
import { DEFAULT_SAMPLE_RATE_HZ } from '../units/sample-rate';
import { presentDb, presentHz } from '../present';

/** Common practice: Linkwitz-Riley 4th order (24 dB/octave) at 80 Hz on both sides. */
export const DEFAULT_BASS_CROSSOVER: CrossoverSpec = {
  family: 'linkwitzRiley',
  order: LIMITS.crossoverOrder.default,
  frequencyHz: LIMITS.crossoverHz.default,
};
/** ITU-R BS.2051-3 Table 1 note 5 / BS.775: LFE is recorded 10 dB low and replayed +10 dB in band. */
export const DEFAULT_LFE_GAIN_DB = LIMITS['BassManagementRequest.lfeGainDb'].default;
/** Headroom above which a warning is given, in dB (the LFE alone at +10 dB already needs 10 dB). */
export const DEFAULT_HEADROOM_WARNING_DB = LIMITS.headroomWarningDb.default;
/** Above this crossover frequency a subwoofer becomes easier to locate (common practice). */
const LOCALISATION_WARNING_HZ = 120;
const LFE_LABEL = /^LFE\d*$/;
const LFE_GAIN_DB = LIMITS['BassManagementRequest.lfeGainDb'];

export interface BassManagementChannelInput {
  /** ITU-R BS.2051 label of the channel (`M+030`, `LFE1`), as in stored rooms; unique within the request. */
  id: string;
  /** Hand this channel's low end to the subwoofer(s). Not allowed on LFE channels. */
  bassManaged?: boolean;
  /** Overrides parts of the crossover for this channel. */
  crossover?: Partial<CrossoverSpec>;
}

export interface BassManagementInput {
  channels: BassManagementChannelInput[];
  /** Crossover for every managed channel; missing parts come from LR4 at 80 Hz. */
  crossover?: Partial<CrossoverSpec>;
  /** Gain of LFE channels into the subwoofer feed, dB; +10 when absent. */
  lfeGainDb?: number;
  /** Subwoofers sharing the feed, 1..16; 1 when absent. */
  subwooferCount?: number;
  sampleRateHz?: number;
  headroomWarningDb?: number;
}

export interface FilterPath {
  family: CrossoverFamily;
  order: number;
  frequencyHz: number;
  sections: Sos[];
}

export interface BassManagementChannelResult {
  id: string;
  role: 'managed' | 'fullRange' | 'lfe';
  /** The channel's high-pass, for managed channels. */
  highPass?: FilterPath & { polarity: Polarity };
}

export interface SubwooferInput {
  id: string;
  /** Gain of this channel into the subwoofer feed, dB. */
  gainDb: number;
  /**
   * How the input reaches the subwoofer: `sharedLowPass` — summed, then through `subwoofer.lowPass`;
   * `ownLowPass` — through its own `lowPass` (a per-channel crossover), then added after the shared
   * low-pass; `direct` — added without a low-pass (LFE, band-limited at the source).
   */
  route: 'sharedLowPass' | 'ownLowPass' | 'direct';
  lowPass?: FilterPath;
}

export interface BassManagementPlan {
  sampleRateHz: number;
  channels: BassManagementChannelResult[];
  subwoofer: {
    count: number;
    /** Low-pass on the sum of the `sharedLowPass` inputs (the request's crossover). */
    lowPass: FilterPath;
    inputs: SubwooferInput[];
    /** Gain from the summed feed to each subwoofer, dB: −20·log10(count). */
    feedGainDb: number;
  };
  /** 20·log10(Σ linear input gains): what the summed feed needs above one channel in the coherent worst case. */
  headroomDb: number;
  warnings: CalculationWarning[];
  cautions: Caution[];
}

/**
 * Bass management: every `bassManaged` channel gets the crossover's high-pass and feeds the
 * subwoofer through the matching low-pass at 0 dB; channels labelled `LFE`, `LFE1`, `LFE2`... feed it
 * directly (band-limited at the source) at `lfeGainDb`. `headroomDb = 20·log10(Σ 10^(gain_i/20))` over all inputs is the level the summed
 * feed can reach above a single full-scale channel when every input carries the same in-phase
 * signal (coherent worst case; e.g. 7 managed channels + LFE at +10 dB → 20.14 dB).
 *
 * With `subwooferCount` n > 1 every subwoofer gets the whole feed at `−20·log10(n)` dB, so n
 * subwoofers summing in phase at the listening position give the level of one (common practice;
 * their delays and polarity still have to be set and checked by measurement).
 * @throws CalculationInputError naming the field.
 */
export function planBassManagement(input: BassManagementInput): BassManagementPlan {
  const channels = requireChannelList(input.channels);
  const fs = input.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ;
  const lfeGainDb = requireInRange(
    input.lfeGainDb ?? DEFAULT_LFE_GAIN_DB,
    { min: LFE_GAIN_DB.minimum, max: LFE_GAIN_DB.maximum, unit: 'dB' },
    'lfeGainDb',
    '/lfeGainDb',
  );
  const count = requireInteger(
    input.subwooferCount ?? LIMITS.subwooferCount.default,
    { min: LIMITS.subwooferCount.minimum, max: LIMITS.subwooferCount.maximum },
    'subwooferCount',
    '/subwooferCount',
  );
  const headroomWarningDb = requireInRange(
    input.headroomWarningDb ?? DEFAULT_HEADROOM_WARNING_DB,
    { min: LIMITS.headroomWarningDb.minimum, max: LIMITS.headroomWarningDb.maximum, unit: 'dB' },
    'headroomWarningDb',
    '/headroomWarningDb',
  );
  const shared = { ...DEFAULT_BASS_CROSSOVER, ...input.crossover };
  const sharedCrossover = withFieldPrefix('/crossover', () => designCrossover(shared, fs));
  const warnings: CalculationWarning[] = [...sharedCrossover.warnings];

  const results: BassManagementChannelResult[] = [];
  const inputs: SubwooferInput[] = [];
  channels.forEach((channel, i) => {
    const isLfe = LFE_LABEL.test(channel.id);
    if (isLfe) {
      if (channel.bassManaged || channel.crossover !== undefined) {
        throw new CalculationInputError(
          `${channel.id} is an LFE channel: it feeds the subwoofer directly and takes no crossover`,
          `/channels/${i}/${channel.bassManaged ? 'bassManaged' : 'crossover'}`,
        );
      }
      results.push({ id: channel.id, role: 'lfe' });
      inputs.push({ id: channel.id, gainDb: lfeGainDb, route: 'direct' });
      return;
    }
    if (!channel.bassManaged) {
      if (channel.crossover !== undefined) {
        throw new CalculationInputError(
          'crossover applies only to channels with bassManaged: true',
          `/channels/${i}/crossover`,
        );
      }
      results.push({ id: channel.id, role: 'fullRange' });
      return;
    }
    const own = channel.crossover === undefined ? undefined : { ...shared, ...channel.crossover };
    const crossover = own
      ? withFieldPrefix(`/channels/${i}/crossover`, () => designCrossover(own, fs))
      : sharedCrossover;
    const spec = { family: crossover.family, order: crossover.order, frequencyHz: crossover.frequencyHz };
    results.push({
      id: channel.id,
      role: 'managed',
      highPass: { ...spec, sections: crossover.highPass.sections, polarity: crossover.highPassPolarity },
    });
    inputs.push({
      id: channel.id,
      gainDb: 0,
      ...(own
        ? { route: 'ownLowPass' as const, lowPass: { ...spec, sections: crossover.lowPass.sections } }
        : { route: 'sharedLowPass' as const }),
    });
    if (crossover.frequencyHz > LOCALISATION_WARNING_HZ) {
      warnings.push({
        code: 'crossoverHigh',
        channel: channel.id,
        message: `A crossover at ${presentHz(crossover.frequencyHz)} Hz sends content above ${LOCALISATION_WARNING_HZ} Hz to the subwoofer, where it becomes easier to locate.`,
      });
    }
  });

  const linearSum = inputs.reduce((sum, x) => sum + Math.pow(10, x.gainDb / 20), 0);
  const headroomDb = linearSum > 0 ? 20 * Math.log10(linearSum) : 0;
  if (inputs.length === 0) {
    warnings.push({
      code: 'subwooferUnused',
      message: 'No channel is bass-managed and there is no LFE channel: nothing feeds the subwoofer.',
    });
  } else if (headroomDb > headroomWarningDb) {
    warnings.push({
      code: 'headroomLarge',
      message: `The summed subwoofer feed can reach ${headroomDb.toFixed(1)} dB above a single full-scale channel (${inputs.length} inputs in phase). Lower the inputs, or make sure the processor's summing bus and the subwoofer path have that headroom.`,
    });
  }
  return {
    sampleRateHz: fs,
    channels: results,
    subwoofer: {
      count,
      lowPass: {
        family: sharedCrossover.family,
        order: sharedCrossover.order,
        frequencyHz: sharedCrossover.frequencyHz,
        sections: sharedCrossover.lowPass.sections,
      },
      inputs,
      feedGainDb: -20 * Math.log10(count),
    },
    headroomDb,
    warnings,
    cautions: bassCautions(headroomDb, lfeGainDb, inputs.length),
  };
}

function bassCautions(headroomDb: number, lfeGainDb: number, inputCount: number): Caution[] {
  const cautions: Caution[] = [];
  if (inputCount > 1) {
    cautions.push({
      code: 'bassSumming',
      message: `Bass management sums ${inputCount} inputs into the subwoofer feed, which needs up to ${headroomDb.toFixed(1)} dB more headroom than one channel. Check subwoofer amplifier and driver limits before playing full-range test signals, and start quietly.`,
    });
  }
  if (lfeGainDb > DEFAULT_LFE_GAIN_DB) {
    cautions.push({
      code: 'lowFrequencyBoost',
      message: `An LFE gain of ${presentDb(lfeGainDb)} dB is above the +10 dB in-band convention; low-frequency boosts can overdrive amplifiers and subwoofer drivers.`,
    });
  }
  return cautions;
}
