import { nextPowerOfTwo, rfft } from '../dsp/fft';
import { getWindow, halfHannFall } from '../dsp/windows';
import { CalculationInputError } from '../errors';
import { fractionalOctaveMean } from './smoothing';

/** What the caller asks for: slices over a time span after the arrival, bins on a log-frequency axis. */
export interface DecayPlotRequest {
  /** Time slices, at least 2. */
  slices: number;
  /** Frequency points, log-spaced from fromHz to toHz. */
  bins: number;
  fromHz: number;
  toHz: number;
  /** Time from the arrival to the last slice, ms. */
  spanMs: number;
  /** Analysis window, ms: the waterfall's fixed end after the arrival; the spectrogram's window length. */
  windowMs: number;
}

export interface DecayPlot {
  /** How each slice was windowed, in words and figures. */
  window: { name: string; lengthMs: number; taperMs: number };
  /** Start (waterfall) or centre (spectrogram) of each slice, ms after the arrival. */
  timesMs: number[];
  frequenciesHz: number[];
  /** levelDb[slice][bin], dB re the largest value of the whole plot (so 0 dB is its top). */
  levelDb: number[][];
  /** Width of the power average behind each bin, octaves. */
  binWidthOctaves: number;
  /** The finest frequency detail the window can show, 1/length, Hz. */
  resolutionHz: number;
}

/** dB floor of the plots: 150 dB under their top (deeper is noise in any real measurement, common practice). */
const PLOT_FLOOR_DB = -150;

/**
 * Cumulative spectral decay (waterfall): the spectrum of what is left of the response from each slice's
 * start to a fixed end (`windowMs` after the arrival), the start moving later by `spanMs/(slices−1)` per
 * slice (Berman & Fincham, "The application of digital techniques to the measurement of loudspeakers",
 * JAES 25(6), 1977). Each slice starts abruptly and ends with a half-Hann taper over the last fifth of the
 * window, so the fixed end adds no ripple.
 *
 * @param arrivalSample where the response starts (its detected arrival).
 */
export function cumulativeSpectralDecay(
  h: Float64Array,
  sampleRateHz: number,
  arrivalSample: number,
  request: DecayPlotRequest,
): DecayPlot {
  checkRequest(request, sampleRateHz);
  if (request.spanMs >= request.windowMs) {
    throw new CalculationInputError(
      `the waterfall's span (${request.spanMs} ms) must end before its window does (${request.windowMs} ms)`,
      '/decaySpanMs',
    );
  }
  const fs = sampleRateHz;
  const end = arrivalSample + Math.round((request.windowMs / 1000) * fs);
  const taper = Math.max(1, Math.round((0.2 * request.windowMs * fs) / 1000));
  const fall = halfHannFall(taper);
  const size = nextPowerOfTwo(end - arrivalSample);
  const grid = plotGrid(request, fs, size);
  const step = ((request.spanMs / 1000) * fs) / (request.slices - 1);
  const timesMs: number[] = [];
  const power: Float64Array[] = [];
  for (let k = 0; k < request.slices; k++) {
    const start = arrivalSample + Math.round(k * step);
    const slice = new Float64Array(end - start);
    for (let i = start; i < end; i++) slice[i - start] = i >= 0 && i < h.length ? h[i] : 0;
    for (let i = 0; i < taper && i < slice.length; i++) slice[slice.length - taper + i] *= fall[i];
    power.push(binnedPower(slice, size, fs, grid));
    timesMs.push(((start - arrivalSample) / fs) * 1000);
  }
  return {
    window: {
      name: 'rectangular start, half-Hann end',
      lengthMs: request.windowMs,
      taperMs: (taper / fs) * 1000,
    },
    timesMs,
    frequenciesHz: grid.hz,
    levelDb: toDbRe(power),
    binWidthOctaves: grid.widthOctaves,
    resolutionHz: 1000 / request.windowMs,
  };
}

/**
 * Spectrogram: short-time spectra through a Hann window of `windowMs` centred `spanMs/(slices−1)` apart,
 * from the arrival on (scipy.signal.spectrogram with a Hann window, read on a log-frequency axis).
 */
export function spectrogram(
  h: Float64Array,
  sampleRateHz: number,
  arrivalSample: number,
  request: DecayPlotRequest,
): DecayPlot {
  checkRequest(request, sampleRateHz);
  const fs = sampleRateHz;
  const length = Math.max(4, Math.round((request.windowMs / 1000) * fs));
  const window = getWindow('hann', length);
  const size = nextPowerOfTwo(length);
  const grid = plotGrid(request, fs, size);
  const step = ((request.spanMs / 1000) * fs) / (request.slices - 1);
  const timesMs: number[] = [];
  const power: Float64Array[] = [];
  const frame = new Float64Array(length);
  for (let k = 0; k < request.slices; k++) {
    const centre = arrivalSample + Math.round(k * step);
    const start = centre - Math.floor(length / 2);
    for (let i = 0; i < length; i++) {
      const j = start + i;
      frame[i] = (j >= 0 && j < h.length ? h[j] : 0) * window[i];
    }
    power.push(binnedPower(frame, size, fs, grid));
    timesMs.push(((centre - arrivalSample) / fs) * 1000);
  }
  return {
    window: { name: 'hann', lengthMs: (length / fs) * 1000, taperMs: (length / fs) * 500 },
    timesMs,
    frequenciesHz: grid.hz,
    levelDb: toDbRe(power),
    binWidthOctaves: grid.widthOctaves,
    resolutionHz: fs / length,
  };
}

function checkRequest(request: DecayPlotRequest, fs: number): void {
  if (request.toHz <= request.fromHz) {
    throw new CalculationInputError(
      `decayToHz must lie above decayFromHz (${request.fromHz} Hz); received ${request.toHz} Hz`,
      '/decayToHz',
    );
  }
  if (request.toHz > fs / 2) {
    throw new CalculationInputError(
      `decayToHz must be at most Nyquist (${fs / 2} Hz); received ${request.toHz} Hz`,
      '/decayToHz',
    );
  }
}

interface PlotGrid {
  hz: number[];
  widthOctaves: number;
  binHz: Float64Array;
}

/** `bins` log-spaced frequencies; each reads the power averaged over its own share of the axis. */
function plotGrid(request: DecayPlotRequest, fs: number, size: number): PlotGrid {
  const octaves = Math.log2(request.toHz / request.fromHz);
  const widthOctaves = Math.min(1, Math.max(1 / 48, octaves / (request.bins - 1)));
  const hz = Array.from({ length: request.bins }, (_, i) =>
    round4(request.fromHz * Math.pow(2, (octaves * i) / (request.bins - 1))),
  );
  const binHz = new Float64Array(size / 2 + 1);
  for (let k = 0; k < binHz.length; k++) binHz[k] = (k * fs) / size;
  return { hz, widthOctaves, binHz };
}

function binnedPower(x: Float64Array, size: number, fs: number, grid: PlotGrid): Float64Array {
  const { re, im } = rfft(x, size);
  const p = new Float64Array(re.length);
  for (let k = 0; k < re.length; k++) p[k] = re[k] * re[k] + im[k] * im[k];
  return fractionalOctaveMean(grid.binHz, p, grid.widthOctaves, grid.hz);
}

function toDbRe(power: Float64Array[]): number[][] {
  let top = 0;
  for (const row of power) for (const v of row) top = Math.max(top, v);
  return power.map((row) =>
    Array.from(row, (v) =>
      top > 0 && v > 0 ? Math.max(PLOT_FLOOR_DB, round2(10 * Math.log10(v / top))) : PLOT_FLOOR_DB,
    ),
  );
}

const round2 = (v: number) => Math.round(v * 100) / 100;
const round4 = (v: number) => Math.round(v * 10000) / 10000;

/** Decay plots an analysis was asked for. */
export interface DecayPlotOptions {
  waterfall?: DecayPlotRequest;
  spectrogram?: DecayPlotRequest;
}

/** The flat request fields of an analysis upload, as the contract names them. */
export interface DecayPlotFields {
  waterfall?: boolean;
  spectrogram?: boolean;
  decaySlices: number;
  decayBins: number;
  decayFromHz: number;
  decayToHz: number;
  decaySpanMs: number;
  waterfallWindowMs: number;
  spectrogramWindowMs: number;
}

/** The plots asked for by an upload's fields, or undefined for none. */
export function decayPlotsOf(fields: DecayPlotFields): DecayPlotOptions | undefined {
  if (!fields.waterfall && !fields.spectrogram) return undefined;
  const base = {
    slices: fields.decaySlices,
    bins: fields.decayBins,
    fromHz: fields.decayFromHz,
    toHz: fields.decayToHz,
    spanMs: fields.decaySpanMs,
  };
  return {
    ...(fields.waterfall && { waterfall: { ...base, windowMs: fields.waterfallWindowMs } }),
    ...(fields.spectrogram && { spectrogram: { ...base, windowMs: fields.spectrogramWindowMs } }),
  };
}
