import { speedOfSoundMps } from '../../shared/acoustics/speed-of-sound';
import { analyzeImpulseResponse } from '../../shared/analysis/analyze-impulse-response';
import type { RoomDimensions } from '../../shared/analysis/room-modes';
import { MIN_SMOOTHING_OCTAVES } from '../../shared/analysis/smoothing';
import { decodeWav } from '../../shared/analysis/wav-decode';
import { analyseSweepWav } from '../../shared/capture/sweep-wav';
import { fitParametricEq, type EqFitInput } from '../../shared/eq-fit/fit-parametric-eq';
import { requirePlanBudget } from '../../shared/plan/plan-budget';
import { planRoom, type PlanInput } from '../../shared/plan/plan-room';

/** A WAV impulse response to decode and analyse (an upload to the analysis route or to a room). */
export interface WavAnalysisInput {
  /** The whole file as sent. */
  bytes: Uint8Array;
  /** Zero-based channel of the file; required when it has more than one. */
  channel?: number;
  /** The request field that names the channel, for errors (default `/channel`). */
  channelField?: string;
  smoothingOctaves: number;
  room?: RoomDimensions;
  temperatureC: number;
}

function analyseWav(input: WavAnalysisInput) {
  const wav = decodeWav(input.bytes, { channel: input.channel, channelField: input.channelField });
  const analysis = analyzeImpulseResponse(wav.samples, wav.sampleRateHz, {
    smoothingOctaves: Math.max(MIN_SMOOTHING_OCTAVES, input.smoothingOctaves),
    room: input.room,
    speedOfSoundMps: speedOfSoundMps(input.temperatureC),
  });
  const { sampleRateHz, channelCount, channelIndex, encoding, durationS } = wav;
  return {
    file: { sampleRateHz, channelCount, channelIndex, encoding, durationS },
    analysis: { ...analysis, warnings: [...wav.warnings, ...analysis.warnings] },
  };
}

/**
 * Work too heavy for the event loop, by name: each entry calls the pure functions of `shared/` and
 * runs in a worker thread (`runHeavy` in `heavy-work.ts`). To move another heavy calculation off the
 * event loop, add it here; its input and answer must survive the structured clone (plain data,
 * typed arrays; no functions or class instances).
 */
export const tasks = {
  analyseWav,
  analyseSweepWav,
  fitEq: (input: EqFitInput) => fitParametricEq(input),
  planRoom: (input: PlanInput) => {
    requirePlanBudget(input);
    return planRoom(input);
  },
};

export type TaskName = keyof typeof tasks;
export type TaskInput<T extends TaskName> = Parameters<(typeof tasks)[T]>[0];
export type TaskOutput<T extends TaskName> = ReturnType<(typeof tasks)[T]>;
