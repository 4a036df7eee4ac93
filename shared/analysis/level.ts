import { CalculationInputError } from '../errors';

export interface SignalLevel {
  /** Largest absolute sample, dB re full scale. */
  peakDbfs: number;
  /** RMS over the whole signal, dB re full scale (raw RMS, not sine-referenced). */
  rmsDbfs: number;
  /** Total energy `10·log10(Σ h²)`, dB re a full-scale unit impulse: the gain the response gives white noise. */
  energyDb: number;
  /** RMS of the last tenth of the signal, dB re full scale: the background noise after the decay. */
  noiseFloorDbfs: number;
  /** `peakDbfs − noiseFloorDbfs`, dB. */
  peakToNoiseDb: number;
  peakSample: number;
}

/** What a true zero (digital silence) reads, dB; any energy at all reads its own level, however low. */
export const ZERO_DB = -300;

const toDb = (power: number): number => (power > 0 ? 10 * Math.log10(power) : ZERO_DB);

/**
 * Peak, RMS, energy and tail-noise levels of an impulse response. The noise is read from the last 10 % of
 * the signal, the usual first estimate of the background noise (Lundeby et al. 1995 [memory]).
 * @param samples the impulse response, full scale ±1.
 */
export function signalLevel(samples: ArrayLike<number>): SignalLevel {
  const n = samples.length;
  if (n === 0) throw new CalculationInputError('the signal has no samples', '/samples');
  let peak = 0;
  let peakSample = 0;
  let energy = 0;
  for (let i = 0; i < n; i++) {
    const v = samples[i];
    energy += v * v;
    if (Math.abs(v) > peak) {
      peak = Math.abs(v);
      peakSample = i;
    }
  }
  const tailStart = Math.floor(n * 0.9);
  let tailEnergy = 0;
  for (let i = tailStart; i < n; i++) tailEnergy += samples[i] * samples[i];
  const noiseFloorDbfs = toDb(tailEnergy / Math.max(1, n - tailStart));
  const peakDbfs = toDb(peak * peak);
  return {
    peakDbfs,
    rmsDbfs: toDb(energy / n),
    energyDb: toDb(energy),
    noiseFloorDbfs,
    peakToNoiseDb: peakDbfs - noiseFloorDbfs,
    peakSample,
  };
}

export interface Arrival {
  /** First sample within `thresholdDb` of the peak (and above the noise). */
  arrivalSample: number;
  arrivalMs: number;
  peakSample: number;
  peakMs: number;
  /** Threshold actually used, dB re the peak. */
  thresholdDb: number;
}

/**
 * Arrival (onset) of an impulse response: the first sample whose level comes within `thresholdDb` of the
 * peak, following ISO 3382-1 Annex A, which places the start where the response first rises clearly above
 * the background noise and no more than 20 dB below the maximum [memory]. When the noise RMS is within
 * 35 dB of the peak the threshold is raised to 15 dB above it (5.6 standard deviations, beyond the peaks
 * of Gaussian noise), so noise alone does not mark the onset.
 *
 * @param samples the impulse response, full scale ±1.
 * @param sampleRateHz sample rate in hertz.
 * @param level the signal's levels (from {@link signalLevel}).
 * @param thresholdDb onset threshold re the peak, dB (default −20).
 */
export function detectArrival(
  samples: ArrayLike<number>,
  sampleRateHz: number,
  level: SignalLevel,
  thresholdDb = -20,
): Arrival {
  const used = Math.min(-0.1, Math.max(thresholdDb, level.noiseFloorDbfs + 15 - level.peakDbfs));
  const thresholdAmplitude = Math.pow(10, (level.peakDbfs + used) / 20);
  let arrivalSample = level.peakSample;
  for (let i = 0; i < level.peakSample; i++) {
    if (Math.abs(samples[i]) >= thresholdAmplitude) {
      arrivalSample = i;
      break;
    }
  }
  return {
    arrivalSample,
    arrivalMs: (arrivalSample / sampleRateHz) * 1000,
    peakSample: level.peakSample,
    peakMs: (level.peakSample / sampleRateHz) * 1000,
    thresholdDb: used,
  };
}
