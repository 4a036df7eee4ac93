// Renders a signal through node-web-audio-api's BiquadFilterNode in an OfflineAudioContext (an
// independent implementation of the Audio EQ Cookbook filters) for the capture tests. Runs in a child
// process because node-web-audio-api is an ES module, which the CommonJS test runner cannot load.
// stdin: { sampleRateHz, delaySamples, biquad: { type, frequency, Q, gain } | null, signal: number[] }
// stdout: { samples: number[] } — the rendered output, as long as the input plus delaySamples.
import {
  AudioBuffer,
  AudioBufferSourceNode,
  BiquadFilterNode,
  OfflineAudioContext,
} from 'node-web-audio-api';

const chunks = [];
for await (const chunk of process.stdin) chunks.push(chunk);
const job = JSON.parse(Buffer.concat(chunks).toString('utf8'));
const length = job.signal.length + job.delaySamples;
const ctx = new OfflineAudioContext(1, length, job.sampleRateHz);
const buffer = new AudioBuffer({
  numberOfChannels: 1,
  length: job.signal.length,
  sampleRate: job.sampleRateHz,
});
buffer.copyToChannel(Float32Array.from(job.signal), 0);
const source = new AudioBufferSourceNode(ctx, { buffer });
let last = source;
if (job.biquad) {
  const filter = new BiquadFilterNode(ctx, job.biquad);
  last.connect(filter);
  last = filter;
}
last.connect(ctx.destination);
source.start(job.delaySamples / job.sampleRateHz);
const rendered = await ctx.startRendering();
const samples = Array.from(rendered.getChannelData(0));
process.stdout.write(JSON.stringify({ samples }), () => process.exit(0));
