import { cumulativeSpectralDecay, spectrogram, type DecayPlot, type DecayPlotOptions } from './decay-plots';
import { requireInRange } from '../errors';
import { LIMITS, SAMPLE_RATE_MAX_HZ, SAMPLE_RATE_MIN_HZ } from '../limits';
import { logFrequencyGrid } from '../dsp/grid';
import { sosfilt } from '../dsp/sosfilt';
import { designBandPass } from './band-filter';
import { decayTimes, type DecayTimes } from './decay';
import { bandCentreHz, bandEdgesHz, nominalOctaveCentreHz } from './iec-bands';
import { detectArrival, signalLevel, ZERO_DB, type Arrival, type SignalLevel } from './level';
import {
  roomModes,
  roomVolumeM3,
  schroederFrequencyHz,
  type RoomDimensions,
  type RoomMode,
} from './room-modes';
import { SignalProblemError } from './signal-problem';
import { MAX_SMOOTHING_OCTAVES, MIN_SMOOTHING_OCTAVES } from './smoothing';
import { realSpectrum, smoothedResponse, type SmoothedResponse } from './spectrum';

export interface AnalysisWarning {
  code: string;
  message: string;
}

export interface ImpulseResponseAnalysisOptions {
  /** Smoothing window in octaves, 1/48..1 (default 1/12). */
  smoothingOctaves?: number;
  /** Inside dimensions of a rectangular room, for its modes and Schroeder frequency. */
  room?: RoomDimensions;
  /** Speed of sound for the modes, m/s (default 343.2, air at 20 °C). */
  speedOfSoundMps?: number;
  /** Decay over frequency to add: a waterfall, a spectrogram, or both. */
  decayPlots?: DecayPlotOptions;
}

export interface BandDecay extends DecayTimes {
  centreHz: number;
  nominalHz: number;
}

export interface ImpulseResponseAnalysis {
  sampleRateHz: number;
  durationS: number;
  arrival: Arrival;
  level: Omit<SignalLevel, 'peakSample'>;
  frequencyResponse: SmoothedResponse & { smoothingOctaves: number };
  decay: DecayTimes & { impulseToNoiseDb: number; truncationMs: number; bands: BandDecay[] };
  room?: {
    volumeM3: number;
    speedOfSoundMps: number;
    /** From the broadband T30 (or T20, or EDT); null when no decay time could be measured. */
    schroederFrequencyHz: number | null;
    modesUpToHz: number;
    modes: RoomMode[];
    /** Why the list ends where it does, and how much of it is listed. */
    modesLimit: ModesLimit;
  };
  waterfall?: DecayPlot;
  spectrogram?: DecayPlot;
  warnings: AnalysisWarning[];
}

/**
 * Where a mode list ends and why: at the Schroeder frequency (above it modes overlap and the field is
 * statistical), or at a default when no decay time gave one; and, when more modes lie below that limit
 * than are listed, the frequency of the last one listed.
 */
export interface ModesLimit {
  reason: 'schroederFrequency' | 'noSchroederFrequency';
  /** Modes at or below `modesUpToHz`. */
  found: number;
  listed: number;
  /** Frequency of the last mode listed when the list was cut by count, else null. */
  cutAtHz: number | null;
  /** The lowest mode of the room (the axial mode of its longest dimension), hertz. */
  lowestModeHz: number;
}

/** Most modes listed: more say nothing a plot of the response does not (a 0.5 m cube with T = 20 s has ~26,000). */
export const MAX_LISTED_MODES = 500;

export const DEFAULT_SMOOTHING_OCTAVES = LIMITS.smoothingOctaves.default;
/** Speed of sound in air at 20 °C, `343.2·sqrt((t + 273.15)/293.15)` at t = 20 (ISO 9613-1 form, as in the pyfar library). */
export const DEFAULT_SPEED_OF_SOUND_MPS = 343.2;
/** Output grid density of the frequency response: 48 points per octave. */
const GRID_POINTS_PER_OCTAVE = 48;
/** Below this peak level the signal counts as silent (−120 dBFS, far under 16-bit quantisation). */
const SILENCE_DBFS = -120;
/** Octave bands 63 Hz..8 kHz (band numbers −4..3), the extended range of ISO 3382-1 [memory]. */
const OCTAVE_BAND_INDICES = [-4, -3, -2, -1, 0, 1, 2, 3];
/** Longest stretch transformed for the frequency response: 2^20 samples (21.8 s at 48 kHz, 5.5 s at 192 kHz). */
const MAX_RESPONSE_SAMPLES = 1 << 20;
/** Modes are listed up to the Schroeder frequency, or this when it is unknown. */
const DEFAULT_MODES_UP_TO_HZ = 300;

/**
 * Analyses one impulse response: arrival, levels, smoothed frequency response, decay times broadband and
 * per octave band, and — when the room is given — its modes and Schroeder frequency.
 *
 * @param samples the impulse response, full scale ±1 (at least 10 ms).
 * @param sampleRateHz sample rate in hertz (SAMPLE_RATE_MIN_HZ..SAMPLE_RATE_MAX_HZ).
 * @throws SignalProblemError `silent` when the peak is below −120 dBFS, `tooShort` under 10 ms.
 */
export function analyzeImpulseResponse(
  samples: Float64Array,
  sampleRateHz: number,
  options: ImpulseResponseAnalysisOptions = {},
): ImpulseResponseAnalysis {
  requireInRange(
    sampleRateHz,
    { min: SAMPLE_RATE_MIN_HZ, max: SAMPLE_RATE_MAX_HZ, unit: 'Hz' },
    'sampleRateHz',
    '/sampleRateHz',
  );
  const smoothingOctaves = requireInRange(
    options.smoothingOctaves ?? DEFAULT_SMOOTHING_OCTAVES,
    { min: MIN_SMOOTHING_OCTAVES - 1e-12, max: MAX_SMOOTHING_OCTAVES },
    'smoothingOctaves',
    '/smoothingOctaves',
  );
  if (samples.length < 0.01 * sampleRateHz) {
    throw new SignalProblemError(
      `The response lasts ${((samples.length / sampleRateHz) * 1000).toFixed(2)} ms; at least 10 ms is needed.`,
      'tooShort',
    );
  }
  const warnings: AnalysisWarning[] = [];
  const level = signalLevel(samples);
  if (level.peakDbfs < SILENCE_DBFS) {
    throw new SignalProblemError(
      `The signal is silent: its peak is ${level.peakDbfs === ZERO_DB ? 'digital zero' : level.peakDbfs.toFixed(1) + ' dBFS'}, below ${SILENCE_DBFS} dBFS.`,
      'silent',
    );
  }
  if (level.peakToNoiseDb < 20) {
    warnings.push({
      code: 'lowPeakToNoise',
      message: `The peak is only ${level.peakToNoiseDb.toFixed(1)} dB above the noise; the arrival and decay are unreliable.`,
    });
  }
  if (level.peakDbfs > -0.1) {
    warnings.push({
      code: 'possibleClipping',
      message: 'The peak reaches full scale; the recording may be clipped.',
    });
  }
  const arrival = detectArrival(samples, sampleRateHz, level);

  const broadband = decayTimes(samples, sampleRateHz, arrival.arrivalSample);
  if (broadband.insufficientRange.length > 0) {
    warnings.push({
      code: 'decayRangeInsufficient',
      message: `Impulse-to-noise ratio ${broadband.impulseToNoiseDb.toFixed(1)} dB is too small for ${broadband.insufficientRange.join(', ')} (EDT needs 20 dB, T20 35 dB, T30 45 dB).`,
    });
  }
  // Bands decay into the noise near where the broadband decay does; twice that span (at least a second
  // more) keeps enough noise tail for each band's own noise estimate and bounds the work on long files.
  const crossing = Math.round(broadband.truncationS * sampleRateHz);
  const bandEnd = Math.min(
    samples.length,
    arrival.arrivalSample + Math.max(2 * crossing, crossing + sampleRateHz),
  );
  const bands = octaveBandDecays(samples.subarray(0, bandEnd), sampleRateHz, arrival.arrivalSample, warnings);

  // The response is taken up to where the decay meets the noise, so the noise tail does not fill it in.
  const end = Math.min(samples.length, arrival.arrivalSample + crossing, MAX_RESPONSE_SAMPLES);
  const spectrum = realSpectrum(fadeOut(samples, end, sampleRateHz), sampleRateHz);
  const grid = logFrequencyGrid(20, Math.min(20000, sampleRateHz / 2), GRID_POINTS_PER_OCTAVE, 'iec');
  const frequencyResponse = {
    ...smoothedResponse(spectrum, arrival.arrivalSample, smoothingOctaves, grid),
    smoothingOctaves,
  };

  const { peakSample: _peak, ...levels } = level;
  const analysis: ImpulseResponseAnalysis = {
    sampleRateHz,
    durationS: samples.length / sampleRateHz,
    arrival,
    level: levels,
    frequencyResponse,
    decay: {
      edtS: broadband.edtS,
      t20S: broadband.t20S,
      t30S: broadband.t30S,
      impulseToNoiseDb: broadband.impulseToNoiseDb,
      truncationMs: broadband.truncationS * 1000,
      bands,
    },
    warnings,
  };
  const plots = options.decayPlots;
  if (plots?.waterfall) {
    analysis.waterfall = cumulativeSpectralDecay(
      samples,
      sampleRateHz,
      arrival.arrivalSample,
      plots.waterfall,
    );
  }
  if (plots?.spectrogram) {
    analysis.spectrogram = spectrogram(samples, sampleRateHz, arrival.arrivalSample, plots.spectrogram);
  }
  if (options.room) {
    analysis.room = roomSummary(
      options.room,
      options.speedOfSoundMps ?? DEFAULT_SPEED_OF_SOUND_MPS,
      broadband,
      warnings,
    );
  }
  return analysis;
}

function octaveBandDecays(
  samples: Float64Array,
  sampleRateHz: number,
  startSample: number,
  warnings: AnalysisWarning[],
): BandDecay[] {
  const bands: BandDecay[] = [];
  const shortBands: string[] = [];
  for (const index of OCTAVE_BAND_INDICES) {
    const centreHz = bandCentreHz(index, 1);
    const { lowerHz, upperHz } = bandEdgesHz(centreHz, 1);
    if (upperHz >= 0.45 * sampleRateHz) continue;
    const filtered = sosfilt(designBandPass(centreHz, 1, sampleRateHz), samples);
    const { edtS, t20S, t30S } = decayTimes(filtered, sampleRateHz, startSample);
    const nominalHz = nominalOctaveCentreHz(index);
    bands.push({ centreHz, nominalHz, edtS, t20S, t30S });
    // A forward band filter's own decay biases times shorter than about 16/B (Jacobsen, 1987 [memory]).
    const shortest = Math.min(...[edtS, t20S, t30S].filter((t): t is number => t !== null));
    if (shortest < 16 / (upperHz - lowerHz)) shortBands.push(`${nominalHz} Hz`);
  }
  if (shortBands.length > 0) {
    warnings.push({
      code: 'decayNearFilterLimit',
      message: `Decay times in the ${shortBands.join(', ')} band(s) are close to the band filter's own decay and may read long.`,
    });
  }
  return bands;
}

/** The signal up to `end` with a 5 ms half-Hann fade at the end, so truncation adds no spectral ripple. */
function fadeOut(samples: Float64Array, end: number, sampleRateHz: number): Float64Array {
  const out = samples.slice(0, Math.max(2, end));
  const fade = Math.min(out.length, Math.round(0.005 * sampleRateHz));
  for (let i = 0; i < fade; i++) {
    out[out.length - fade + i] *= 0.5 * (1 + Math.cos((Math.PI * (i + 1)) / (fade + 1)));
  }
  return out;
}

function roomSummary(
  room: RoomDimensions,
  speedOfSoundMps: number,
  broadband: DecayTimes,
  warnings: AnalysisWarning[],
): NonNullable<ImpulseResponseAnalysis['room']> {
  const volumeM3 = roomVolumeM3(room);
  const t60 = broadband.t30S ?? broadband.t20S ?? broadband.edtS;
  // 2000·sqrt(T/V) is defined for decay times 0.01..20 s; outside (a response with no room in it, or a
  // reading gone wrong) there is no Schroeder frequency to give, which says more than a 422 would.
  const usable = t60 !== null && t60 >= 0.01 && t60 <= 20;
  const schroeder = usable ? schroederFrequencyHz(t60, volumeM3) : null;
  if (t60 !== null && !usable) {
    warnings.push({
      code: 'noSchroederFrequency',
      message: `The measured decay time (${t60.toFixed(3)} s) lies outside 0.01–20 s, where the Schroeder frequency 2000·sqrt(T/V) applies; modes are listed up to ${DEFAULT_MODES_UP_TO_HZ} Hz instead.`,
    });
  }
  const modesUpToHz = schroeder ?? DEFAULT_MODES_UP_TO_HZ;
  const { modes, truncated, found } = roomModes(room, speedOfSoundMps, modesUpToHz, MAX_LISTED_MODES);
  const lowestModeHz = speedOfSoundMps / (2 * Math.max(room.widthM, room.lengthM, room.heightM));
  const cutAtHz = truncated ? modes[modes.length - 1].frequencyHz : null;
  if (cutAtHz !== null) {
    warnings.push({
      code: 'modesTruncated',
      message: `${found} modes lie below ${modesUpToHz.toFixed(1)} Hz; only the lowest ${modes.length} are listed (up to ${cutAtHz.toFixed(1)} Hz), as more would say nothing a response plot does not.`,
    });
  }
  if (found === 0) {
    warnings.push({
      code: 'noModesBelowLimit',
      message: `The room's lowest mode (${lowestModeHz.toFixed(2)} Hz) lies above ${schroeder === null ? 'the default limit' : 'its Schroeder frequency'} (${modesUpToHz.toFixed(2)} Hz): the sound field is statistical over the whole measured band, so no modes are listed.`,
    });
  }
  return {
    volumeM3,
    speedOfSoundMps,
    schroederFrequencyHz: schroeder,
    modesUpToHz,
    modes,
    modesLimit: {
      reason: schroeder === null ? 'noSchroederFrequency' : 'schroederFrequency',
      found,
      listed: modes.length,
      cutAtHz,
      lowestModeHz,
    },
  };
}
