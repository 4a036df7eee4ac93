import { CalculationInputError, requireInRange, withFieldPrefix } from '../errors';
import { designBiquads, type FilterSpec } from '../filters/biquad-design';
import { designCrossover, type CrossoverSpec, type Polarity } from '../filters/crossover';
import { requireUniqueIds } from '../geometry/analyse-geometry';
import { LIMITS, MAX_EQ_BANDS } from '../limits';

export type { CrossoverSpec } from '../filters/crossover';

/** One output channel's stored settings. Filters are kept as parameters, never as coefficients. */
export interface TuningChannel {
  /** Channel label, e.g. `M+030`; `LFE1` is the subwoofer output fed by the LFE channel. */
  id: string;
  name?: string;
  delayMs: number;
  trimDb: number;
  polarity: Polarity;
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

/**
 * Ranges of stored settings; wide enough for any processor, narrow enough to catch typing errors. The
 * contract's bounds (shared/limits.ts), checked again for callers in the core.
 */
export const TUNING_LIMITS = {
  delayMaxMs: LIMITS.delayMs.maximum,
  trimMinDb: LIMITS.trimDb.minimum,
  trimMaxDb: LIMITS.trimDb.maximum,
  eqMaxSections: MAX_EQ_BANDS,
  lfeGainMinDb: LIMITS['TuningSubwoofer.lfeGainDb'].minimum,
  lfeGainMaxDb: LIMITS['TuningSubwoofer.lfeGainDb'].maximum,
} as const;

function checkCrossover(spec: CrossoverSpec, sampleRateHz: number, field: string): void {
  withFieldPrefix(field, () => designCrossover(spec, sampleRateHz));
}

/**
 * Checks stored settings before they are written: unique channel ids, delays and trims in range, every
 * EQ filter designable at `sampleRateHz` (the same checks as designBiquad), crossovers of a supported
 * family and order below Nyquist, a subwoofer that names an existing channel. Field paths are relative
 * to the settings object (`/channels/3/eq/1/q`).
 */
export function checkTuningSettings(settings: TuningSettings): void {
  const fs = settings.sampleRateHz;
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
