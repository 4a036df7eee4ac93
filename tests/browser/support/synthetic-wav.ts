import { WaveFile } from 'wavefile';

/** Seeded uniform noise in [−0.5, 0.5): a linear congruential generator, so every run writes the same file. */
export function seededNoise(seed: number): () => number {
  let state = seed;
  return () => {
    state = (Math.imul(state, 1103515245) + 12345) >>> 0;
    return state / 2 ** 32 - 0.5;
  };
}

/**
 * A room's answer to a click, as fractions of full scale: a spike of 0.9 at `onsetSample`, then seeded noise
 * under the envelope 0.3·10^(−3t/T60) (energy falls 60 dB in T60, ISO 3382-1), over a steady background
 * 80 dB down.
 */
export function decayingBurst(spec: {
  sampleRateHz: number;
  durationS: number;
  onsetSample: number;
  t60S: number;
  noise: () => number;
}): number[] {
  const n = Math.round(spec.durationS * spec.sampleRateHz);
  const perSample = Math.pow(10, -3 / (spec.t60S * spec.sampleRateHz));
  const samples: number[] = [];
  let envelope = 0.3;
  for (let i = 0; i < n; i++) {
    let value = 1e-4 * spec.noise();
    if (i === spec.onsetSample) value += 0.9;
    if (i >= spec.onsetSample) {
      value += envelope * spec.noise();
      envelope *= perSample;
    }
    samples.push(value);
  }
  return samples;
}

/** Channels of full-scale fractions as a 24-bit PCM WAV file. */
export function pcm24Wav(channels: number[][], sampleRateHz: number): Buffer {
  const fullScale = 2 ** 23 - 1;
  const wav = new WaveFile();
  wav.fromScratch(
    channels.length,
    sampleRateHz,
    '24',
    channels.map((samples) => samples.map((v) => Math.round(v * fullScale))),
  );
  return Buffer.from(wav.toBuffer());
}
