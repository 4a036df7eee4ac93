import { seededRandom } from '../analysis/test-signals';
import { irfft, nextPowerOfTwo } from '../dsp/fft';
import { CalculationInputError } from '../errors';

/**
 * Bands of the test noise (common practice): `full` 20 Hz–20 kHz (the reference pink noise of level
 * calibration), `mid` 500 Hz–2 kHz (setting loudspeaker levels with a meter, clear of room modes and
 * beaming), `low` 20–80 Hz (subwoofers, below the usual bass-management crossover).
 */
export const PINK_NOISE_BANDS = {
  full: { fromHz: 20, toHz: 20000 },
  mid: { fromHz: 500, toHz: 2000 },
  low: { fromHz: 20, toHz: 80 },
} as const;
export type PinkNoiseBand = keyof typeof PINK_NOISE_BANDS;

/** Fade at each end so the noise starts and stops without a click: 10 ms half-Hann (common practice). */
const FADE_S = 0.01;

export interface PinkNoiseSpec {
  sampleRateHz: number;
  durationS: number;
  band: PinkNoiseBand;
  /** RMS level over the whole signal, dBFS, raw (a full-scale sine reads −3.01 dBFS). */
  rmsDbfs: number;
  /** Seed of the random phases; the same seed gives the same noise. */
  seed: number;
}

export interface PinkNoise {
  samples: Float64Array;
  fromHz: number;
  toHz: number;
  rmsDbfs: number;
  /** The same RMS on the sine-referenced scale (AES17 style, a full-scale sine reads 0 dB): raw + 3.01 dB. */
  rmsDbfsSineReferenced: number;
  peakDbfs: number;
  /** Peak over RMS, dB. */
  crestFactorDb: number;
}

/** 20·log10(√2): how far a sine's peak is above its RMS. */
export const SINE_CREST_DB = 20 * Math.log10(Math.SQRT2);

/**
 * Pink noise shaped in the frequency domain: every bin inside the band gets magnitude ∝ 1/√f (power
 * spectral density ∝ 1/f, −3.01 dB per octave, so equal energy in every fractional-octave band) and a
 * uniformly random phase; bins outside the band are zero. The inverse transform is periodic noise with an
 * exactly pink spectrum over one period (the transform size, the smallest power of two holding the
 * duration); the first `durationS` of it are returned, faded in and out over 10 ms and scaled to the RMS.
 *
 * @throws CalculationInputError `/levelDbfs` when the peak would pass full scale, `/band` when the band
 *   lies above Nyquist.
 */
export function pinkNoise(spec: PinkNoiseSpec): PinkNoise {
  const { sampleRateHz: fs } = spec;
  const { fromHz } = PINK_NOISE_BANDS[spec.band];
  const toHz = Math.min(PINK_NOISE_BANDS[spec.band].toHz, fs / 2);
  const length = Math.round(spec.durationS * fs);
  const size = nextPowerOfTwo(length);
  const bins = size / 2 + 1;
  const re = new Float64Array(bins);
  const im = new Float64Array(bins);
  const random = seededRandom(spec.seed);
  const binHz = fs / size;
  const first = Math.ceil(fromHz / binHz);
  const last = Math.floor(toHz / binHz);
  if (last < first) {
    throw new CalculationInputError(
      `the ${spec.band} band holds no frequency at ${fs} Hz for ${spec.durationS} s`,
      '/band',
    );
  }
  for (let k = first; k <= last; k++) {
    const magnitude = 1 / Math.sqrt(k * binHz);
    const phase = 2 * Math.PI * random();
    re[k] = magnitude * Math.cos(phase);
    im[k] = magnitude * Math.sin(phase);
  }
  const noise = irfft({ size, re, im }).slice(0, length);
  const fade = Math.min(Math.round(FADE_S * fs), Math.floor(length / 2));
  for (let i = 0; i < fade; i++) {
    const w = 0.5 * (1 - Math.cos((Math.PI * i) / fade));
    noise[i] *= w;
    noise[length - 1 - i] *= w;
  }
  let energy = 0;
  for (let i = 0; i < length; i++) energy += noise[i] * noise[i];
  const scale = Math.pow(10, spec.rmsDbfs / 20) / Math.sqrt(energy / length);
  let peak = 0;
  for (let i = 0; i < length; i++) {
    noise[i] *= scale;
    peak = Math.max(peak, Math.abs(noise[i]));
  }
  const peakDbfs = 20 * Math.log10(peak);
  if (peak >= 1) {
    throw new CalculationInputError(
      `at ${spec.rmsDbfs} dBFS RMS this noise peaks at ${peakDbfs.toFixed(2)} dBFS (crest factor ${(peakDbfs - spec.rmsDbfs).toFixed(2)} dB) and would clip; choose at most ${(spec.rmsDbfs - peakDbfs - 0.01).toFixed(2)} dBFS`,
      '/levelDbfs',
    );
  }
  return {
    samples: noise,
    fromHz,
    toHz,
    rmsDbfs: spec.rmsDbfs,
    rmsDbfsSineReferenced: spec.rmsDbfs + SINE_CREST_DB,
    peakDbfs,
    crestFactorDb: peakDbfs - spec.rmsDbfs,
  };
}
