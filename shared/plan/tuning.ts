import { CalculationInputError, requireInRange, withFieldPrefix } from '../errors';
import { designBiquads, type FilterSpec } from '../filters/biquad-design';
import { requireUniqueIds } from '../geometry/analyse-geometry';
import { requireSampleRate } from '../units/sample-rate';

/** A crossover filter as a person describes it; its sections are designed at the rate asked for. */
export interface CrossoverSpec {
  family: 'linkwitzRiley' | 'butterworth';
  order: number;
  frequencyHz: number;
}

/** One output channel's stored settings. Filters are kept as parameters, never as coefficients. */
export interface TuningChannel {
  /** Channel label, e.g. `M+030`; `LFE1` is the subwoofer output fed by the LFE channel. */
  id: string;
  name?: string;
  delayMs: number;
  trimDb: number;
  polarity: 'normal' | 'inverted';
  /** Parametric EQ, in processing order. */
  eq: FilterSpec[];
  /** High-pass of a bass-managed channel, or null for full range. */
  highPass: CrossoverSpec | null;
  bassManaged: boolean;
}

/** The subwoofer path of a bass-managed tuning. */
export interface TuningSubwoofer {
  /** The output that carries it, normally `LFE1`. */
  channel: string;
  lowPass: CrossoverSpec | null;
  /** In-band gain of the LFE channel into the subwoofer feed, dB (+10 by BS.2051 convention). */
  lfeGainDb: number;
  /** Headroom the coherent sum of the managed channels and the LFE needs, dB (information). */
  headroomDb?: number;
}

/** What a tuning version holds. */
export interface TuningSettings {
  sampleRateHz: number;
  channels: TuningChannel[];
  subwoofer: TuningSubwoofer | null;
}

/** Ranges of stored settings; wide enough for any processor, narrow enough to catch typing errors. */
export const TUNING_LIMITS = {
  delayMaxMs: 1000,
  trimMinDb: -60,
  trimMaxDb: 24,
  eqMaxSections: 64,
  lfeGainMinDb: -20,
  lfeGainMaxDb: 20,
} as const;

const CROSSOVER_ORDERS: Record<CrossoverSpec['family'], readonly number[]> = {
  linkwitzRiley: [2, 4, 8],
  butterworth: [1, 2, 3, 4, 5, 6, 7, 8],
};

function checkCrossover(spec: CrossoverSpec, sampleRateHz: number, field: string): void {
  const orders = CROSSOVER_ORDERS[spec.family];
  if (!orders) {
    throw new CalculationInputError(
      `family must be linkwitzRiley or butterworth; received ${String(spec.family)}`,
      `${field}/family`,
    );
  }
  if (!orders.includes(spec.order)) {
    throw new CalculationInputError(
      `order of a ${spec.family} crossover must be one of ${orders.join(', ')}; received ${spec.order}`,
      `${field}/order`,
    );
  }
  requireInRange(
    spec.frequencyHz,
    { min: 1, max: sampleRateHz / 2, exclusiveMax: true, unit: 'Hz' },
    'frequencyHz',
    `${field}/frequencyHz`,
  );
}

/**
 * Checks stored settings before they are written: unique channel ids, delays and trims in range, every
 * EQ filter designable at `sampleRateHz` (the same checks as designBiquad), crossovers of a supported
 * family and order below Nyquist, a subwoofer that names an existing channel. Field paths are relative
 * to the settings object (`/channels/3/eq/1/q`).
 */
export function checkTuningSettings(settings: TuningSettings): void {
  const fs = requireSampleRate(settings.sampleRateHz);
  requireUniqueIds(settings.channels, '/channels');
  settings.channels.forEach((channel, i) => {
    const at = `/channels/${i}`;
    requireInRange(
      channel.delayMs,
      { min: 0, max: TUNING_LIMITS.delayMaxMs, unit: 'ms' },
      'delayMs',
      `${at}/delayMs`,
    );
    requireInRange(
      channel.trimDb,
      { min: TUNING_LIMITS.trimMinDb, max: TUNING_LIMITS.trimMaxDb, unit: 'dB' },
      'trimDb',
      `${at}/trimDb`,
    );
    if (channel.eq.length > TUNING_LIMITS.eqMaxSections) {
      throw new CalculationInputError(
        `at most ${TUNING_LIMITS.eqMaxSections} EQ filters per channel; received ${channel.eq.length}`,
        `${at}/eq`,
      );
    }
    designBiquads(channel.eq, fs, `${at}/eq`);
    if (channel.highPass) checkCrossover(channel.highPass, fs, `${at}/highPass`);
  });
  const sub = settings.subwoofer;
  if (sub) {
    if (!settings.channels.some((c) => c.id === sub.channel)) {
      throw new CalculationInputError(
        `subwoofer channel "${sub.channel}" is not one of the tuning's channels`,
        '/subwoofer/channel',
      );
    }
    if (sub.lowPass) checkCrossover(sub.lowPass, fs, '/subwoofer/lowPass');
    requireInRange(
      sub.lfeGainDb,
      { min: TUNING_LIMITS.lfeGainMinDb, max: TUNING_LIMITS.lfeGainMaxDb, unit: 'dB' },
      'lfeGainDb',
      '/subwoofer/lfeGainDb',
    );
  }
}

/** Runs checkTuningSettings with every field path prefixed (e.g. `/settings`). */
export function checkTuningSettingsAt(prefix: string, settings: TuningSettings): void {
  withFieldPrefix(prefix, () => checkTuningSettings(settings));
}
