/**
 * Deterministic synthetic signals for the analysis tests (no binary fixtures): a seeded generator and
 * exponentially decaying noise of a known reverberation time.
 */

// Module-level aliases: jest runs tests in a vm context where every global lookup (Math) is slow.
const { cos, imul, log, sqrt, PI } = Math;

/** Seeded uniform generator in [0, 1) (mulberry32), so every test run sees the same "noise". */
export function seededRandom(seed: number): () => number {
  let state = seed | 0;
  return () => {
    state = (state + 0x6d2b79f5) | 0;
    let t = imul(state ^ (state >>> 15), 1 | state);
    t = (t + imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Seeded standard normal generator (Box–Muller). */
export function seededGaussian(seed: number): () => number {
  const uniform = seededRandom(seed);
  return () => sqrt(-2 * log(uniform() + 1e-300)) * cos(2 * PI * uniform());
}

export interface DecaySpec {
  sampleRateHz: number;
  durationS: number;
  /** Time for the energy to fall 60 dB, seconds. */
  t60S: number;
  /** First sample of the decay. */
  startSample: number;
  /** RMS of the decay's noise carrier at its start (full scale = 1). */
  startRms: number;
  /** Background noise RMS relative to `startRms`, dB (e.g. −80). */
  noiseDb: number;
  seed: number;
}

/**
 * Gaussian noise under the envelope 10^(−3t/T60) (energy falls 60 dB in T60, the definition of
 * reverberation time in ISO 3382-1), starting at `startSample`, plus steady background noise.
 */
export function noisyDecay(spec: DecaySpec): Float64Array {
  const carrier = seededGaussian(spec.seed);
  const background = seededGaussian(spec.seed + 1000);
  const n = Math.round(spec.durationS * spec.sampleRateHz);
  const noiseRms = spec.startRms * Math.pow(10, spec.noiseDb / 20);
  const perSample = Math.pow(10, -3 / (spec.t60S * spec.sampleRateHz));
  const out = new Float64Array(n);
  let envelope = spec.startRms;
  for (let i = 0; i < n; i++) {
    let decay = 0;
    if (i >= spec.startSample) {
      decay = envelope * carrier();
      envelope *= perSample;
    }
    out[i] = decay + noiseRms * background();
  }
  return out;
}
