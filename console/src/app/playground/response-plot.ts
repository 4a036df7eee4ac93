import type { ChartSpec } from '../ui/chart/chart-spec';
import { formatFrequency } from '../ui/chart/frequency-ticks';
import {
  type Complex,
  type Section,
  cascadeAt,
  isSection,
  logFrequencies,
  magnitudeDb,
  phaseDeg,
} from './biquad-response';

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

function sectionsOf(node: unknown): Section[] | null {
  if (Array.isArray(node) && node.length > 0 && node.every(isSection)) return node;
  if (
    isRecord(node) &&
    Array.isArray(node['sections']) &&
    node['sections'].length > 0 &&
    node['sections'].every(isSection)
  ) {
    return node['sections'] as Section[];
  }
  return null;
}

function curveFromComplex(
  label: string,
  frequencies: number[],
  values: Complex[],
  isSum: boolean,
): PlotCurve {
  return {
    label,
    frequenciesHz: frequencies,
    magnitudeDb: values.map(magnitudeDb),
    phaseDeg: values.map(phaseDeg),
    source: 'computed',
    isSum,
  };
}

function computedCurves(node: unknown, path: Path, grid: number[], fs: number, out: PlotCurve[]): void {
  if (out.length >= MAX_CURVES) return;
  const sections = sectionsOf(node);
  if (sections) {
    out.push(
      curveFromComplex(
        labelOf(path),
        grid,
        grid.map((f) => cascadeAt(sections, f, fs)),
        false,
      ),
    );
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
    // The two outputs add as complex signals; an inverted high-pass is subtracted.
    const sign = node['highPassPolarity'] === 'inverted' ? -1 : 1;
    const values = grid.map((f): Complex => {
      const a = cascadeAt(low, f, fs);
      const b = cascadeAt(high, f, fs);
      return [a[0] + sign * b[0], a[1] + sign * b[1]];
    });
    out.push(curveFromComplex(labelOf([...path, 'sum']), grid, values, true));
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

/**
 * The curves worth plotting in an API answer: every magnitude the API reported on its frequency grid
 * (biquad cascades, crossover outputs and their sum); when it reported none, the response of every
 * section cascade it returned, computed at the request's sample rate, with the sum of each crossover.
 */
export function curvesFromResult(body: unknown, requestBody?: unknown): PlotCurve[] {
  const reported: PlotCurve[] = [];
  reportedCurves(body, [], undefined, reported);
  if (reported.length) return reported;
  const fs = sampleRateOf(body, requestBody, isRecord(requestBody) ? requestBody['crossover'] : undefined);
  if (!fs) return [];
  const grid = logFrequencies(10, Math.min(20000, fs * 0.49), 24);
  const computed: PlotCurve[] = [];
  computedCurves(body, [], grid, fs, computed);
  return computed;
}

/** A y range that shows the interesting part: the top of the curves and up to 60 dB below it. */
export function magnitudeRange(curves: readonly PlotCurve[]): { min: number; max: number } {
  const values = curves.flatMap((curve) => curve.magnitudeDb).filter((value) => Number.isFinite(value));
  if (!values.length) return { min: -12, max: 12 };
  const top = Math.max(...values);
  const bottom = Math.min(...values);
  let max = Math.ceil((top + 1.5) / 3) * 3;
  let min = Math.max(Math.floor((bottom - 1.5) / 3) * 3, max - 60);
  // Small moves get at least 12 dB of view, widened downward first because EQ mostly cuts.
  while (max - min < 12) {
    min -= 3;
    if (max - min < 12) max += 3;
  }
  return { min, max };
}

function points(frequencies: number[], values: number[]): Array<{ x: number; y: number }> {
  return frequencies.flatMap((x, i) => (x > 0 && Number.isFinite(values[i]) ? [{ x, y: values[i] }] : []));
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
    series: withPhase.map((curve) => ({
      label: curve.label,
      points: points(curve.frequenciesHz, curve.phaseDeg ?? []),
      colour: curve.isSum ? 5 : (curves.indexOf(curve) % 6) + 1,
      dashed: curve.isSum,
    })),
    summary: `Phase response in degrees of ${withPhase.map((curve) => curve.label).join(', ')}.`,
  };
}
