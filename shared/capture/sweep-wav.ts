import { speedOfSoundMps } from '../acoustics/speed-of-sound';
import type { RoomDimensions } from '../analysis/room-modes';
import { MIN_SMOOTHING_OCTAVES } from '../analysis/smoothing';
import { openWav, type WavEncoding } from '../analysis/wav-decode';
import { CalculationInputError } from '../errors';
import type { DeconvolutionMethod } from './deconvolve';
import { analyzeSweepRecording, type SweepAnalysis } from './sweep-analysis';

/** The sweep that was played, as a request gives it (the silence after it is not needed). */
export interface PlayedSweep {
  startHz: number;
  endHz: number;
  durationS: number;
  fadeInS: number;
  fadeOutS: number;
  levelDbfs: number;
}

/**
 * A WAV recording of a sweep to analyse: `/v1/analysis/sweep` and a stored room's sweep upload use it,
 * each naming its own request fields for errors.
 */
export interface SweepWavInput {
  /** The whole file as sent. */
  bytes: Uint8Array;
  /** Zero-based channel holding the microphone; required when the file has more than one. */
  channel?: number;
  /** Zero-based channel holding the loopback (timing reference), if one was recorded. */
  referenceChannel?: number;
  /** Start of the part analysed, seconds into the file (a sequence slot's start). */
  offsetS: number;
  /** Length of the part analysed, seconds; default to the end of the file. */
  lengthS?: number;
  sweep: PlayedSweep;
  method?: DeconvolutionMethod;
  smoothingOctaves: number;
  room?: RoomDimensions;
  temperatureC: number;
  /** The request fields naming the channels, for errors (default `/channel`, `/referenceChannel`). */
  fields?: { channel?: string; referenceChannel?: string };
}

export interface SweepWavAnalysis extends SweepAnalysis {
  file: {
    sampleRateHz: number;
    channelCount: number;
    channelIndex: number;
    encoding: WavEncoding;
    durationS: number;
  };
}

/** The played sweep's parameters picked from a request's fields. */
export function playedSweep(fields: PlayedSweep): PlayedSweep {
  const { startHz, endHz, durationS, fadeInS, fadeOutS, levelDbfs } = fields;
  return { startHz, endHz, durationS, fadeInS, fadeOutS, levelDbfs };
}

/** A recorded sweep read from its WAV file and analysed (pure; runs on a worker thread as `analyseSweepWav`). */
export function analyseSweepWav(input: SweepWavInput): SweepWavAnalysis {
  const channelField = input.fields?.channel ?? '/channel';
  const referenceField = input.fields?.referenceChannel ?? '/referenceChannel';
  if (input.referenceChannel !== undefined && input.referenceChannel === (input.channel ?? 0)) {
    throw new CalculationInputError(
      'the timing reference must be another channel of the file than the microphone',
      referenceField,
    );
  }
  const wav = openWav(input.bytes);
  const { sampleRateHz: fs } = wav;
  const measured = wav.channel(input.channel, channelField);
  const reference =
    input.referenceChannel === undefined ? undefined : wav.channel(input.referenceChannel, referenceField);
  const from = Math.round(input.offsetS * fs);
  if (from >= wav.frameCount) {
    throw new CalculationInputError(
      `offsetS must lie inside the file (${wav.durationS.toFixed(3)} s); received ${input.offsetS} s`,
      '/offsetS',
    );
  }
  const to =
    input.lengthS === undefined
      ? wav.frameCount
      : Math.min(wav.frameCount, from + Math.round(input.lengthS * fs));
  const analysis = analyzeSweepRecording(
    measured.samples.subarray(from, to),
    { sampleRateHz: fs, ...input.sweep, silenceAfterS: 0 },
    {
      method: input.method,
      reference: reference?.samples.subarray(from, to),
      referenceField,
      smoothingOctaves: Math.max(MIN_SMOOTHING_OCTAVES, input.smoothingOctaves),
      room: input.room,
      speedOfSoundMps: speedOfSoundMps(input.temperatureC),
    },
  );
  const { channelCount, encoding, durationS } = wav;
  return {
    ...analysis,
    warnings: [...measured.warnings, ...(reference?.warnings ?? []), ...analysis.warnings],
    file: { sampleRateHz: fs, channelCount, channelIndex: measured.channelIndex, encoding, durationS },
  };
}
