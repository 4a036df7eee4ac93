import { logFrequencyGrid } from '../dsp/grid';
import { rfft } from '../dsp/fft';
import {
  analyzeImpulseResponse,
  type AnalysisWarning,
  type ImpulseResponseAnalysis,
  type ImpulseResponseAnalysisOptions,
} from '../analysis/analyze-impulse-response';
import { detectArrival, signalLevel } from '../analysis/level';
import { fractionalOctaveMean } from '../analysis/smoothing';
import { SignalProblemError } from '../analysis/signal-problem';
import { deconvolve, prepareSweep, type DeconvolutionMethod } from './deconvolve';
import { checkSweep, harmonicAdvanceS, sweepLength, type SweepSpec } from './sweep';

/** Harmonics whose responses are separated and reported: 2nd to 5th. */
export const HARMONICS = [2, 3, 4, 5] as const;
/** Distortion curves are power-averaged over a third of an octave (common practice for distortion plots). */
export const DISTORTION_SMOOTHING_OCTAVES = 1 / 3;
/** Distortion curves: 12 points per octave on the IEC base-ten series. */
const DISTORTION_POINTS_PER_OCTAVE = 12;
/** Lead kept before each harmonic's response: a tenth of the gap to the next, at most 5 ms. */
const LEAD_FRACTION = 0.1;
const MAX_LEAD_S = 0.005;
/** Kept before lag 0 of the linear response (at most half the 2nd harmonic's advance), seconds. */
const PRE_ARRIVAL_S = 0.25;

export interface HarmonicDistortion {
  harmonic: number;
  /** Where the harmonic's response was found: seconds before the linear response (T·ln N/ln(f2/f1)). */
  advanceS: number;
  /** Fundamental frequencies, hertz: f1 up to min(f2, Nyquist)/N. */
  frequenciesHz: number[];
  /** Harmonic level re the fundamental at each frequency, dB. */
  levelDb: number[];
  /** The same as a percentage, 100·10^(dB/20). */
  percent: number[];
}

export interface SweepAnalysisOptions extends ImpulseResponseAnalysisOptions {
  method?: DeconvolutionMethod;
  /** The same recording's timing-reference (loopback) channel. */
  reference?: Float64Array;
  /** The request field naming that channel, for errors (default `/referenceChannel`). */
  referenceField?: string;
}

export interface SweepAnalysis extends ImpulseResponseAnalysis {
  deconvolution: {
    method: DeconvolutionMethod;
    fftSize: number;
    /** Samples of linear impulse response analysed (from lag 0). */
    linearSamples: number;
  };
  /** 2nd to 5th harmonics, each against frequency. */
  distortion: { smoothingOctaves: number; harmonics: HarmonicDistortion[] };
  /** With a reference channel: its own arrival (the interface's latency) and the arrival measured from it. */
  timing?: {
    referenceArrivalSample: number;
    referenceArrivalMs: number;
    referencePeakSample: number;
    /** Onset of the measured response minus onset of the reference, samples and ms. */
    arrivalFromReferenceSamples: number;
    arrivalFromReferenceMs: number;
    /** Peak minus reference peak, samples and ms. */
    peakFromReferenceSamples: number;
    peakFromReferenceMs: number;
  };
}

/**
 * A recorded exponential sweep turned into its linear impulse response and harmonic responses, then
 * analysed like any impulse response (arrival, levels, response, decay, room).
 *
 * @param recording the recorded channel, full scale ±1, starting no later than the sweep was played.
 * @param sweep the sweep that was played (its sample rate is the recording's).
 * @throws SignalProblemError when the recording is shorter than the sweep or silent.
 */
export function analyzeSweepRecording(
  recording: Float64Array,
  sweep: SweepSpec,
  options: SweepAnalysisOptions = {},
): SweepAnalysis {
  checkSweep(sweep);
  const fs = sweep.sampleRateHz;
  const method = options.method ?? 'regularizedDivision';
  const prepared = prepareSweep(sweep, recording.length, method);
  const h = deconvolve(recording, prepared);
  const size = prepared.size;

  // Lags (in samples, positive = before the linear response) of each harmonic and its lead.
  const advance = [0, 0, ...HARMONICS.map((k) => harmonicAdvanceS(sweep, k) * fs)];
  const gapAfter = (k: number): number => harmonicAdvanceS(sweep, k + 1) * fs - advance[k];
  const lead = (k: number): number => Math.round(Math.min(LEAD_FRACTION * gapAfter(k), MAX_LEAD_S * fs));

  // The linear response is taken from a little before lag 0 — the band limits of the deconvolution ring
  // on both sides of every arrival, and at f1 that ringing is long — up to the 2nd harmonic's lead. Past
  // the peak, only as long as the recording went on after the sweep is a whole-band response (later lags
  // met the sweep's end cut off), so the analysis stops there (at least a quarter second after the peak).
  const n = sweepLength(sweep);
  const harmonicStart = Math.min(size - Math.round(advance[2]) - lead(2), recording.length);
  const peak = peakIndex(h, harmonicStart);
  const before = Math.round(Math.min(advance[2] / 2, PRE_ARRIVAL_S * fs));
  const linearEnd = Math.min(harmonicStart, peak + Math.max(recording.length - n, Math.round(0.25 * fs)));
  // A half-Hann taper over the first half of that lead ends the cut without spectral splatter.
  const linear = taper(circularSlice(h, -before, linearEnd), Math.floor(before / 2), 0);
  const warnings: AnalysisWarning[] = [];
  if (recording.length - n < 0.1 * fs) {
    warnings.push({
      code: 'shortTail',
      message: `The recording ends ${((recording.length - n) / fs).toFixed(3)} s after the sweep would; record at least the room's decay time after the sweep, or the late response lacks its high frequencies.`,
    });
  }

  const analysis = fromLagZero(analyzeImpulseResponse(linear, fs, options), before, fs);
  const distortion = harmonicDistortion(h, peak, sweep, advance, lead);
  const result: SweepAnalysis = {
    ...analysis,
    deconvolution: { method, fftSize: size, linearSamples: linear.length },
    distortion: { smoothingOctaves: DISTORTION_SMOOTHING_OCTAVES, harmonics: distortion },
    warnings: [...warnings, ...analysis.warnings],
  };
  if (options.reference) {
    const field = options.referenceField ?? '/referenceChannel';
    result.timing = referenceTiming(options.reference, prepared, before, linearEnd, analysis, fs, field);
  }
  return result;
}

/** Arrival and peak counted from lag 0 (the sweep leaving the output) instead of the window's start. */
function fromLagZero(analysis: ImpulseResponseAnalysis, before: number, fs: number): ImpulseResponseAnalysis {
  const arrivalSample = analysis.arrival.arrivalSample - before;
  const peakSample = analysis.arrival.peakSample - before;
  return {
    ...analysis,
    arrival: {
      ...analysis.arrival,
      arrivalSample,
      arrivalMs: (arrivalSample / fs) * 1000,
      peakSample,
      peakMs: (peakSample / fs) * 1000,
    },
  };
}

function referenceTiming(
  reference: Float64Array,
  prepared: ReturnType<typeof prepareSweep>,
  before: number,
  linearEnd: number,
  analysis: ImpulseResponseAnalysis,
  fs: number,
  field: string,
): NonNullable<SweepAnalysis['timing']> {
  const h = circularSlice(deconvolve(reference, prepared), -before, linearEnd);
  const level = signalLevel(h);
  if (level.peakDbfs < -120) {
    throw new SignalProblemError(
      'The timing-reference channel is silent; connect the loopback (the output fed straight back to an input).',
      'silent',
      field,
    );
  }
  const detected = detectArrival(h, fs, level);
  const arrival = {
    ...detected,
    arrivalSample: detected.arrivalSample - before,
    peakSample: detected.peakSample - before,
  };
  const fromReference = analysis.arrival.arrivalSample - arrival.arrivalSample;
  const peakFromReference = analysis.arrival.peakSample - arrival.peakSample;
  return {
    referenceArrivalSample: arrival.arrivalSample,
    referenceArrivalMs: (arrival.arrivalSample / fs) * 1000,
    referencePeakSample: arrival.peakSample,
    arrivalFromReferenceSamples: fromReference,
    arrivalFromReferenceMs: (fromReference / fs) * 1000,
    peakFromReferenceSamples: peakFromReference,
    peakFromReferenceMs: (peakFromReference / fs) * 1000,
  };
}

/**
 * Each harmonic's response is cut from the lags between its own advance and the next lower harmonic's,
 * counted from the linear response's peak (so the cut follows the system's latency), each window starting
 * a short lead early; its spectrum at N·f over the linear spectrum at f is that harmonic's level re the
 * fundamental (a sweep through a memoryless non-linearity puts the N-th harmonic of f1·e^(t/L) exactly
 * where the sweep itself is L·ln N later, Farina 2000). The curves stop half a smoothing window inside
 * f1 and f2/N, where the windows still lie in the swept band.
 */
function harmonicDistortion(
  h: Float64Array,
  peak: number,
  sweep: SweepSpec,
  advance: number[],
  lead: (k: number) => number,
): HarmonicDistortion[] {
  const fs = sweep.sampleRateHz;
  const top = Math.min(sweep.endHz, fs / 2);
  const margin = Math.pow(2, DISTORTION_SMOOTHING_OCTAVES / 2);
  // The linear response from a window as long as the 2nd harmonic's, so both see the same resolution.
  const linearStart = peak - lead(1);
  const linearPower = powerSpectrum(circularSlice(h, linearStart, linearStart + Math.round(advance[2])), fs);
  const out: HarmonicDistortion[] = [];
  for (const k of HARMONICS) {
    const fromHz = sweep.startHz * margin;
    const toHz = top / k / margin;
    if (toHz <= fromHz) continue;
    const start = peak - Math.round(advance[k]) - lead(k);
    const end = peak - Math.round(advance[k - 1]) - lead(k - 1);
    // Half-Hann tapers over the leads, so cutting through a neighbour's ringing adds no broadband splatter.
    const harmonicPower = powerSpectrum(taper(circularSlice(h, start, end), lead(k), lead(k - 1)), fs);
    const grid = logFrequencyGrid(fromHz, toHz, DISTORTION_POINTS_PER_OCTAVE, 'iec');
    if (grid.length === 0) continue;
    const fundamental = smooth(linearPower, grid);
    const harmonic = smooth(
      harmonicPower,
      grid.map((f) => f * k),
    );
    const levelDb = grid.map((_, i) =>
      round3(10 * Math.log10(Math.max(harmonic[i], 1e-30) / Math.max(fundamental[i], 1e-30))),
    );
    out.push({
      harmonic: k,
      advanceS: advance[k] / fs,
      frequenciesHz: grid,
      levelDb,
      percent: levelDb.map((db) => Number((100 * Math.pow(10, db / 20)).toPrecision(4))),
    });
  }
  return out;
}

function taper(x: Float64Array, fadeIn: number, fadeOut: number): Float64Array {
  const n = x.length;
  for (let i = 0; i < Math.min(fadeIn, n); i++) x[i] *= 0.5 * (1 - Math.cos((Math.PI * i) / fadeIn));
  for (let i = 0; i < Math.min(fadeOut, n); i++)
    x[n - 1 - i] *= 0.5 * (1 - Math.cos((Math.PI * i) / fadeOut));
  return x;
}

/** Samples start..end−1 of a circular sequence (indices taken modulo its length). */
function circularSlice(x: Float64Array, start: number, end: number): Float64Array {
  const n = x.length;
  const out = new Float64Array(end - start);
  for (let i = start, j = 0; i < end; i++, j++) out[j] = x[((i % n) + n) % n];
  return out;
}

interface PowerSpectrum {
  binHz: Float64Array;
  power: Float64Array;
}

function powerSpectrum(x: Float64Array, fs: number): PowerSpectrum {
  let size = 4;
  while (size < x.length) size *= 2;
  const { re, im } = rfft(x, size);
  const binHz = new Float64Array(re.length);
  const power = new Float64Array(re.length);
  for (let k = 0; k < re.length; k++) {
    binHz[k] = (k * fs) / size;
    power[k] = re[k] * re[k] + im[k] * im[k];
  }
  return { binHz, power };
}

function smooth(spectrum: PowerSpectrum, gridHz: number[]): Float64Array {
  return fractionalOctaveMean(spectrum.binHz, spectrum.power, DISTORTION_SMOOTHING_OCTAVES, gridHz);
}

function peakIndex(x: Float64Array, end: number): number {
  let peak = 0;
  let at = 0;
  for (let i = 0; i < end; i++) {
    const v = Math.abs(x[i]);
    if (v > peak) {
      peak = v;
      at = i;
    }
  }
  return at;
}

const round3 = (v: number): number => Math.round(v * 1000) / 1000;
