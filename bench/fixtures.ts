/** Synthetic inputs the benchmarks share: recordings and request bodies as a room and a client might give them. */
import { WaveFile } from 'wavefile';
import { noisyDecay, seededGaussian, seededRandom } from '../shared/analysis/test-signals';
import { exponentialSweep, type SweepSpec } from '../shared/capture/sweep';
import { MAX_EQ_BANDS, MAX_FIT_POINTS } from '../shared/limits';

/**
 * The sweep as a room might return it: the direct sound 6 ms late, forty reflections decaying at
 * 60 dB per 0.4 s (T60 = 0.4 s) over the next 60 ms, and background noise 80 dB below full scale.
 */
export function roomRecording(spec: SweepSpec, tailS: number): Float64Array {
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

/** A 24-bit PCM WAV file of one channel (full scale ±1), encoded with wavefile. */
export function wav24(samples: Float64Array, sampleRateHz: number): Uint8Array {
  const file = new WaveFile();
  const scaled = Int32Array.from(samples, (v) => Math.round(Math.max(-1, Math.min(1, v)) * 8388607));
  file.fromScratch(1, sampleRateHz, '24', scaled as unknown as number[]);
  return file.toBuffer();
}

/** A measured response with deep ripple over 20 Hz–20 kHz: an EQ fit uses every band it may. */
export function rippledResponse(points: number) {
  const frequenciesHz = Array.from(
    { length: points },
    (_, i) => +(20 * 1000 ** (i / (points - 1))).toFixed(3),
  );
  const magnitudeDb = frequenciesHz.map((_, i) => 10 * Math.sin(i / 5) + 5 * Math.sin(i / 23));
  return { frequenciesHz, magnitudeDb };
}

/** The costliest EQ fit the contract takes: most bands, most points, boosts and cuts at their limits. */
export function heaviestFitBody() {
  return {
    sampleRateHz: 48000,
    measured: rippledResponse(MAX_FIT_POINTS),
    maxBands: MAX_EQ_BANDS,
    maxBoostDb: 24,
    maxCutDb: 48,
  };
}

/** A 5.1 room plan fitting the most bands to a rippled response of the most points on each main channel. */
export function heavyPlanBody() {
  const measuredResponse = rippledResponse(MAX_FIT_POINTS);
  const mains = ['M+030', 'M-030', 'M+000', 'M+110', 'M-110'];
  return {
    layout: '5.1',
    limits: { eqBandsPerChannel: MAX_EQ_BANDS, eqMaxBoostDb: 24 },
    targets: { eqMaxBoostDb: 24 },
    channels: [
      ...mains.map((id) => ({ id, distance: 2.5, measuredResponse })),
      { id: 'LFE1', distance: 2.5 },
    ],
  };
}

/** A room's impulse response of the longest file the analysis takes: 30 s at 192 kHz, T60 = 0.5 s. */
export function longImpulseResponse(): Float64Array {
  const h = noisyDecay({
    sampleRateHz: 192000,
    durationS: 30,
    t60S: 0.5,
    startSample: 2880,
    startRms: 0.05,
    noiseDb: -80,
    seed: 1,
  });
  h[2800] = 0.7;
  return h;
}
