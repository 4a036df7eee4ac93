import { readWaveLayout } from '../../../../../shared/analysis/riff-wave';
import {
  LABEL_MAX_LENGTH,
  LIMITS,
  MAX_EQ_BANDS,
  MAX_FIT_POINTS,
  MAX_FREQUENCY_HZ,
  MAX_UPLOAD_BYTES,
} from '../../../../../shared/limits';
import { formatQuantity } from '../../format/format';
import type { ChartSeries, ChartSpec } from '../../ui/chart/chart-spec';
import { formatFrequency } from '../../ui/chart/frequency-ticks';
import type {
  BandDecay,
  EqFitRequest,
  EqFitResult,
  Measurement,
  MeasurementKind,
  ResponseKind,
  RoomMode,
  TargetPoint,
} from './measurement.model';
import type { ProcessorLimits } from '../../tunings/tuning.model';

/** The API's caps on an upload and on a fitted response, from the one limits module the contract is checked against. */
export { MAX_UPLOAD_BYTES };
export const MAX_MIC_POSITION_LENGTH = LABEL_MAX_LENGTH;
const MAX_FIT_DB = LIMITS['magnitudeDb[]'].maximum;
const MAX_FIT_HZ = MAX_FREQUENCY_HZ;

const SHORT_KIND_LABELS: Record<MeasurementKind, string> = {
  impulseResponse: 'IR',
  frequencyResponse: 'Response',
  spl: 'SPL',
};

const KIND_LABELS: Record<MeasurementKind, string> = {
  impulseResponse: 'Impulse response',
  frequencyResponse: 'Frequency response',
  spl: 'SPL reading',
};

/** One line of the measurement list, already formatted. */
export interface MeasurementRow {
  id: string;
  channel: string;
  micPosition: string;
  kind: string;
  /** The kind in a word, for narrow screens. */
  kindShort: string;
  arrival: string;
  level: string;
  t30: string;
  /** Whether the measurement has a response to plot (an SPL reading has none). */
  hasResponse: boolean;
}

/** Formats measurements for the list: arrival in ms, the level the kind carries, T30 in seconds. */
export function measurementRows(measurements: readonly Measurement[]): MeasurementRow[] {
  return measurements.map((m) => {
    const s = m.summary;
    let level = '—';
    if (m.kind === 'impulseResponse') level = `${formatQuantity(s.peakDbfs, 'dBFS', 1)} peak`;
    else if (m.kind === 'spl')
      level = `${formatQuantity(s.splDb, 'dB', 1)}${s.weighting ? ` (${s.weighting})` : ''}`;
    else if (s.fromHz !== undefined && s.toHz !== undefined)
      level = `${formatFrequency(s.fromHz)}–${formatFrequency(s.toHz)} Hz`;
    return {
      id: m.id,
      channel: m.channel,
      micPosition: m.micPosition,
      kind: KIND_LABELS[m.kind] ?? m.kind,
      kindShort: SHORT_KIND_LABELS[m.kind] ?? m.kind,
      arrival: m.kind === 'impulseResponse' ? formatQuantity(s.arrivalMs, 'ms', 2) : '—',
      level,
      t30: m.kind === 'impulseResponse' ? formatQuantity(s.t30S, 's', 2) : '—',
      hasResponse: m.kind !== 'spl',
    };
  });
}

/** The measurement shown first: the newest impulse response, else the newest response, else none. */
export function defaultSelection(measurements: readonly Measurement[]): string | null {
  const newestOf = (kind: MeasurementKind) => [...measurements].reverse().find((m) => m.kind === kind);
  return (newestOf('impulseResponse') ?? newestOf('frequencyResponse'))?.id ?? null;
}

/** The upload form as the panel holds it. */
export interface UploadDraft {
  channel: string;
  micPosition: string;
  file: { name: string; size: number } | null;
  /** Channels of the chosen WAV, when it is one. */
  fileChannels?: number;
  /** The chosen 0-based channel of a multichannel WAV. */
  fileChannel?: number | null;
  /** The chosen 0-based loopback channel, if any. */
  referenceFileChannel?: number | null;
}

export interface DraftProblem {
  field: 'channel' | 'micPosition' | 'file' | 'fileChannel';
  message: string;
}

/** Checks an upload before it is sent, with the same rules the API applies, so mistakes show at once. */
export function uploadProblems(draft: UploadDraft, channels: readonly string[]): DraftProblem[] {
  const problems: DraftProblem[] = [];
  if (!draft.channel) problems.push({ field: 'channel', message: 'Choose the loudspeaker you measured.' });
  else if (!channels.includes(draft.channel))
    problems.push({ field: 'channel', message: `${draft.channel} is not a loudspeaker of this room.` });
  const mic = draft.micPosition.trim();
  if (!mic) problems.push({ field: 'micPosition', message: 'Name the microphone position (e.g. MLP or 2).' });
  else if (mic.length > MAX_MIC_POSITION_LENGTH)
    problems.push({
      field: 'micPosition',
      message: `Use at most ${MAX_MIC_POSITION_LENGTH} characters (this has ${mic.length}).`,
    });
  if (!draft.file)
    problems.push({ field: 'file', message: 'Choose a WAV impulse response or a text response.' });
  else if (draft.file.size === 0) problems.push({ field: 'file', message: `${draft.file.name} is empty.` });
  else if (draft.file.size > MAX_UPLOAD_BYTES)
    problems.push({
      field: 'file',
      message: `${draft.file.name} is ${(draft.file.size / 1048576).toFixed(1)} MiB; the limit is 20 MiB.`,
    });
  if ((draft.fileChannels ?? 1) > 1) {
    if (draft.fileChannel == null)
      problems.push({
        field: 'fileChannel',
        message: `This file has ${draft.fileChannels} channels: choose the one with the loudspeaker.`,
      });
    else if (draft.fileChannel === draft.referenceFileChannel)
      problems.push({
        field: 'fileChannel',
        message: 'The loudspeaker and the timing reference cannot be the same channel.',
      });
  }
  return problems;
}

/** The processor limits a room may store that the fit reads. */
export type RoomLimits = Pick<ProcessorLimits, 'eqBandsPerChannel' | 'eqMaxBoostDb' | 'eqMaxCutDb'>;

/**
 * The `POST /v1/eq/fit` body for a measured response in a room: the room's band count and cut limit,
 * cuts only unless boosts are allowed (then up to the room's boost limit), toward a flat target, and the
 * room's volume and measured reverberation time so the fit corrects only up to its transition frequency.
 * Points the API would refuse (non-finite, out of range) are dropped and a longer response is thinned
 * to the API's point cap evenly on a log-frequency scale, keeping both ends: an export with linear
 * spacing (FFT bins) keeps its low-frequency points, where room modes need them.
 */
export function eqFitRequest(
  measured: { frequenciesHz: readonly number[]; magnitudeDb: readonly number[] },
  limits: RoomLimits | null,
  sampleRateHz: number,
  allowBoost: boolean,
  room: { volumeM3: number; reverberationTimeS?: number | null } | null = null,
  choices: FitChoices = {},
): EqFitRequest {
  const points = measured.frequenciesHz.flatMap((f, i) => {
    const db = measured.magnitudeDb[i];
    return f > 0 && f <= MAX_FIT_HZ && Number.isFinite(db) && Math.abs(db) <= MAX_FIT_DB ? [[f, db]] : [];
  });
  const kept = points.length <= MAX_FIT_POINTS ? points : thinLogarithmically(points, MAX_FIT_POINTS);
  return {
    sampleRateHz,
    measured: { frequenciesHz: kept.map((p) => p[0]), magnitudeDb: kept.map((p) => p[1]) },
    target: choices.targetName ? { kind: 'stored', name: choices.targetName } : { kind: 'flat' },
    maxBands: choices.maxBands ?? defaultBandCount(limits),
    maxBoostDb: allowBoost ? (limits?.eqMaxBoostDb ?? 0) : 0,
    maxCutDb: limits?.eqMaxCutDb ?? 12,
    ...(choices.fromHz != null && { fromHz: choices.fromHz }),
    ...(choices.toHz != null && { toHz: choices.toHz }),
    ...(room && {
      room: {
        volumeM3: room.volumeM3,
        ...(room.reverberationTimeS != null && { reverberationTimeS: room.reverberationTimeS }),
      },
    }),
  };
}

/** What the engineer chose for a fit; anything left out takes the default. */
export interface FitChoices {
  /** Lower end of the correction, Hz; the API's default (the response's lowest point) when absent. */
  fromHz?: number | null;
  /** Upper end, Hz; the room's transition frequency when absent. */
  toHz?: number | null;
  /** A stored target curve by name; flat when absent. */
  targetName?: string | null;
  maxBands?: number | null;
}

/** Band count a fit uses unless told otherwise: the room's bands per channel, else 8 (common practice). */
export function defaultBandCount(limits: RoomLimits | null): number {
  return limits?.eqBandsPerChannel ?? 8;
}

/** Most bands a fit may ask for: the room's bands per channel, capped by the API's own maximum. */
export function maxBandCount(limits: RoomLimits | null): number {
  return Math.min(limits?.eqBandsPerChannel ?? MAX_EQ_BANDS, MAX_EQ_BANDS);
}

export interface FitRangeProblem {
  field: 'fromHz' | 'toHz' | 'maxBands';
  message: string;
}

/** Lowest and highest frequency the fit range fields accept (the audio band). */
export const FIT_RANGE_MIN_HZ = 10;
export const FIT_RANGE_MAX_HZ = 20000;

/** Checks the fit fields before a fit is asked for, so a mistyped range shows at once and costs no request. */
export function fitChoiceProblems(choices: FitChoices, limits: RoomLimits | null): FitRangeProblem[] {
  const problems: FitRangeProblem[] = [];
  const inBand = (field: 'fromHz' | 'toHz', value: number | null | undefined) => {
    if (value == null) return;
    if (!Number.isFinite(value) || value < FIT_RANGE_MIN_HZ || value > FIT_RANGE_MAX_HZ)
      problems.push({
        field,
        message: `Give a frequency from ${FIT_RANGE_MIN_HZ} Hz to ${formatFrequency(FIT_RANGE_MAX_HZ)} Hz.`,
      });
  };
  inBand('fromHz', choices.fromHz);
  inBand('toHz', choices.toHz);
  if (!problems.length && choices.fromHz != null && choices.toHz != null && choices.fromHz >= choices.toHz)
    problems.push({ field: 'toHz', message: 'The upper end must be above the lower end.' });
  const most = maxBandCount(limits);
  if (
    choices.maxBands != null &&
    (!Number.isInteger(choices.maxBands) || choices.maxBands < 1 || choices.maxBands > most)
  )
    problems.push({ field: 'maxBands', message: `Use 1 to ${most} bands (the room's limit per channel).` });
  return problems;
}

/** Smoothing choices for an uploaded impulse response, in octaves; 1/12 octave is the API's default. */
export const SMOOTHING_CHOICES: ReadonlyArray<{ octaves: number; label: string }> = [
  { octaves: 1 / 48, label: '1/48 octave (finest)' },
  { octaves: 1 / 24, label: '1/24 octave' },
  { octaves: 1 / 12, label: '1/12 octave (default)' },
  { octaves: 1 / 6, label: '1/6 octave' },
  { octaves: 1 / 3, label: '1/3 octave' },
  { octaves: 1, label: '1 octave' },
];
export const DEFAULT_SMOOTHING_OCTAVES = LIMITS.smoothingOctaves.default;

/** What the browser can tell of a chosen WAV before it is sent: its channel count and rate. */
export interface WavFacts {
  channelCount: number;
  sampleRateHz: number;
}

/**
 * Reads a WAV's header with the same RIFF walker the API uses; null for a file that is not a WAV (a text
 * response) or whose header the walker refuses (the API then names the problem on upload).
 */
export function wavFacts(bytes: Uint8Array): WavFacts | null {
  try {
    const layout = readWaveLayout(bytes);
    return { channelCount: layout.format.channelCount, sampleRateHz: layout.format.sampleRateHz };
  } catch {
    return null;
  }
}

/** The response kinds a channel has among the measurements (SPL readings have none). */
export function responseKinds(measurements: readonly Measurement[], channel: string): ResponseKind[] {
  const kinds = new Set(
    measurements.filter((m) => m.channel === channel && m.kind !== 'spl').map((m) => m.kind as ResponseKind),
  );
  return (['impulseResponse', 'frequencyResponse'] as const).filter((k) => kinds.has(k));
}

/**
 * The target drawn on the plot across the fit band: the stored curve's points (held beyond its ends,
 * linear in log frequency between them, as the API interpolates) raised to the fit's level, or a flat line.
 */
export function targetLine(
  points: readonly TargetPoint[] | null,
  fromHz: number,
  toHz: number,
  offsetDb: number,
): Array<{ x: number; y: number }> {
  if (!points || points.length < 2)
    return [
      { x: fromHz, y: offsetDb },
      { x: toHz, y: offsetDb },
    ];
  const at = (f: number) => {
    if (f <= points[0].frequencyHz) return points[0].gainDb;
    const last = points[points.length - 1];
    if (f >= last.frequencyHz) return last.gainDb;
    const i = points.findIndex((p) => p.frequencyHz >= f);
    const a = points[i - 1];
    const b = points[i];
    const t = Math.log(f / a.frequencyHz) / Math.log(b.frequencyHz / a.frequencyHz);
    return a.gainDb + t * (b.gainDb - a.gainDb);
  };
  const xs = [fromHz, ...points.map((p) => p.frequencyHz).filter((f) => f > fromHz && f < toHz), toHz];
  return xs.map((x) => ({ x, y: at(x) + offsetDb }));
}

/**
 * At most `count` of the ascending `points`: for each of `count` log-spaced frequencies from the first
 * to the last point, the point nearest it (in log frequency), each point taken once.
 */
function thinLogarithmically(points: number[][], count: number): number[][] {
  const first = Math.log(points[0][0]);
  const span = Math.log(points[points.length - 1][0]) - first;
  const kept: number[][] = [];
  let index = 0;
  for (let i = 0; i < count; i += 1) {
    const wanted = first + (span * i) / (count - 1);
    while (
      index + 1 < points.length &&
      Math.abs(Math.log(points[index + 1][0]) - wanted) <= Math.abs(Math.log(points[index][0]) - wanted)
    )
      index += 1;
    if (kept.at(-1) !== points[index]) kept.push(points[index]);
  }
  return kept;
}

export interface DecayRow {
  band: string;
  edt: string;
  t20: string;
  t30: string;
}

/** Octave-band decay times for a table; a band without a usable decay reads "—". */
export function decayRows(broadband: BandDecay | null, bands: readonly BandDecay[]): DecayRow[] {
  const row = (band: string, d: BandDecay) => ({
    band,
    edt: formatQuantity(d.edtS, 's', 2),
    t20: formatQuantity(d.t20S, 's', 2),
    t30: formatQuantity(d.t30S, 's', 2),
  });
  return [
    ...bands.map((b) => row(`${formatFrequency(b.nominalHz)} Hz`, b)),
    ...(broadband ? [row('Broadband', broadband)] : []),
  ];
}

export interface ModeRow {
  frequency: string;
  kind: string;
  indices: string;
}

/** The lowest room modes, lowest first, with their half-wavelength counts (width, length, height). */
export function modeRows(modes: readonly RoomMode[], count: number): ModeRow[] {
  return [...modes]
    .sort((a, b) => a.frequencyHz - b.frequencyHz)
    .slice(0, count)
    .map((m) => ({
      frequency: formatQuantity(m.frequencyHz, 'Hz', 1),
      kind: m.kind,
      indices: `${m.nx}, ${m.ny}, ${m.nz}`,
    }));
}

export interface ResponsePlotInput {
  measured: { label: string; frequenciesHz: readonly number[]; magnitudeDb: readonly number[] };
  fit?: Pick<EqFitResult, 'predicted' | 'targetOffsetDb' | 'fromHz' | 'toHz'> | null;
  /** A stored target curve the fit aimed at; flat when absent. */
  target?: { name: string; points: readonly TargetPoint[] } | null;
  modes?: readonly RoomMode[];
  schroederFrequencyHz?: number | null;
}

/** Axial modes are the strongest in a rectangular room; these are the ones drawn as markers. */
const MARKED_MODE_KIND = 'axial';
const MAX_MARKED_MODE_HZ = 300;

function curvePoints(frequencies: readonly number[], values: readonly number[]) {
  return frequencies.flatMap((x, i) => (x > 0 && Number.isFinite(values[i]) ? [{ x, y: values[i] }] : []));
}

/**
 * A y range that holds the curves: from 3 dB over the top down to 3 dB under the bottom, at most 50 dB
 * deep (a roll-off far below the band of interest is cut off), on 5 dB steps (10 dB past 30 dB).
 */
export function levelRange(values: readonly number[]): { min: number; max: number; step: number } {
  const finite = values.filter((v) => Number.isFinite(v));
  if (!finite.length) return { min: -30, max: 0, step: 5 };
  const top = Math.max(...finite);
  const bottom = Math.max(Math.min(...finite), top - 47);
  const step = top - bottom > 27 ? 10 : 5;
  const max = Math.ceil((top + 3) / step) * step;
  const min = Math.floor((bottom - 3) / step) * step;
  return { min, max: Math.max(max, min + 4 * step), step };
}

/**
 * The response plot: measured (or spatially averaged) response, the predicted response after the fitted
 * EQ, the flat target at the fit's level across the fit band, axial room modes as markers along the
 * bottom and the Schroeder frequency as a dashed vertical line.
 */
export function responseChart(input: ResponsePlotInput): ChartSpec {
  const { measured, fit } = input;
  const levels = [...measured.magnitudeDb, ...(fit?.predicted.magnitudeDb ?? [])];
  const range = levelRange(levels);
  const series: ChartSeries[] = [
    { label: measured.label, points: curvePoints(measured.frequenciesHz, measured.magnitudeDb), colour: 1 },
  ];
  const parts = [`${measured.label} on a logarithmic frequency axis`];
  if (fit) {
    series.push({
      label: 'Predicted with the fitted EQ',
      points: curvePoints(fit.predicted.frequenciesHz, fit.predicted.magnitudeDb),
      colour: 2,
    });
    const target = input.target ?? null;
    series.push({
      label: target ? `Target (${target.name})` : 'Target (flat)',
      points: targetLine(target?.points ?? null, fit.fromHz, fit.toHz, fit.targetOffsetDb),
      colour: 0,
      dashed: true,
    });
    parts.push(
      `predicted response after the fitted EQ`,
      target
        ? `target “${target.name}” at ${fit.targetOffsetDb.toFixed(1)} dB from ${formatFrequency(fit.fromHz)} to ${formatFrequency(fit.toHz)} Hz`
        : `flat target at ${fit.targetOffsetDb.toFixed(1)} dB from ${formatFrequency(fit.fromHz)} to ${formatFrequency(fit.toHz)} Hz`,
    );
  }
  const lowest = measured.frequenciesHz.find((f) => f > 0) ?? 0;
  const marked = (input.modes ?? []).filter(
    (m) => m.kind === MARKED_MODE_KIND && m.frequencyHz <= MAX_MARKED_MODE_HZ && m.frequencyHz >= lowest,
  );
  if (marked.length) {
    const y = range.min + range.step * 0.3;
    series.push({
      label: 'Axial room modes',
      kind: 'scatter',
      points: marked.map((m) => ({ x: m.frequencyHz, y })),
      colour: 4,
      pointStyle: 'triangle',
      pointRadius: 5,
    });
    parts.push(`axial room modes at ${marked.map((m) => formatFrequency(m.frequencyHz)).join(', ')} Hz`);
  }
  const schroeder = input.schroederFrequencyHz;
  if (schroeder && schroeder >= lowest) {
    series.push({
      label: `Schroeder frequency ${formatFrequency(schroeder)} Hz`,
      points: [
        { x: schroeder, y: range.min },
        { x: schroeder, y: range.max },
      ],
      colour: 3,
      dashed: true,
    });
    parts.push(`Schroeder frequency ${formatFrequency(schroeder)} Hz`);
  }
  return {
    kind: 'line',
    xScale: 'log',
    xTitle: 'Frequency (Hz)',
    yTitle: 'Level (dB)',
    yMin: range.min,
    yMax: range.max,
    yStep: range.step,
    series,
    summary: `${parts.join('; ')}.`,
  };
}

/** What the plotted curve stands for: one position, or the power average of several. */
export function measuredLabel(channel: string, micPositions: readonly string[]): string {
  return micPositions.length > 1
    ? `${channel}: spatial average of ${micPositions.length} positions (${micPositions.join(', ')})`
    : `${channel}: measured at ${micPositions[0] ?? 'one position'}`;
}

const FIELD_LABELS: Record<string, string> = {
  '/body/file': 'File',
  '/body/channel': 'Loudspeaker',
  '/body/micPosition': 'Microphone position',
  '/body/fileChannel': 'Channel in the file',
  '/file': 'File',
  '/channel': 'Loudspeaker',
};

/**
 * The problem document's field errors as the form names its fields, leaving out an error that only
 * repeats the detail already shown.
 */
export function uploadFieldErrors(
  detail: string | undefined,
  fieldErrors: ReadonlyArray<{ pointer: string; message: string }>,
): string[] {
  return fieldErrors
    .filter((e) => e.message !== detail)
    .map((e) => {
      const label = FIELD_LABELS[e.pointer] ?? e.pointer;
      return label ? `${label}: ${e.message}` : e.message;
    });
}
