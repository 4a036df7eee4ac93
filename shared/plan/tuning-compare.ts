import { responseGrid } from '../dsp/grid';
import { cascadeResponse } from '../dsp/response';
import { presentNumbers } from '../present';
import type { TuningSettings } from './tuning';
import { designTuning } from './tuning-design';

export interface ChannelDifference {
  id: string;
  /** Where the channel exists. */
  presentIn: 'both' | 'left' | 'right';
  /** right − left, when in both. */
  delayMsDifference: number | null;
  trimDbDifference: number | null;
  polarityChanged: boolean;
  bassManagedChanged: boolean;
  highPassChanged: boolean;
  eqChanged: boolean;
  eqBands: { left: number; right: number };
  /**
   * Largest |right − left| of the channel's correction (trim, EQ and crossover filters, polarity aside)
   * over 20 Hz–20 kHz at 1/6 octave, where either correction is within PASSBAND_RANGE_DB of its own
   * passband (its highest level), dB; null unless in both.
   */
  maxResponseDifferenceDb: number | null;
}

export interface TuningComparison {
  channels: ChannelDifference[];
  subwoofer: { lfeGainDbDifference: number | null; lowPassChanged: boolean };
  identical: boolean;
}

/**
 * Differences deeper than this below both corrections' passbands are not reported, dB: there the
 * loudspeaker is filtered out and two stopbands can differ by hundreds of dB (a high-pass added to a
 * full-range channel) without anything audible changing.
 */
export const PASSBAND_RANGE_DB = 30;

/**
 * Settings compared as answers show them (shared/present.ts): a tuning entered from an answer differs
 * from the stored one only below the last shown decimal, and that is no difference.
 */
const same = (a: unknown, b: unknown) =>
  JSON.stringify(presentNumbers(a)) === JSON.stringify(presentNumbers(b));

/** Largest |b − a| where either response lies within PASSBAND_RANGE_DB of its own highest level. */
function passbandDifferenceDb(a: number[], b: number[]): number {
  const floorA = Math.max(...a) - PASSBAND_RANGE_DB;
  const floorB = Math.max(...b) - PASSBAND_RANGE_DB;
  let largest = 0;
  a.forEach((v, i) => {
    if (v >= floorA || b[i] >= floorB) largest = Math.max(largest, Math.abs(b[i] - v));
  });
  return largest;
}

/** Magnitude of each channel's correction on a shared grid, dB (trim + every designed section). */
function correctionDb(settings: TuningSettings, frequenciesHz: number[]): Map<string, number[]> {
  const designed = designTuning(settings, settings.sampleRateHz);
  return new Map(
    designed.channels.map((c) => [
      c.id,
      cascadeResponse(c.sections, frequenciesHz, settings.sampleRateHz).magnitudeDb.map(
        (db) => db + c.trimDb,
      ),
    ]),
  );
}

/**
 * Per-channel differences between two tunings (right minus left): settings that changed, and how far
 * apart the two corrections' magnitude responses get (cascadeResponse of the sections each tuning
 * designs at its own sample rate, on a common 1/6-octave grid up to 20 kHz or 0.45·fs), counted only
 * where either is within 30 dB of its passband. Settings that differ only below what an answer shows
 * (4 decimals of a ms, 2 of a dB or Hz) count as the same.
 */
export function compareTunings(left: TuningSettings, right: TuningSettings): TuningComparison {
  const topHz = Math.min(20000, 0.45 * Math.min(left.sampleRateHz, right.sampleRateHz));
  const grid = responseGrid(
    { fromHz: 20, toHz: topHz, pointsPerOctave: 6 },
    Math.min(left.sampleRateHz, right.sampleRateHz),
  );
  const leftDb = correctionDb(left, grid);
  const rightDb = correctionDb(right, grid);
  const ids = [...new Set([...left.channels.map((c) => c.id), ...right.channels.map((c) => c.id)])];
  const channels = ids.map((id): ChannelDifference => {
    const l = left.channels.find((c) => c.id === id);
    const r = right.channels.find((c) => c.id === id);
    const both = l !== undefined && r !== undefined;
    const a = leftDb.get(id);
    const b = rightDb.get(id);
    return {
      id,
      presentIn: both ? 'both' : l ? 'left' : 'right',
      delayMsDifference: both ? r.delayMs - l.delayMs : null,
      trimDbDifference: both ? r.trimDb - l.trimDb : null,
      polarityChanged: both && r.polarity !== l.polarity,
      bassManagedChanged: both && r.bassManaged !== l.bassManaged,
      highPassChanged: both && !same(r.highPass, l.highPass),
      eqChanged: both && !same(r.eq, l.eq),
      eqBands: { left: l?.eq.length ?? 0, right: r?.eq.length ?? 0 },
      maxResponseDifferenceDb: a && b ? passbandDifferenceDb(a, b) : null,
    };
  });
  const subwoofer = {
    lfeGainDbDifference:
      left.subwoofer && right.subwoofer ? right.subwoofer.lfeGainDb - left.subwoofer.lfeGainDb : null,
    lowPassChanged: !same(left.subwoofer?.lowPass ?? null, right.subwoofer?.lowPass ?? null),
  };
  const identical =
    left.sampleRateHz === right.sampleRateHz &&
    same(left.channels, right.channels) &&
    same(left.subwoofer, right.subwoofer);
  return { channels, subwoofer, identical };
}
