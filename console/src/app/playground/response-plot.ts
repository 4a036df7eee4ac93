import type { ChartSpec } from '../ui/chart/chart-spec';
import { formatFrequency } from '../ui/chart/frequency-ticks';
import { logFrequencyGrid } from '../../../../shared/dsp/grid';
import { cascadeResponse, parallelResponse, type SosResponse } from '../../../../shared/dsp/response';
import { isSos, type Sos } from '../../../../shared/dsp/sos';

/** One curve to draw against a logarithmic frequency axis. */
export interface PlotCurve {
  label: string;
  frequenciesHz: number[];
  magnitudeDb: number[];
  phaseDeg?: number[];
  /** `reported` curves come from the API's response grid; `computed` ones from returned sections. */
  source: 'reported' | 'computed';
  /** The complex sum of a crossover's two outputs. */
  isSum: boolean;
}

const MAX_CURVES = 12;
/** A reported grid this dense is drawn as is; a sparser one (a few spot frequencies) is redrawn from the sections. */
const DENSE_GRID_POINTS = 48;
const GENERIC_SEGMENTS = new Set(['response', 'data', 'result', 'sections', 'cascade', 'filters']);
const NAME_FIELDS = ['label', 'channel', 'id', 'name'];

type Path = string[];

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function numbers(value: unknown): value is number[] {
  return Array.isArray(value) && value.length > 0 && value.every((item) => typeof item === 'number');
}

function labelOf(path: Path): string {
  const meaningful = path.filter((segment) => !GENERIC_SEGMENTS.has(segment));
  return meaningful.length ? meaningful.join(' · ') : 'response';
}

function elementName(element: unknown, index: number): string {
  if (isRecord(element)) {
    for (const field of NAME_FIELDS) {
      const value = element[field];
      if (typeof value === 'string' && value.trim()) return value;
    }
  }
  return `#${index + 1}`;
}

function reportedCurves(
  node: unknown,
  path: Path,
  frequencies: number[] | undefined,
  out: PlotCurve[],
): void {
  if (out.length >= MAX_CURVES) return;
  if (Array.isArray(node)) {
    node.forEach((element, index) =>
      reportedCurves(element, [...path, elementName(element, index)], frequencies, out),
    );
    return;
  }
  if (!isRecord(node)) return;
  const own = numbers(node['frequenciesHz']) ? node['frequenciesHz'] : frequencies;
  const magnitude = node['magnitudeDb'];
  if (own && numbers(magnitude) && magnitude.length === own.length) {
    const phase = node['phaseDeg'];
    const last = path[path.length - 1] ?? '';
    out.push({
      label: labelOf(path),
      frequenciesHz: own,
      magnitudeDb: magnitude,
      phaseDeg: numbers(phase) && phase.length === own.length ? phase : undefined,
      source: 'reported',
      isSum: /sum/i.test(last),
    });
  }
  for (const [key, value] of Object.entries(node)) {
    if (key === 'frequenciesHz' || key === 'magnitudeDb' || key === 'phaseDeg' || key === 'groupDelayMs')
      continue;
    reportedCurves(value, [...path, key], own, out);
  }
}

function sectionsOf(node: unknown): Sos[] | null {
  if (Array.isArray(node) && node.length > 0 && node.every(isSos)) return node;
  if (
    isRecord(node) &&
    Array.isArray(node['sections']) &&
    node['sections'].length > 0 &&
    node['sections'].every(isSos)
  ) {
    return node['sections'] as Sos[];
  }
  return null;
}

function computedCurve(
  label: string,
  frequencies: number[],
  response: SosResponse,
  isSum: boolean,
): PlotCurve {
  return {
    label,
    frequenciesHz: frequencies,
    magnitudeDb: response.magnitudeDb,
    phaseDeg: response.phaseDeg,
    source: 'computed',
    isSum,
  };
}

/** The complex sum of a low-pass and a high-pass output, the high-pass subtracted when inverted. */
function crossoverSum(low: Sos[], high: Sos[], inverted: boolean, grid: number[], fs: number) {
  return parallelResponse(
    [
      { sections: low, gain: 1 },
      { sections: high, gain: inverted ? -1 : 1 },
    ],
    grid,
    fs,
  );
}

function computedCurves(node: unknown, path: Path, grid: number[], fs: number, out: PlotCurve[]): void {
  if (out.length >= MAX_CURVES) return;
  const sections = sectionsOf(node);
  if (sections) {
    out.push(computedCurve(labelOf(path), grid, cascadeResponse(sections, grid, fs), false));
    return;
  }
  if (Array.isArray(node)) {
    node.forEach((element, index) =>
      computedCurves(element, [...path, elementName(element, index)], grid, fs, out),
    );
    return;
  }
  if (!isRecord(node)) return;
  for (const [key, value] of Object.entries(node)) computedCurves(value, [...path, key], grid, fs, out);
  const low = sectionsOf(node['lowPass']);
  const high = sectionsOf(node['highPass']);
  if (low && high && out.length < MAX_CURVES) {
    const sum = crossoverSum(low, high, node['highPassPolarity'] === 'inverted', grid, fs);
    out.push(computedCurve(labelOf([...path, 'sum']), grid, sum, true));
  }
}

function sampleRateOf(...sources: unknown[]): number | null {
  for (const source of sources) {
    if (isRecord(source) && typeof source['sampleRateHz'] === 'number' && source['sampleRateHz'] > 0) {
      return source['sampleRateHz'];
    }
  }
  return null;
}

/** Curves with identical values are drawn once, labelled with every name they stand for. */
function mergeIdentical(curves: PlotCurve[]): PlotCurve[] {
  const merged: Array<PlotCurve & { names: string[] }> = [];
  for (const curve of curves) {
    const twin = merged.find(
      (other) =>
        other.isSum === curve.isSum &&
        other.frequenciesHz.length === curve.frequenciesHz.length &&
        other.magnitudeDb.every((value, i) => value === curve.magnitudeDb[i]) &&
        (other.phaseDeg ?? []).every((value, i) => value === curve.phaseDeg?.[i]),
    );
    if (twin) twin.names.push(curve.label);
    else merged.push({ ...curve, names: [curve.label] });
  }
  return merged.map(({ names, ...curve }) => ({ ...curve, label: combineLabels(names) }));
}

/** "channels · M+030 · highPass" ×3 → "highPass: M+030, M-030, M+000". */
function combineLabels(names: string[]): string {
  if (names.length === 1) return names[0];
  const parts = names.map((name) => name.split(' · '));
  const last = parts[0][parts[0].length - 1];
  const sameEnd = parts.every((segments) => segments[segments.length - 1] === last);
  const distinct = parts.map(
    (segments) => segments[segments.length - (sameEnd ? 2 : 1)] ?? segments.join(' · '),
  );
  const shown = distinct.length > 4 ? [...distinct.slice(0, 3), `+${distinct.length - 3} more`] : distinct;
  return sameEnd ? `${last}: ${shown.join(', ')}` : shown.join(', ');
}

/**
 * Bass management: a managed channel's high-pass and the subwoofer's low-pass add acoustically at the
 * listening position; their sum (polarity applied, level and delay not) shows how the crossover joins.
 */
function bassManagementSum(body: unknown, grid: number[], fs: number): PlotCurve | null {
  if (!isRecord(body) || !Array.isArray(body['channels']) || !isRecord(body['subwoofer'])) return null;
  const low = sectionsOf(body['subwoofer']['lowPass']);
  const managed = body['channels'].find((channel) => isRecord(channel) && sectionsOf(channel['highPass']));
  if (!low || !isRecord(managed) || !isRecord(managed['highPass'])) return null;
  const high = sectionsOf(managed['highPass']) as Sos[];
  const sum = crossoverSum(low, high, managed['highPass']['polarity'] === 'inverted', grid, fs);
  return computedCurve('sum: managed channel + subwoofer', grid, sum, true);
}

/**
 * The curves worth plotting in an API answer. A dense reported grid (biquad cascades, crossover outputs
 * and their sum) is drawn as the API computed it. When the answer has only a few spot frequencies, or
 * none, the returned section cascades are evaluated in the browser at the answer's sample rate, with
 * the sum of each crossover and of a bass-managed channel with the subwoofer. Identical curves (the
 * same high-pass on eleven channels) are drawn once.
 */
export function curvesFromResult(body: unknown, requestBody?: unknown): PlotCurve[] {
  const reported: PlotCurve[] = [];
  reportedCurves(body, [], undefined, reported);
  if (
    reported.length &&
    Math.min(...reported.map((curve) => curve.frequenciesHz.length)) >= DENSE_GRID_POINTS
  ) {
    return mergeIdentical(reported);
  }
  const fs = sampleRateOf(body, requestBody, isRecord(requestBody) ? requestBody['crossover'] : undefined);
  if (!fs) return mergeIdentical(reported);
  // Whole 1/24-octave steps from 10 Hz, so the octaves of 10 Hz (20, 40, 80 Hz …) are points of the plot.
  const octaves = Math.floor(Math.log2(Math.min(20000, fs * 0.49) / 10) * 24) / 24;
  const grid = logFrequencyGrid(10, 10 * 2 ** octaves, 24);
  const computed: PlotCurve[] = [];
  computedCurves(body, [], grid, fs, computed);
  const sum = bassManagementSum(body, grid, fs);
  if (sum) computed.push(sum);
  return computed.length ? mergeIdentical(computed) : mergeIdentical(reported);
}

/**
 * A y range that shows the interesting part: the top of the curves and at most 60 dB below it, on
 * 10 dB steps for deep responses (crossovers) and 3 dB steps for small EQ moves, never under 12 dB.
 */
export function magnitudeRange(curves: readonly PlotCurve[]): { min: number; max: number; step: number } {
  const values = curves.flatMap((curve) => curve.magnitudeDb).filter((value) => Number.isFinite(value));
  if (!values.length) return { min: -12, max: 12, step: 3 };
  const top = Math.max(...values);
  const bottom = Math.max(Math.min(...values), top - 60);
  const step = top - bottom > 24 ? 10 : 3;
  const max = Math.ceil((top + 1) / step) * step;
  let min = Math.max(Math.floor((bottom - 1) / step) * step, max - 60);
  // Small moves get at least 12 dB of view, widened downward because EQ mostly cuts.
  while (max - min < 12) min -= step;
  return { min, max, step };
}

function points(frequencies: number[], values: number[]): Array<{ x: number; y: number | null }> {
  return frequencies.flatMap((x, i) => (x > 0 && Number.isFinite(values[i]) ? [{ x, y: values[i] }] : []));
}

/** Phase points with a gap wherever the wrapped phase jumps, so no false vertical line is drawn. */
function phasePoints(frequencies: number[], values: number[]): Array<{ x: number; y: number | null }> {
  const result: Array<{ x: number; y: number | null }> = [];
  let previous: number | null = null;
  for (const point of points(frequencies, values)) {
    if (previous !== null && point.y !== null && Math.abs(point.y - previous) > 180)
      result.push({ x: point.x, y: null });
    result.push(point);
    previous = point.y;
  }
  return result;
}

function describeCurves(curves: readonly PlotCurve[]): string {
  return curves
    .map((curve) => {
      const peak = Math.max(...curve.magnitudeDb);
      const at = curve.frequenciesHz[curve.magnitudeDb.indexOf(peak)];
      return `${curve.label}: highest ${peak.toFixed(1)} dB at ${formatFrequency(at)} Hz`;
    })
    .join('; ');
}

/** Magnitude against log frequency; sums are drawn dashed on top. */
export function magnitudeChart(curves: readonly PlotCurve[]): ChartSpec {
  const range = magnitudeRange(curves);
  return {
    kind: 'line',
    xScale: 'log',
    xTitle: 'Frequency (Hz)',
    yTitle: 'Magnitude (dB)',
    yMin: range.min,
    yMax: range.max,
    yStep: range.step,
    series: curves.map((curve, i) => ({
      label: curve.label,
      points: points(curve.frequenciesHz, curve.magnitudeDb),
      colour: curve.isSum ? 5 : (i % 6) + 1,
      dashed: curve.isSum,
    })),
    summary: `Magnitude response on a logarithmic frequency axis. ${describeCurves(curves)}.`,
  };
}

/** Phase against log frequency, wrapped to ±180°; null when no curve carries phase. */
export function phaseChart(curves: readonly PlotCurve[]): ChartSpec | null {
  const withPhase = curves.filter((curve) => curve.phaseDeg);
  if (!withPhase.length) return null;
  return {
    kind: 'line',
    xScale: 'log',
    xTitle: 'Frequency (Hz)',
    yTitle: 'Phase (degrees)',
    yMin: -180,
    yMax: 180,
    yStep: 45,
    series: withPhase.map((curve) => ({
      label: curve.label,
      points: phasePoints(curve.frequenciesHz, curve.phaseDeg ?? []),
      colour: curve.isSum ? 5 : (curves.indexOf(curve) % 6) + 1,
      dashed: curve.isSum,
    })),
    summary: `Phase response in degrees of ${withPhase.map((curve) => curve.label).join(', ')}.`,
  };
}
