import type { ChartSpec } from '../ui/chart/chart-spec';
import {
  type ChannelCorrection,
  type ChannelLimitProblem,
  channelLimitProblems,
  delayInSamples,
} from '../../../../shared/plan/channel-edit';
import type { ProcessorProfileSettings } from '../../../../shared/processor/profile';
import { formatQuantity, formatSigned } from '../format/format';
import type { FilterType, ProcessorLimits, StoredCrossover, Tuning, TuningVersion } from './tuning.model';

/** One line of the per-channel table. */
export interface ChannelRow {
  id: string;
  name: string;
  delayMs: number;
  delaySamples: number;
  trimDb: number;
  polarity: 'normal' | 'inverted';
  highPass: string;
  eqBands: number;
  bassManaged: boolean;
  /** Settings of this channel the room's processor cannot take. */
  overLimits: ChannelLimitProblem[];
}

export const FILTER_TYPE_LABELS: Record<FilterType, string> = {
  peaking: 'Peaking',
  lowShelf: 'Low shelf',
  highShelf: 'High shelf',
  lowPass: 'Low-pass',
  highPass: 'High-pass',
  bandPass: 'Band-pass',
  notch: 'Notch',
  allPass: 'All-pass',
};

/** Filter types whose gain is set (the others refuse one). */
export const GAIN_TYPES: ReadonlySet<FilterType> = new Set(['peaking', 'lowShelf', 'highShelf']);

/** "Linkwitz-Riley 24 dB/oct, 80 Hz"; "Full range" when there is none. */
export function crossoverLabel(crossover: StoredCrossover | null | undefined): string {
  if (!crossover) return 'Full range';
  const family = crossover.family === 'linkwitzRiley' ? 'Linkwitz-Riley' : 'Butterworth';
  return `${family} ${crossover.order * 6} dB/oct, ${formatQuantity(crossover.frequencyHz, 'Hz', 0)}`;
}

export function channelRows(
  tuning: Pick<Tuning, 'channels' | 'sampleRateHz'>,
  limits: ProcessorLimits | null | undefined,
  names: ReadonlyMap<string, string> = new Map(),
  profile?: ProcessorProfileSettings | null,
): ChannelRow[] {
  return tuning.channels.map((channel) => ({
    id: channel.id,
    name: channel.name || names.get(channel.id) || '',
    delayMs: channel.delayMs,
    delaySamples: delayInSamples(channel.delayMs, tuning.sampleRateHz),
    trimDb: channel.trimDb,
    polarity: channel.polarity,
    highPass: crossoverLabel(channel.highPass),
    eqBands: channel.eq.length,
    bassManaged: channel.bassManaged,
    overLimits: channelLimitProblems(channel, tuning.sampleRateHz, limits, profile),
  }));
}

/** The room's limits as one sentence for the editor ("none set" when the room has none). */
export function limitsSummary(
  limits: ProcessorLimits | null | undefined,
  profileName?: string | null,
): string {
  const profile = profileName ? ` Processor profile “${profileName}” applies as well.` : '';
  if (!limits || Object.keys(limits).length === 0) return `The room sets no processor limits.${profile}`;
  const parts: string[] = [];
  if (limits.delayMaxMs !== undefined)
    parts.push(`delay up to ${formatQuantity(limits.delayMaxMs, 'ms', 1)}`);
  if (limits.trimMinDb !== undefined || limits.trimMaxDb !== undefined) {
    parts.push(
      `trim ${formatSigned(limits.trimMinDb ?? null, 'dB', 1)} to ${formatSigned(limits.trimMaxDb ?? null, 'dB', 1)}`,
    );
  }
  if (limits.eqBandsPerChannel !== undefined) parts.push(`${limits.eqBandsPerChannel} EQ bands per output`);
  if (limits.eqMaxBoostDb !== undefined)
    parts.push(`boost up to ${formatSigned(limits.eqMaxBoostDb, 'dB', 1)}`);
  if (limits.eqMaxCutDb !== undefined) parts.push(`cut down to ${formatSigned(-limits.eqMaxCutDb, 'dB', 1)}`);
  return `Room limits: ${parts.join(', ')}.${profile}`;
}

/** The channel-relative field an API pointer names for the channel sent at `index`, or null. */
export function channelFieldOf(pointer: string, index = 0): string | null {
  const prefix = `/body/channels/${index}`;
  if (pointer === prefix) return '';
  return pointer.startsWith(`${prefix}/`) ? pointer.slice(prefix.length) : null;
}

/** The correction's magnitude and the EQ alone, against log frequency, with the boost ceiling dashed. */
export function correctionChart(
  correction: ChannelCorrection,
  channelId: string,
  limits: ProcessorLimits | null | undefined,
): ChartSpec {
  const all = [...correction.magnitudeDb, ...correction.eqDb].filter((value) => Number.isFinite(value));
  const top = Math.max(6, ...all.map((value) => Math.ceil(value / 3) * 3 + 3));
  const bottom = Math.max(-36, Math.min(-12, ...all.map((value) => Math.floor(value / 3) * 3 - 3)));
  const points = (values: number[]) =>
    correction.frequenciesHz.map((x, i) => ({ x, y: Number.isFinite(values[i]) ? values[i] : null }));
  const series: ChartSpec['series'] = [
    { label: 'Whole channel (trim, EQ, crossover)', points: points(correction.magnitudeDb), colour: 1 },
    { label: 'EQ bands', points: points(correction.eqDb), colour: 3, dashed: true },
  ];
  if (limits?.eqMaxBoostDb !== undefined) {
    series.push({
      label: `Boost limit ${formatSigned(limits.eqMaxBoostDb, 'dB', 1)}`,
      points: [
        { x: correction.frequenciesHz[0], y: limits.eqMaxBoostDb },
        { x: correction.frequenciesHz.at(-1) ?? 20000, y: limits.eqMaxBoostDb },
      ],
      colour: 0,
      dashed: true,
    });
  }
  const peak = Math.max(...correction.eqDb);
  const dip = Math.min(...correction.eqDb);
  return {
    kind: 'line',
    xScale: 'log',
    xTitle: 'Frequency (Hz)',
    yTitle: 'Level (dB)',
    yMin: bottom,
    yMax: top,
    yStep: 3,
    series,
    summary:
      `Response of ${channelId}'s correction from ${Math.round(correction.frequenciesHz[0])} Hz to ` +
      `${Math.round(correction.frequenciesHz.at(-1) ?? 0)} Hz. EQ alone ranges from ` +
      `${formatSigned(dip, 'dB', 1)} to ${formatSigned(peak, 'dB', 1)}.`,
  };
}

const ORIGINS: Record<TuningVersion['origin'], string> = {
  settings: 'Entered settings',
  plan: 'Made from a plan',
  edit: 'Edited',
  restore: 'Restored',
  duplicate: 'Duplicated',
};

/** "Restored from v2", "Edited", … */
export function versionOrigin(version: Pick<TuningVersion, 'origin' | 'restoredFromVersion'>): string {
  if (version.origin === 'restore' && version.restoredFromVersion) {
    return `Restored from v${version.restoredFromVersion}`;
  }
  return ORIGINS[version.origin] ?? version.origin;
}

/** Who made a version, as far as the caller may know: "You", "You (key …)", "Another user", "Not known". */
export function versionAuthor(version: Pick<TuningVersion, 'createdBy'>, myUserId: string | null): string {
  const { userId, keyId } = version.createdBy;
  if (!userId) return 'Not known';
  const who = userId === myUserId ? 'You' : `User ${userId}`;
  return keyId ? `${who}, with key ${keyId}` : `${who}, in the console`;
}

/** "Its one version", "Both versions", "All 5 versions": never "All 2". */
export function versionsPhrase(count: number): string {
  if (count === 1) return 'Its one version';
  if (count === 2) return 'Both versions';
  return `All ${count} versions`;
}
