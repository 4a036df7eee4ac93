/**
 * Speed of the capture path: deconvolving and analysing a recorded sweep, and making test signals.
 * `npx tsx bench/capture.bench.ts` runs it alone; `npm run bench` includes it.
 */
import { seededGaussian, seededRandom } from '../shared/analysis/test-signals';
import { exponentialSweep, type SweepSpec } from '../shared/capture/sweep';
import { analyzeSweepRecording } from '../shared/capture/sweep-analysis';
import { makeTestSignal } from '../shared/capture/test-signal';

interface CaptureBenchResult {
  name: string;
  targetMs: number | null;
  runs: number;
  medianMs: number;
  minMs: number;
  medianCpuMs: number;
  firstMs: number;
  passed: boolean | null;
}

function measure(name: string, targetMs: number | null, runs: number, fn: () => unknown): CaptureBenchResult {
  const start = performance.now();
  fn();
  const firstMs = performance.now() - start;
  fn();
  const times: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const used = process.cpuUsage();
    const t = performance.now();
    fn();
    times.push(performance.now() - t);
    const d = process.cpuUsage(used);
    cpu.push((d.user + d.system) / 1000);
  }
  times.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  const medianMs = times[Math.floor(runs / 2)];
  return {
    name,
    targetMs,
    runs,
    medianMs,
    minMs: times[0],
    medianCpuMs: cpu[Math.floor(runs / 2)],
    firstMs,
    passed: targetMs === null ? null : medianMs < targetMs,
  };
}

/**
 * The sweep as a room might return it: the direct sound 6 ms late, forty reflections decaying at
 * 60 dB per 0.4 s (T60 = 0.4 s) over the next 60 ms, and background noise 80 dB below full scale.
 */
function roomRecording(spec: SweepSpec, tailS: number): Float64Array {
  const fs = spec.sampleRateHz;
  const sweep = exponentialSweep(spec);
  const random = seededRandom(3);
  const taps: Array<[number, number]> = [[Math.round(0.006 * fs), 0.6]];
  for (let k = 0; k < 40; k++) {
    const delayS = 0.008 + 0.06 * random();
    taps.push([Math.round(delayS * fs), (random() - 0.5) * 0.4 * Math.pow(10, (-3 * delayS) / 0.4)]);
  }
  const out = new Float64Array(sweep.length + Math.round(tailS * fs));
  for (const [lag, gain] of taps) {
    for (let i = 0; i < sweep.length && i + lag < out.length; i++) out[i + lag] += gain * sweep[i];
  }
  const noise = seededGaussian(9);
  for (let i = 0; i < out.length; i++) out[i] += 1e-4 * noise();
  return out;
}

export async function runCaptureBench(options: { runs?: number } = {}): Promise<CaptureBenchResult[]> {
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
    measure('sweep analysis, 28 s sweep at 192 kHz, 29.5 s recording', null, 3, () =>
      analyzeSweepRecording(recording30, sweep30),
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
  void runCaptureBench().then((results) => {
    for (const r of results) {
      const verdict = r.passed === null ? 'info' : r.passed ? 'ok' : 'SLOW';
      const target = r.targetMs === null ? '' : ` (target < ${r.targetMs} ms)`;
      console.log(
        `${verdict.padEnd(4)} ${r.name}: median ${r.medianMs.toFixed(1)} ms (CPU ${r.medianCpuMs.toFixed(1)} ms), min ${r.minMs.toFixed(1)} ms, first run ${r.firstMs.toFixed(1)} ms over ${r.runs} runs${target}`,
      );
    }
  });
}
