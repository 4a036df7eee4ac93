import { logFrequencyGrid } from '../dsp/grid';
import { cascadeResponse } from '../dsp/response';
import { CalculationInputError } from '../errors';
import type { TuningChannel, TuningSubwoofer } from './tuning';
import { designTuning } from './tuning-design';

/** What a room's processor can do (the optional `limits` of a stored room). */
export interface ProcessorLimits {
  delayMaxMs?: number;
  trimMinDb?: number;
  trimMaxDb?: number;
  eqBandsPerChannel?: number;
  eqMaxBoostDb?: number;
  eqMaxCutDb?: number;
}

/** One setting of a channel the room's processor cannot take; `field` is relative to the channel. */
export interface ChannelLimitProblem {
  field: string;
  message: string;
}

const BOOST_TYPES = new Set(['peaking', 'lowShelf', 'highShelf']);

/** A level with its sign, a true minus sign (U+2212) for negatives as typeset text has it. */
const signed = (value: number): string => (value < 0 ? `\u2212${-value}` : value > 0 ? `+${value}` : '0');

/**
 * The settings of one channel that fall outside the room's processor limits: delay above
 * `delayMaxMs`, trim outside `trimMinDb`…`trimMaxDb`, more EQ bands than `eqBandsPerChannel`, a band
 * boosting more than `eqMaxBoostDb` or cutting more than `eqMaxCutDb`. Empty when the room has no
 * limits or everything fits. Fields are JSON pointers relative to the channel (`/eq/2/gainDb`), in the
 * shape the API names them under `/body/channels/i`.
 */
export function channelLimitProblems(
  channel: Pick<TuningChannel, 'delayMs' | 'trimDb' | 'eq'>,
  limits: ProcessorLimits | null | undefined,
): ChannelLimitProblem[] {
  if (!limits) return [];
  const problems: ChannelLimitProblem[] = [];
  const { delayMaxMs, trimMinDb, trimMaxDb, eqBandsPerChannel, eqMaxBoostDb, eqMaxCutDb } = limits;
  if (delayMaxMs !== undefined && channel.delayMs > delayMaxMs) {
    problems.push({ field: '/delayMs', message: `The processor delays at most ${delayMaxMs} ms.` });
  }
  if (trimMinDb !== undefined && channel.trimDb < trimMinDb) {
    problems.push({
      field: '/trimDb',
      message: `The processor trims down to ${signed(trimMinDb)} dB at most.`,
    });
  }
  if (trimMaxDb !== undefined && channel.trimDb > trimMaxDb) {
    problems.push({
      field: '/trimDb',
      message: `The processor trims up to ${signed(trimMaxDb)} dB at most.`,
    });
  }
  if (eqBandsPerChannel !== undefined && channel.eq.length > eqBandsPerChannel) {
    problems.push({
      field: '/eq',
      message: `The processor has ${eqBandsPerChannel} EQ bands per output; this channel uses ${channel.eq.length}.`,
    });
  }
  channel.eq.forEach((band, i) => {
    if (!BOOST_TYPES.has(band.type) || band.gainDb === undefined) return;
    if (eqMaxBoostDb !== undefined && band.gainDb > eqMaxBoostDb) {
      problems.push({
        field: `/eq/${i}/gainDb`,
        message: `The room allows boosts up to ${signed(eqMaxBoostDb)} dB.`,
      });
    }
    if (eqMaxCutDb !== undefined && band.gainDb < -eqMaxCutDb) {
      problems.push({
        field: `/eq/${i}/gainDb`,
        message: `The room allows cuts down to ${signed(-eqMaxCutDb)} dB.`,
      });
    }
  });
  return problems;
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
