import { spawnSync } from 'node:child_process';
import path from 'node:path';

export type WebAudioJob = { sampleRateHz: number; frequenciesHz: number[] } & (
  | { biquad: { type: WebAudioBiquadType; frequency: number; Q: number; gain: number } }
  | { iir: { feedforward: number[]; feedback: number[] } }
);

export interface WebAudioAnswer {
  /** The frequencies as the float32 API saw them. */
  frequenciesHz: number[];
  magnitude: number[];
  phaseRad: number[];
}

/**
 * Frequency responses from node-web-audio-api's BiquadFilterNode / IIRFilterNode, computed in a
 * child process (see web-audio-reference.mjs beside this file: node-web-audio-api is an ES module,
 * which the CommonJS test runner cannot load).
 */
export function webAudioResponses(jobs: WebAudioJob[]): WebAudioAnswer[] {
  const result = spawnSync(process.execPath, [path.join(__dirname, 'web-audio-reference.mjs')], {
    input: JSON.stringify(jobs),
    maxBuffer: 256 * 1024 * 1024,
    encoding: 'utf8',
  });
  if (result.status !== 0) throw new Error(`web-audio-reference failed: ${result.stderr}`);
  return JSON.parse(result.stdout);
}

export type WebAudioBiquadType =
  'lowpass' | 'highpass' | 'bandpass' | 'lowshelf' | 'highshelf' | 'peaking' | 'notch' | 'allpass';

export interface WebAudioRenderJob {
  sampleRateHz: number;
  /** Start of the source in the rendered output, samples (a whole number, so the start is exact). */
  delaySamples: number;
  biquad: { type: WebAudioBiquadType; frequency: number; Q: number; gain: number } | null;
  signal: ArrayLike<number>;
}

/**
 * A signal played through node-web-audio-api's BiquadFilterNode in an OfflineAudioContext (float32
 * processing), started `delaySamples` late; see web-audio-render.mjs beside this file.
 */
export function webAudioRender(job: WebAudioRenderJob): Float64Array {
  const result = spawnSync(process.execPath, [path.join(__dirname, 'web-audio-render.mjs')], {
    input: JSON.stringify({ ...job, signal: Array.from(job.signal) }),
    maxBuffer: 512 * 1024 * 1024,
    encoding: 'utf8',
  });
  if (result.status !== 0) throw new Error(`web-audio-render failed: ${result.stderr}`);
  return Float64Array.from((JSON.parse(result.stdout) as { samples: number[] }).samples);
}
