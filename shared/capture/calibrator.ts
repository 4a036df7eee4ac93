import { designBandPass } from '../analysis/band-filter';
import { SignalProblemError } from '../analysis/signal-problem';
import { decodeWav } from '../analysis/wav-decode';
import { rfft } from '../dsp/fft';
import { sosfilt } from '../dsp/sosfilt';

/** Sound calibrators' levels: 94 dB SPL (1 Pa) and 114 dB SPL, at 1 kHz (IEC 60942). */
export const CALIBRATOR_LEVELS_DB = [94, 114] as const;
export const CALIBRATOR_FREQUENCY_HZ = 1000;
/** How far the tone found may lie from 1 kHz: IEC 60942 allows class 1 calibrators ±1 % (from memory); ±5 % takes a drifting one with room, refuses another tone. */
const FREQUENCY_TOLERANCE = 0.05;
/** The first and last quarter second are left out: the calibrator is being fitted or taken off. */
const EDGE_S = 0.25;
/** At least one second of steady tone is read. */
const MIN_STEADY_S = 1;
/** Broadband above in-band level by more than this: noise or hum is adding to the reading (warning). */
const NOISE_WARNING_DB = 0.5;
/** Peaks this close to full scale may have clipped. */
const CLIP_LEVEL = 0.999;

export interface CalibratorReading {
  calibratorLevelDb: number;
  /** Frequency of the strongest spectral line found, hertz. */
  measuredFrequencyHz: number;
  /** RMS of the tone in its octave band (IEC 61260-1 band filter), dB re full scale (raw RMS, a full-scale sine reads −3.01 dBFS). */
  rmsDbfs: number;
  /** RMS of everything recorded, dBFS: more than the band's when noise or hum adds to the reading. */
  broadbandRmsDbfs: number;
  /** SPL = dBFS + offset, for this microphone at this input gain. */
  splOffsetDb: number;
  /** Seconds of tone read. */
  analysedS: number;
  warnings: { code: string; message: string }[];
}

/**
 * A calibrator's tone (1 kHz at 94 or 114 dB SPL) recorded through the microphone and input turned into
 * the offset from dB re full scale to dB SPL: offset = calibrator level − the tone's RMS in dBFS, read in
 * the 1 kHz octave band so noise outside it does not count.
 *
 * @throws SignalProblemError (field `/file`) when the recording is too short, silent, clipped, or its
 *   strongest tone is not near 1 kHz.
 */
export function readCalibrator(
  samples: Float64Array,
  sampleRateHz: number,
  calibratorLevelDb: number,
): CalibratorReading {
  const edge = Math.round(EDGE_S * sampleRateHz);
  const steady = samples.subarray(edge, Math.max(edge, samples.length - edge));
  if (steady.length < MIN_STEADY_S * sampleRateHz) {
    throw new SignalProblemError(
      `The recording must hold at least ${MIN_STEADY_S + 2 * EDGE_S} s of the calibrator's tone (the first and last ${EDGE_S} s are left out); it lasts ${(samples.length / sampleRateHz).toFixed(2)} s.`,
      'tooShort',
    );
  }
  let peak = 0;
  for (const v of steady) peak = Math.max(peak, Math.abs(v));
  if (peak < 1e-6) throw new SignalProblemError('The recording is silent (peak below −120 dBFS).', 'silent');
  if (peak >= CLIP_LEVEL) {
    throw new SignalProblemError(
      'The tone reaches full scale and may have clipped; lower the input gain and record again (the offset holds for the gain it was taken at).',
      'invalidSamples',
    );
  }
  const frequencyHz = strongestFrequencyHz(steady, sampleRateHz);
  if (Math.abs(frequencyHz / CALIBRATOR_FREQUENCY_HZ - 1) > FREQUENCY_TOLERANCE) {
    throw new SignalProblemError(
      `The strongest tone is at ${frequencyHz.toFixed(1)} Hz; a calibrator plays ${CALIBRATOR_FREQUENCY_HZ} Hz (within ±${FREQUENCY_TOLERANCE * 100} % accepted). Is the calibrator on the microphone and switched on?`,
      'invalidSamples',
    );
  }
  // The band filter settles within a few periods; read its output past the first 50 ms.
  const banded = sosfilt(designBandPass(CALIBRATOR_FREQUENCY_HZ, 1, sampleRateHz), steady);
  const settle = Math.round(0.05 * sampleRateHz);
  const rmsDbfs = rmsDb(banded.subarray(settle));
  const broadbandRmsDbfs = rmsDb(steady.subarray(settle));
  const warnings: CalibratorReading['warnings'] = [];
  if (broadbandRmsDbfs - rmsDbfs > NOISE_WARNING_DB) {
    warnings.push({
      code: 'calibratorNoise',
      message: `Everything recorded reads ${(broadbandRmsDbfs - rmsDbfs).toFixed(1)} dB above the 1 kHz tone: noise or hum is present. The offset uses the tone alone; a quieter room gives a surer reading.`,
    });
  }
  return {
    calibratorLevelDb,
    measuredFrequencyHz: Math.round(frequencyHz * 10) / 10,
    rmsDbfs,
    broadbandRmsDbfs,
    splOffsetDb: calibratorLevelDb - rmsDbfs,
    analysedS: steady.length / sampleRateHz,
    warnings,
  };
}

function rmsDb(x: ArrayLike<number>): number {
  let energy = 0;
  for (let i = 0; i < x.length; i++) energy += x[i] * x[i];
  return 10 * Math.log10(energy / x.length);
}

/** The strongest line of a Hann-windowed spectrum, refined by a parabola through the log magnitudes. */
function strongestFrequencyHz(x: Float64Array, fs: number): number {
  let size = 1;
  while (size < x.length && size < 1 << 18) size *= 2;
  const n = Math.min(size, x.length);
  const windowed = new Float64Array(n);
  for (let i = 0; i < n; i++) windowed[i] = x[i] * (0.5 - 0.5 * Math.cos((2 * Math.PI * i) / (n - 1)));
  const { re, im } = rfft(windowed, size);
  let at = 1;
  let best = 0;
  for (let k = 1; k < re.length - 1; k++) {
    const p = re[k] * re[k] + im[k] * im[k];
    if (p > best) {
      best = p;
      at = k;
    }
  }
  const mag = (k: number) => Math.log(Math.max(1e-300, re[k] * re[k] + im[k] * im[k]));
  const a = mag(at - 1);
  const b = mag(at);
  const c = mag(at + 1);
  const shift = a - 2 * b + c === 0 ? 0 : (0.5 * (a - c)) / (a - 2 * b + c);
  return ((at + shift) * fs) / size;
}

/** A calibrator recording read from its WAV file (pure; runs on a worker thread as `readCalibratorWav`). */
export function readCalibratorWav(input: {
  bytes: Uint8Array;
  channel?: number;
  calibratorLevelDb: number;
}): CalibratorReading {
  const wav = decodeWav(input.bytes, { channel: input.channel });
  const reading = readCalibrator(wav.samples, wav.sampleRateHz, input.calibratorLevelDb);
  return { ...reading, warnings: [...wav.warnings, ...reading.warnings] };
}
