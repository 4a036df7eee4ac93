import { logFrequencyGrid } from '../dsp/grid';
import { cascadeResponse } from '../dsp/response';
import { CalculationInputError } from '../errors';
import type { ProcessorProfileSettings } from '../processor/profile';
import type { TuningChannel, TuningSubwoofer } from './tuning';
import { findLimitViolations, type LimitViolation, type RoomLimits } from './tuning-limits';
import { designTuning } from './tuning-design';

/** One setting of a channel the room's processor cannot take; `field` is relative to the channel. */
export interface ChannelLimitProblem {
  field: string;
  message: string;
}

/** A level with its sign, a true minus sign (U+2212) for negatives as typeset text has it. */
const signed = (value: number): string => (value < 0 ? `\u2212${-value}` : value > 0 ? `+${value}` : '0');

/** The violation in words for the field it sits under; the check's own sentence where none fits. */
function inWords(violation: LimitViolation, field: string): string {
  const value = violation.limit.value;
  if (typeof value !== 'number') return violation.message;
  const whose = violation.limit.source === 'room' ? 'The room' : 'The processor profile';
  switch (violation.limit.name) {
    case 'delayMaxMs':
    case 'delay.max':
      return `${whose} allows delays up to ${value} ms.`;
    case 'trimMinDb':
    case 'trimDb.min':
      return `${whose} allows trims down to ${signed(value)} dB.`;
    case 'trimMaxDb':
    case 'trimDb.max':
      return `${whose} allows trims up to ${signed(value)} dB.`;
    case 'eqBandsPerChannel':
    case 'eq.bandsPerChannel':
      return `${whose} allows ${value} EQ bands per output.`;
    case 'eqMaxBoostDb':
      return field === '/eq'
        ? `${violation.message[0].toUpperCase()}${violation.message.slice(1)}.`
        : `${whose} allows boosts up to ${signed(value)} dB.`;
    case 'eqMaxCutDb':
      return `${whose} allows cuts down to ${signed(-value)} dB.`;
    default:
      return `${violation.message[0].toUpperCase()}${violation.message.slice(1)}.`;
  }
}

/**
 * The settings of one channel outside the room's limits and its processor profile, found by the same
 * check every tuning write goes through (findLimitViolations), so the editor refuses as the API does.
 * Fields are JSON pointers relative to the channel (`/eq/2/gainDb`), the shape the API names them in
 * under `/body/channels/i`. A channel whose filters cannot be designed yet (a band above Nyquist) is left
 * to channelCorrection, which names that field.
 */
export function channelLimitProblems(
  channel: TuningChannel,
  sampleRateHz: number,
  limits: RoomLimits | null | undefined,
  profile?: ProcessorProfileSettings | null,
): ChannelLimitProblem[] {
  if (!limits && !profile) return [];
  let violations: LimitViolation[];
  try {
    violations = findLimitViolations({ sampleRateHz, channels: [channel], subwoofer: null }, limits, profile);
  } catch (error) {
    if (error instanceof CalculationInputError) return [];
    throw error;
  }
  return violations
    .filter((violation) => violation.setting.startsWith('/channels/0'))
    .map((violation) => {
      const field = violation.setting.slice('/channels/0'.length);
      return { field, message: inWords(violation, field) };
    });
}

/** A delay in whole samples at `sampleRateHz`, rounded to the nearest sample as the export rounds it. */
export function delayInSamples(delayMs: number, sampleRateHz: number): number {
  return Math.round((delayMs * sampleRateHz) / 1000);
}

/** The magnitude of one channel's correction, or why it cannot be designed. */
export interface ChannelCorrection {
  frequenciesHz: number[];
  /** Trim plus every designed section (EQ, high-pass, and the subwoofer's low-pass on its channel), dB. */
  magnitudeDb: number[];
  /** Magnitude of the EQ bands alone, dB. */
  eqDb: number[];
  /** The channel's delay in whole samples at the tuning's rate (nearest sample, as exported). */
  delaySamples: number;
}

/**
 * The response a channel's settings make, on a 1/24-octave grid from 10 Hz up to 20 kHz (or 0.45·fs),
 * designed exactly as the export designs it (designTuning: Audio EQ Cookbook biquads, Linkwitz-Riley or
 * Butterworth cascades), so the plot beside the editor is the response the processor will get.
 * @throws CalculationInputError naming the channel-relative field of a filter that cannot be realised
 *   at this rate (e.g. `/eq/1/frequencyHz` at or above Nyquist).
 */
export function channelCorrection(
  channel: TuningChannel,
  subwoofer: TuningSubwoofer | null,
  sampleRateHz: number,
): ChannelCorrection {
  // Whole 1/24-octave steps from 10 Hz, so the octaves of 10 Hz (20, 40, 80 Hz …) are points of the plot.
  const octaves = Math.floor(Math.log2(Math.min(20000, 0.45 * sampleRateHz) / 10) * 24) / 24;
  const frequenciesHz = logFrequencyGrid(10, 10 * 2 ** octaves, 24);
  const sub = subwoofer && subwoofer.channel === channel.id ? subwoofer : null;
  let designed;
  try {
    designed = designTuning({ sampleRateHz, channels: [channel], subwoofer: sub }, sampleRateHz).channels[0];
  } catch (error) {
    if (error instanceof CalculationInputError) {
      throw new CalculationInputError(error.message, error.field.replace(/^\/channels\/0/, ''));
    }
    throw error;
  }
  const all = cascadeResponse(designed.sections, frequenciesHz, sampleRateHz).magnitudeDb;
  const eqSections = designed.sections.filter((section) => section.stage === 'eq');
  const eqDb = eqSections.length
    ? cascadeResponse(eqSections, frequenciesHz, sampleRateHz).magnitudeDb
    : frequenciesHz.map(() => 0);
  return {
    frequenciesHz,
    magnitudeDb: all.map((db) => db + channel.trimDb),
    eqDb,
    delaySamples: designed.delaySamples,
  };
}
