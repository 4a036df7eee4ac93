// Runs node-web-audio-api (an ES module, which the CommonJS test runner cannot load) in a child
// process for the filter tests. Reads a JSON list of jobs on stdin and writes their responses:
//   { sampleRateHz, frequenciesHz, biquad: { type, frequency, Q, gain } }   -> BiquadFilterNode
//   { sampleRateHz, frequenciesHz, iir: { feedforward, feedback } }         -> IIRFilterNode
// Each answer is { magnitude: number[], phaseRad: number[] } from getFrequencyResponse (float32).
import { BiquadFilterNode, IIRFilterNode, OfflineAudioContext } from 'node-web-audio-api';

const chunks = [];
for await (const chunk of process.stdin) chunks.push(chunk);
const jobs = JSON.parse(Buffer.concat(chunks).toString('utf8'));
const contexts = new Map();
const answers = jobs.map((job) => {
  if (!contexts.has(job.sampleRateHz)) {
    contexts.set(job.sampleRateHz, new OfflineAudioContext(1, 128, job.sampleRateHz));
  }
  const ctx = contexts.get(job.sampleRateHz);
  const node = job.biquad ? new BiquadFilterNode(ctx, job.biquad) : new IIRFilterNode(ctx, job.iir);
  const frequencies = new Float32Array(job.frequenciesHz);
  const magnitude = new Float32Array(frequencies.length);
  const phase = new Float32Array(frequencies.length);
  node.getFrequencyResponse(frequencies, magnitude, phase);
  return {
    frequenciesHz: Array.from(frequencies),
    magnitude: Array.from(magnitude),
    phaseRad: Array.from(phase),
  };
});
// The audio contexts keep the event loop alive, so exit once the answer is flushed.
process.stdout.write(JSON.stringify(answers), () => process.exit(0));
