/**
 * Speed of the capture path: deconvolving and analysing a recorded sweep, and making test signals.
 * `npx tsx bench/capture.bench.ts` runs it alone; `npm run bench` includes it.
 */
import type { SweepSpec } from '../shared/capture/sweep';
import { analyzeSweepRecording } from '../shared/capture/sweep-analysis';
import { makeTestSignal } from '../shared/capture/test-signal';
import { roomRecording } from './fixtures';
import { measure, printResults, type BenchResult } from './measure';

export async function runCaptureBench(options: { runs?: number } = {}): Promise<BenchResult[]> {
  const runs = options.runs ?? 11;
  const sweep10: SweepSpec = {
    sampleRateHz: 48000,
    startHz: 20,
    endHz: 20000,
    durationS: 10,
    fadeInS: 0.05,
    fadeOutS: 0.01,
    levelDbfs: -12,
    silenceAfterS: 0,
  };
  const recording = roomRecording(sweep10, 0.9);
  const sweep30: SweepSpec = { ...sweep10, sampleRateHz: 192000, endHz: 40000, durationS: 28 };
  const recording30 = roomRecording(sweep30, 1.5);
  return [
    measure(
      'sweep analysis, 10 s sweep at 48 kHz, 10.9 s recording (deconvolution + harmonics + IR analysis)',
      150,
      runs,
      () => analyzeSweepRecording(recording, sweep10),
    ),
    measure(
      'sweep analysis, 28 s sweep at 192 kHz, 29.5 s recording',
      null,
      3,
      () => analyzeSweepRecording(recording30, sweep30),
      0,
    ),
    measure('test signal: 10 s sweep at 48 kHz', null, runs, () =>
      makeTestSignal({ kind: 'sweep', sampleRateHz: 48000, encoding: 'pcm24', durationS: 10 }),
    ),
    measure('test signal: 30 s full-band pink noise at 48 kHz', null, runs, () =>
      makeTestSignal({ kind: 'pinkNoise', sampleRateHz: 48000, encoding: 'pcm24', durationS: 30 }),
    ),
  ];
}

export default runCaptureBench;

if (require.main === module) {
  void runCaptureBench().then(printResults);
}
