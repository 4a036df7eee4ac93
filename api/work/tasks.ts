import { speedOfSoundMps } from '../../shared/acoustics/speed-of-sound';
import { analyzeImpulseResponse } from '../../shared/analysis/analyze-impulse-response';
import { detectArrival, signalLevel } from '../../shared/analysis/level';
import type { DecayPlotOptions } from '../../shared/analysis/decay-plots';
import type { RoomDimensions } from '../../shared/analysis/room-modes';
import { MIN_SMOOTHING_OCTAVES } from '../../shared/analysis/smoothing';
import { openWav } from '../../shared/analysis/wav-decode';
import { readCalibratorWav } from '../../shared/capture/calibrator';
import { analyseSweepWav } from '../../shared/capture/sweep-wav';
import { makeTestSignal, type TestSignalRequest } from '../../shared/capture/test-signal';
import { fitParametricEq, type EqFitInput } from '../../shared/eq-fit/fit-parametric-eq';
import { CalculationInputError } from '../../shared/errors';
import {
  planStoredRoom,
  type StoredMeasurement,
  type StoredPlanOverrides,
  type StoredRoom,
} from '../../shared/plan';
import { requirePlanBudget } from '../../shared/plan/plan-budget';
import { planRoom, type PlanInput } from '../../shared/plan/plan-room';
import { wavFile } from '../test-signals/wav-file';
import { movingBack } from './worker';

/** A WAV impulse response to decode and analyse (an upload to the analysis route or to a room). */
export interface WavAnalysisInput {
  /** The whole file as sent. */
  bytes: Uint8Array;
  /** Zero-based channel of the file; required when it has more than one. */
  channel?: number;
  /** The request field that names the channel, for errors (default `/channel`). */
  channelField?: string;
  /**
   * Another channel of the same file holding the timing reference (loopback): its arrival is detected
   * as the loudspeaker's is and answered as `timingReferenceMs`.
   */
  referenceChannel?: number;
  /** The request field that names the reference channel, for errors. */
  referenceChannelField?: string;
  smoothingOctaves: number;
  room?: RoomDimensions;
  temperatureC: number;
  decayPlots?: DecayPlotOptions;
}

function analyseWav(input: WavAnalysisInput) {
  const wav = openWav(input.bytes);
  const measured = wav.channel(input.channel, input.channelField ?? '/channel');
  const analysis = analyzeImpulseResponse(measured.samples, wav.sampleRateHz, {
    smoothingOctaves: Math.max(MIN_SMOOTHING_OCTAVES, input.smoothingOctaves),
    room: input.room,
    speedOfSoundMps: speedOfSoundMps(input.temperatureC),
    decayPlots: input.decayPlots,
  });
  const { sampleRateHz, channelCount, encoding, durationS } = wav;
  return {
    file: { sampleRateHz, channelCount, channelIndex: measured.channelIndex, encoding, durationS },
    analysis: { ...analysis, warnings: [...measured.warnings, ...analysis.warnings] },
    ...(input.referenceChannel !== undefined && {
      timingReferenceMs: referenceArrivalMs(wav, input.referenceChannel, input.referenceChannelField),
    }),
  };
}

/** The arrival in a file's timing-reference (loopback) channel, ms from the file's start. */
function referenceArrivalMs(wav: ReturnType<typeof openWav>, channel: number, field = '/referenceChannel') {
  const loop = wav.channel(channel, field);
  const level = signalLevel(loop.samples);
  if (level.peakDbfs < -120) throw new CalculationInputError('the timing-reference channel is silent', field);
  return detectArrival(loop.samples, wav.sampleRateHz, level).arrivalMs;
}

/** A stored room's plan: the room and its measurements as read from the database, and the request's overrides. */
export interface StoredPlanInput {
  room: StoredRoom;
  measurements: StoredMeasurement[];
  overrides: StoredPlanOverrides;
}

/**
 * A test signal and, unless only its description is wanted, its WAV file (up to 64 MiB: generating and
 * writing it takes seconds at 192 kHz); the file's memory moves back instead of being copied.
 */
function testSignal({ request, wav }: { request: TestSignalRequest; wav: boolean }) {
  const { channels, signal } = makeTestSignal(request);
  if (!wav) return { signal, wav: null };
  const file: Uint8Array = wavFile(channels, signal.sampleRateHz, signal.encoding);
  return movingBack({ signal, wav: file }, [file]);
}

/**
 * Work too heavy for the event loop, by name: each entry calls the pure functions of `shared/` and
 * runs in a worker thread (`HeavyWork.run` in `heavy-work.ts`). To move another heavy calculation off the
 * event loop, add it here; its input and answer must survive the structured clone (plain data,
 * typed arrays; no functions or class instances).
 */
export const tasks = {
  analyseWav,
  analyseSweepWav,
  readCalibratorWav,
  fitEq: (input: EqFitInput) => fitParametricEq(input),
  planRoom: (input: PlanInput) => {
    requirePlanBudget(input);
    return planRoom(input);
  },
  planStoredRoom: ({ room, measurements, overrides }: StoredPlanInput) =>
    planStoredRoom(room, measurements, overrides),
  testSignal,
};

export type TaskName = keyof typeof tasks;
export type TaskInput<T extends TaskName> = Parameters<(typeof tasks)[T]>[0];
export type TaskOutput<T extends TaskName> = ReturnType<(typeof tasks)[T]>;
