import type { components } from '../../../../../shared/contract/api-types';
import { LIMITS } from '../../../../../shared/limits';
import { formatQuantity } from '../../format/format';
import { formatFrequency, frequencyTickLabel } from '../chart/frequency-ticks';

/**
 * Decay over frequency as the API answers it (`DecayPlot` in the contract): `levelDb[slice][bin]` in dB re
 * the plot's top, at `timesMs` after the arrival and log-spaced `frequenciesHz`.
 */
export type DecayPlotData = components['schemas']['DecayPlot'];

export type Rgb = readonly [number, number, number];

/*
 * The level scale ("dusk to straw", Isochron's own): a ramp through OKLab (B. Ottosson, "A perceptual
 * colour space for image processing", 2020), whose L is built to track perceived lightness. Lightness
 * rises linearly from 0.27 to 0.95 with level, so louder is always lighter — the order reads in greyscale,
 * to every kind of colour vision, and on light and dark pages alike (the plot carries its own frame and
 * scale bar, so it never depends on the page behind it). The hue turns from violet (290°) through blue
 * and teal to straw (100°) so neighbouring steps are also told apart by hue; chroma peaks mid-scale and
 * is pulled in wherever a colour would fall outside sRGB.
 */
const L_LOW = 0.27;
const L_HIGH = 0.95;
const HUE_LOW_DEG = 290;
const HUE_HIGH_DEG = 100;

/** The scale's colour at t (0 = bottom of the range, 1 = top), 8-bit sRGB. */
export function scaleColour(t: number): Rgb {
  const x = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  const lightness = L_LOW + (L_HIGH - L_LOW) * x;
  const hue = ((HUE_LOW_DEG + (HUE_HIGH_DEG - HUE_LOW_DEG) * x) * Math.PI) / 180;
  let chroma = 0.06 + 0.1 * Math.sin(Math.PI * Math.min(1, x * 1.15));
  // Pull chroma in until the colour is inside sRGB (lightness and hue stay as they are).
  for (let i = 0; i < 40; i++) {
    const rgb = oklabToLinearSrgb(lightness, chroma * Math.cos(hue), chroma * Math.sin(hue));
    if (rgb.every((v) => v >= -1e-4 && v <= 1 + 1e-4)) return rgb.map(encodeSrgb) as unknown as Rgb;
    chroma *= 0.9;
  }
  const grey = oklabToLinearSrgb(lightness, 0, 0);
  return grey.map(encodeSrgb) as unknown as Rgb;
}

/** The colour of a level: `rangeDb` below the top is the bottom of the scale, lower levels stay there. */
export function levelColour(levelDb: number, rangeDb: number): Rgb {
  return scaleColour(1 + levelDb / rangeDb);
}

export const cssColour = ([r, g, b]: Rgb): string => `rgb(${r}, ${g}, ${b})`;

/** OKLab to linear sRGB (Ottosson 2020, the published matrices). */
function oklabToLinearSrgb(lightness: number, a: number, b: number): number[] {
  const l = (lightness + 0.3963377774 * a + 0.2158037573 * b) ** 3;
  const m = (lightness - 0.1055613458 * a - 0.0638541728 * b) ** 3;
  const s = (lightness - 0.0894841775 * a - 1.291485548 * b) ** 3;
  return [
    4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s,
    -1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s,
    -0.0041960863 * l - 0.7034186147 * m + 1.707614701 * s,
  ];
}

/** Linear to 8-bit sRGB (IEC 61966-2-1 transfer curve). */
function encodeSrgb(v: number): number {
  const c = Math.min(1, Math.max(0, v));
  const e = c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055;
  return Math.round(e * 255);
}

/** WCAG 2.x relative luminance of an 8-bit sRGB colour (used to check that the scale rises). */
export function relativeLuminance([r, g, b]: Rgb): number {
  const lin = (v: number) => {
    const c = v / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
}

/**
 * The heat map as an uncompressed 24-bit BMP data URL, one pixel per cell: `bins` wide, `slices` tall,
 * the first slice on the top row. The frequencies are log-spaced, so equal pixels are equal parts of the
 * log axis and the image can be stretched over the plot as it is. (A BMP needs no canvas, so the same code
 * runs in the unit tests.)
 */
export function heatMapImage(plot: DecayPlotData, rangeDb: number): string {
  const width = plot.frequenciesHz.length;
  const height = plot.timesMs.length;
  const rowBytes = Math.ceil((width * 3) / 4) * 4;
  const size = 54 + rowBytes * height;
  const bytes = new Uint8Array(size);
  const view = new DataView(bytes.buffer);
  bytes[0] = 0x42; // 'B'
  bytes[1] = 0x4d; // 'M'
  view.setUint32(2, size, true);
  view.setUint32(10, 54, true); // pixel data offset
  view.setUint32(14, 40, true); // BITMAPINFOHEADER
  view.setInt32(18, width, true);
  view.setInt32(22, height, true); // positive: rows stored bottom-up
  view.setUint16(26, 1, true);
  view.setUint16(28, 24, true);
  view.setUint32(34, rowBytes * height, true);
  view.setInt32(38, 2835, true); // 72 dpi
  view.setInt32(42, 2835, true);
  for (let slice = 0; slice < height; slice++) {
    const row = 54 + (height - 1 - slice) * rowBytes;
    for (let bin = 0; bin < width; bin++) {
      const [r, g, b] = levelColour(plot.levelDb[slice]?.[bin] ?? -Infinity, rangeDb);
      bytes[row + bin * 3] = b;
      bytes[row + bin * 3 + 1] = g;
      bytes[row + bin * 3 + 2] = r;
    }
  }
  let binary = '';
  for (let i = 0; i < bytes.length; i += 0x8000)
    binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return `data:image/bmp;base64,${btoa(binary)}`;
}

export interface Tick {
  value: number;
  label: string;
  /** Where the tick sits along its axis, 0–1. */
  at: number;
}

/** Labelled ticks of a log frequency axis (1-2-5 per decade), with both ends when fewer than two fall inside. */
export function frequencyTicks(fromHz: number, toHz: number): Tick[] {
  const span = Math.log(toHz / fromHz);
  const at = (hz: number) => Math.log(hz / fromHz) / span;
  const ticks: Tick[] = [];
  for (let decade = Math.floor(Math.log10(fromHz)); 10 ** decade <= toHz; decade++) {
    for (const m of [1, 2, 5]) {
      const hz = m * 10 ** decade;
      if (hz >= fromHz * 0.999 && hz <= toHz * 1.001)
        ticks.push({ value: hz, label: frequencyTickLabel(hz), at: at(hz) });
    }
  }
  if (ticks.length >= 2) return ticks;
  return [fromHz, toHz].map((hz) => ({
    value: hz,
    label: formatFrequency(Number(hz.toPrecision(3))),
    at: at(hz),
  }));
}

/** Ticks from 0 to `toMs` at a 1-2-5 step giving at most `most` intervals. */
export function timeTicks(fromMs: number, toMs: number, most = 6): Tick[] {
  const span = toMs - fromMs;
  if (!(span > 0)) return [{ value: fromMs, label: String(fromMs), at: 0 }];
  const step = niceStep(span / most);
  const ticks: Tick[] = [];
  for (let v = Math.ceil(fromMs / step - 1e-9) * step; v <= toMs + 1e-9; v += step) {
    const value = Number(v.toPrecision(6));
    ticks.push({ value, label: String(value), at: (value - fromMs) / span });
  }
  return ticks;
}

/** dB ticks of the scale bar from 0 down to −rangeDb: 10 dB apart, or 20 dB for ranges over 60 dB. */
export function levelTicks(rangeDb: number): Tick[] {
  const step = rangeDb > 60 ? 20 : 10;
  const ticks: Tick[] = [];
  for (let v = 0; v >= -rangeDb - 1e-9; v -= step)
    ticks.push({ value: v, label: v === 0 ? '0' : `\u2212${-v}`, at: Math.abs(v) / rangeDb });
  return ticks;
}

function niceStep(raw: number): number {
  const power = 10 ** Math.floor(Math.log10(raw));
  const m = raw / power;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * power;
}

/** One line of the stacked-slices view, in the drawing's coordinates (y down). */
export interface SliceLine {
  timeMs: number;
  /** The level line, as SVG points. */
  line: string;
  /** The same line closed down to the slice's base, to hide the slices behind it. */
  area: string;
}

/**
 * Stacked slices: each slice's level over frequency, later slices drawn further right and up by up to
 * `depthX`/`depthY` px, so the first slice stands in front. Levels below `rangeDb` under the top sit on
 * the base. Returned back to front, the order they must be drawn in.
 */
export function sliceLines(
  plot: DecayPlotData,
  rangeDb: number,
  box: { width: number; height: number; depthX: number; depthY: number },
): SliceLine[] {
  const n = plot.timesMs.length;
  const bins = plot.frequenciesHz.length;
  const faceWidth = box.width - box.depthX;
  const faceHeight = box.height - box.depthY;
  const lines: SliceLine[] = [];
  for (let k = n - 1; k >= 0; k--) {
    const depth = n > 1 ? k / (n - 1) : 0;
    const dx = depth * box.depthX;
    const base = box.height - depth * box.depthY;
    const points: string[] = [];
    for (let b = 0; b < bins; b++) {
      const x = dx + (bins > 1 ? (b / (bins - 1)) * faceWidth : 0);
      const level = Math.max(-rangeDb, Math.min(0, plot.levelDb[k]?.[b] ?? -rangeDb));
      const y = base - ((level + rangeDb) / rangeDb) * faceHeight;
      points.push(`${round1(x)},${round1(y)}`);
    }
    const area = [`${round1(dx)},${round1(base)}`, ...points, `${round1(dx + faceWidth)},${round1(base)}`];
    lines.push({ timeMs: plot.timesMs[k], line: points.join(' '), area: area.join(' ') });
  }
  return lines;
}

const round1 = (v: number) => Math.round(v * 10) / 10;

/** The reading of one cell, for the keyboard and pointer read-out. */
export function cellText(plot: DecayPlotData, slice: number, bin: number): string {
  const hz = plot.frequenciesHz[bin];
  const level = plot.levelDb[slice]?.[bin];
  return `${formatHz(hz)} at ${formatQuantity(plot.timesMs[slice], 'ms', 1)}: ${formatQuantity(level, 'dB', 1)}`;
}

const formatHz = (hz: number) =>
  hz >= 1000 ? formatQuantity(hz / 1000, 'kHz', 2) : formatQuantity(hz, 'Hz', hz < 100 ? 1 : 0);

/**
 * A text summary of a plot for people who do not see it: what it covers, its window, and where the
 * response rings longest and dies fastest, among the bins that start within 30 dB of the top.
 *
 * Longest ringing is the bin with the highest level left in the last slice, not the one that fell least.
 * A ringing room mode leaks into its neighbouring bins through the window's skirt (and each bin averages
 * a fraction of an octave around it): a neighbour off the resonance starts lower in the first slice but
 * late in the decay shows mostly the mode's own energy, a few dB below the mode's bin. Its fall is then
 * smaller than the mode's, so "fell least" names the skirt, a bin beside the mode (59.4 Hz for a mode at
 * 63 Hz). What still sounds at the end is where the level is highest then, which is the mode itself.
 * Fastest decay stays "fell most": there the level left is at the floor and says nothing.
 */
export function decaySummary(plot: DecayPlotData, what: string): string {
  const n = plot.timesMs.length;
  const first = plot.levelDb[0] ?? [];
  const last = plot.levelDb[n - 1] ?? [];
  const fHz = plot.frequenciesHz;
  const parts = [
    `${what}: ${n} slices from ${formatQuantity(plot.timesMs[0], 'ms', 0)} to ${formatQuantity(plot.timesMs[n - 1], 'ms', 0)} after the arrival, ` +
      `${fHz.length} frequencies from ${formatHz(fHz[0])} to ${formatHz(fHz[fHz.length - 1])}; ` +
      `${plot.window.name} window of ${formatQuantity(plot.window.lengthMs, 'ms', 1)}, finest detail ${formatQuantity(plot.resolutionHz, 'Hz', 1)}.`,
  ];
  let slow = -1;
  let fast = -1;
  for (let b = 0; b < fHz.length; b++) {
    if (!(first[b] > -30)) continue;
    const drop = first[b] - last[b];
    // Equal levels left (both at the floor, say): the one that fell less.
    if (slow < 0 || last[b] > last[slow] || (last[b] === last[slow] && drop < first[slow] - last[slow]))
      slow = b;
    if (fast < 0 || drop > first[fast] - last[fast]) fast = b;
  }
  if (slow >= 0 && n > 1) {
    const at = formatQuantity(plot.timesMs[n - 1], 'ms', 0);
    parts.push(
      `Longest ringing near ${formatHz(fHz[slow])}: it falls ${formatQuantity(first[slow] - last[slow], 'dB', 1)} by ${at}.`,
    );
    if (fast !== slow)
      parts.push(
        `Fastest decay near ${formatHz(fHz[fast])}: ${formatQuantity(first[fast] - last[fast], 'dB', 1)} by ${at}.`,
      );
  }
  return parts.join(' ');
}

/** What to ask the API for: which plots, and their slices and bins (the contract's limits). */
export interface DecayRequest {
  waterfall: boolean;
  spectrogram: boolean;
  slices: number;
  bins: number;
}

export const DECAY_LIMITS = {
  slices: LIMITS.decaySlices,
  bins: LIMITS.decayBins,
};

export const DEFAULT_DECAY_REQUEST: DecayRequest = {
  waterfall: false,
  spectrogram: false,
  slices: LIMITS.decaySlices.default,
  bins: LIMITS.decayBins.default,
};

/** What is wrong with a request, per field, before anything is sent. */
export function decayRequestProblems(request: DecayRequest): { slices?: string; bins?: string } {
  if (!request.waterfall && !request.spectrogram) return {};
  const problems: { slices?: string; bins?: string } = {};
  const { slices, bins } = DECAY_LIMITS;
  if (!Number.isInteger(request.slices) || request.slices < slices.minimum || request.slices > slices.maximum)
    problems.slices = `Give ${slices.minimum} to ${slices.maximum} slices.`;
  if (!Number.isInteger(request.bins) || request.bins < bins.minimum || request.bins > bins.maximum)
    problems.bins = `Give ${bins.minimum} to ${bins.maximum} frequencies.`;
  return problems;
}

/**
 * The multipart fields of a request (the same names on both analysis routes and on measurement uploads);
 * none when no plot is asked for. The other fields keep the API's defaults (20 Hz–20 kHz, 300 ms).
 */
export function decayFormFields(request: DecayRequest): Array<[string, string]> {
  if (!request.waterfall && !request.spectrogram) return [];
  const fields: Array<[string, string]> = [];
  if (request.waterfall) fields.push(['waterfall', 'true']);
  if (request.spectrogram) fields.push(['spectrogram', 'true']);
  fields.push(['decaySlices', String(request.slices)], ['decayBins', String(request.bins)]);
  return fields;
}
