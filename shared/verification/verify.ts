import { powerAverageResampled } from '../analysis/spatial-average';
import { smoothMagnitudeDb } from '../analysis/smoothing';
import { cascadeResponse } from '../dsp/response';
import { targetDb, type TargetCurve } from '../eq-fit/target-curve';
import { designCrossover } from '../filters/crossover';
import { magnitudeOf, type StoredMeasurement } from '../plan/stored-room-plan';
import type { TuningSettings } from '../plan/tuning';
import type { TuningPromise } from './promise';

export type Status = 'pass' | 'warn' | 'fail' | 'notMeasured';

export interface Tolerances {
  /** Largest arrival difference between channels (spread), ms. */
  arrivalMs: number;
  /** Largest difference of a channel's level from what the tuning promised, dB. */
  levelDb: number;
  /** RMS deviation of a channel's response from the target over its corrected range, dB. */
  responseRmsDb: number;
  /** Largest deviation of a channel's response from the target over its corrected range, dB. */
  responseMaxDb: number;
  /** Deepest dip of a bass-managed channel's response (the subwoofer included) around the crossover, dB. */
  crossoverDipDb: number;
}

export interface ToleranceInfo {
  name: keyof Tolerances;
  value: number;
  default: number;
  setByCaller: boolean;
  basis: 'published' | 'commonPractice';
  source: string;
}

/** Defaults, and where each comes from. */
export const DEFAULT_TOLERANCES: Record<
  keyof Tolerances,
  Omit<ToleranceInfo, 'name' | 'setByCaller' | 'value'>
> = {
  arrivalMs: {
    default: 0.1,
    basis: 'published',
    source:
      'ITU-R BS.2051-3, Table 1 note 1: loudspeakers not on a sphere should be time-aligned at the listening position to within 100 µs.',
  },
  levelDb: {
    default: 0.5,
    basis: 'commonPractice',
    source:
      'Common practice: channel levels matched to within ±0.5 dB of the reference with pink noise, C-weighted, slow.',
  },
  responseRmsDb: {
    default: 1.5,
    basis: 'commonPractice',
    source:
      'Common practice for a corrected channel at the listening position (1/48-octave grid); no published figure.',
  },
  responseMaxDb: {
    default: 3,
    basis: 'commonPractice',
    source: 'Common practice: within ±3 dB of the target over the corrected range; no published figure.',
  },
  crossoverDipDb: {
    default: 3,
    basis: 'commonPractice',
    source:
      'Common practice: no dip deeper than 3 dB in a bass-managed channel from one octave below to one octave above the crossover.',
  },
};

/** Within tolerance but past this share of it, a line warns ("near the limit") [product choice]. */
const WARN_SHARE = 0.8;
const LFE_LABEL = /^LFE\d*$/;
const LFE_OFFSET_DB = 10;
/** Default corrected ranges when the tuning has no promise [product choice, as the plan fits]. */
const FULL_RANGE = { fromHz: 20, toHz: 20000 };
const LFE_TOP_HZ = 120;

export interface VerificationInput {
  settings: TuningSettings;
  promise: TuningPromise | null;
  /** The "after" measurements of this tuning version. */
  after: readonly StoredMeasurement[];
  tolerances?: Partial<Tolerances>;
  /** Reference level to check against when the tuning has no promise of its own, dB. */
  referenceDb?: number;
  /** Position whose arrivals and SPL readings count; default the one with the most of them. */
  micPosition?: string;
}

export interface ChannelVerification {
  id: string;
  arrival: {
    status: Status;
    arrivalMs: number | null;
    /** Arrival minus the median arrival of the checked channels, ms. */
    deviationMs: number | null;
    measurementIds: string[];
    note?: string;
  };
  level: {
    status: Status;
    measuredDb: number | null;
    expectedDb: number | null;
    deviationDb: number | null;
    measurementIds: string[];
  };
  response: {
    status: Status;
    rmsDb: number | null;
    largestDb: number | null;
    largestAtHz: number | null;
    fromHz: number | null;
    toHz: number | null;
    measurementIds: string[];
    micPositions: string[];
  };
  crossoverSum: {
    status: Status;
    deepestDipDb: number | null;
    atHz: number | null;
    fromHz: number | null;
    toHz: number | null;
    measurementIds: string[];
  };
}

export interface Verification {
  verdict: 'pass' | 'warn' | 'fail' | 'incomplete';
  micPosition: string | null;
  referenceDb: number | null;
  referenceFrom: 'promise' | 'request' | 'medianOfMeasured' | null;
  arrivalSpread: {
    status: Status;
    spreadMs: number | null;
    channels: string[];
    timingReference: boolean | null;
  };
  channels: ChannelVerification[];
  tolerances: ToleranceInfo[];
  notes: string[];
  /** The averaged "after" response of each channel that has one (for plots). */
  responses: Array<{ channel: string; frequenciesHz: number[]; magnitudeDb: number[] }>;
}

const newest = <T extends { id: string }>(list: T[]): T | undefined =>
  list.reduce<T | undefined>((best, m) => (best === undefined || m.id > best.id ? m : best), undefined);

/** pass within the tolerance (warn past 80 % of it), fail beyond it. */
export function judge(deviation: number, tolerance: number): Status {
  const size = Math.abs(deviation);
  if (size > tolerance + 1e-9) return 'fail';
  return size > WARN_SHARE * tolerance ? 'warn' : 'pass';
}

const worst = (statuses: Status[]): Status =>
  statuses.includes('fail')
    ? 'fail'
    : statuses.includes('warn')
      ? 'warn'
      : statuses.includes('pass')
        ? 'pass'
        : 'notMeasured';

type Magnitude = { frequenciesHz: number[]; magnitudeDb: number[] };

/**
 * Compares the measurements taken with a tuning version loaded ("after") with what the version promised:
 * per channel the arrival (against the median of the channels, and the spread of all), the level against
 * the promised level (reference, LFE channels 10 dB above), the response's deviation from the target
 * curve over the range the EQ corrected (RMS and largest, after matching levels: the level has its own
 * line), and for bass-managed channels — whose "after" response already holds the subwoofer through the
 * bass management — the deepest dip from one octave below to one octave above the crossover. Each line
 * passes (within tolerance), warns (past 80 % of it) or fails; a line with nothing measured is
 * `notMeasured` and does not count. Subwoofer (LFE) outputs have no arrival line: a low-passed arrival
 * cannot be read to 0.1 ms, and the subwoofer is timed by its sum at the crossover instead.
 */
export function verifyTuning(input: VerificationInput): Verification {
  const tolerances = (Object.keys(DEFAULT_TOLERANCES) as Array<keyof Tolerances>).map(
    (name): ToleranceInfo => ({
      name,
      ...DEFAULT_TOLERANCES[name],
      value: input.tolerances?.[name] ?? DEFAULT_TOLERANCES[name].default,
      setByCaller: input.tolerances?.[name] !== undefined,
    }),
  );
  const tol = Object.fromEntries(tolerances.map((t) => [t.name, t.value])) as unknown as Tolerances;
  const notes: string[] = [];
  const ids = input.settings.channels.map((c) => c.id);
  const after = input.after.filter((m) => ids.includes(m.channel));

  const counts = new Map<string, number>();
  for (const m of after) {
    if (m.kind === 'spl' || m.kind === 'impulseResponse')
      counts.set(m.micPosition, (counts.get(m.micPosition) ?? 0) + 1);
  }
  const micPosition =
    input.micPosition ??
    [...counts.entries()].reduce<[string, number] | null>(
      (b, e) => (b === null || e[1] > b[1] ? e : b),
      null,
    )?.[0] ??
    null;
  const at = (channel: string, kind: StoredMeasurement['kind']) =>
    newest(after.filter((m) => m.channel === channel && m.kind === kind && m.micPosition === micPosition));

  // Arrivals.
  const arrivals = new Map<string, { ms: number; id: string; referenced: boolean }>();
  for (const id of ids) {
    if (LFE_LABEL.test(id)) continue;
    const m = at(id, 'impulseResponse');
    const r = m?.result as
      { arrival?: { arrivalMs: number }; timingReference?: { arrivalMs: number } } | undefined;
    if (m && r?.arrival) {
      const ref = r.timingReference?.arrivalMs;
      arrivals.set(id, { ms: r.arrival.arrivalMs - (ref ?? 0), id: m.id, referenced: ref !== undefined });
    }
  }
  const referencedKinds = new Set([...arrivals.values()].map((a) => a.referenced));
  if (referencedKinds.size > 1) {
    notes.push(
      'Some arrivals are relative to a timing reference and some are not; only those with one are compared.',
    );
    for (const [id, a] of arrivals) if (!a.referenced) arrivals.delete(id);
  } else if (referencedKinds.has(false)) {
    notes.push(
      'Arrivals have no timing reference; they are comparable only if every capture had the same latency.',
    );
  }
  const arrivalValues = [...arrivals.values()].map((a) => a.ms).sort((a, b) => a - b);
  const median =
    arrivalValues.length === 0
      ? null
      : arrivalValues.length % 2
        ? arrivalValues[(arrivalValues.length - 1) / 2]
        : (arrivalValues[arrivalValues.length / 2 - 1] + arrivalValues[arrivalValues.length / 2]) / 2;
  const spreadMs =
    arrivalValues.length >= 2 ? arrivalValues[arrivalValues.length - 1] - arrivalValues[0] : null;

  // Reference level.
  let referenceDb = input.promise?.referenceDb ?? null;
  let referenceFrom: Verification['referenceFrom'] = referenceDb !== null ? 'promise' : null;
  if (input.referenceDb !== undefined) {
    referenceDb = input.referenceDb;
    referenceFrom = 'request';
  }
  const readings = new Map(
    ids.flatMap((id) => {
      const m = at(id, 'spl');
      return m ? [[id, m] as const] : [];
    }),
  );
  if (referenceDb === null) {
    const mains = [...readings.entries()]
      .filter(([id]) => !LFE_LABEL.test(id))
      .map(([, m]) => m.result.splDb as number);
    if (mains.length > 0) {
      mains.sort((a, b) => a - b);
      referenceDb = mains[Math.floor((mains.length - 1) / 2)];
      referenceFrom = 'medianOfMeasured';
      notes.push(
        `The tuning promised no reference level and none was given; levels are checked against the median of the measured channels, ${referenceDb.toFixed(2)} dB (so they are checked for matching, not for the absolute level).`,
      );
    }
  }

  const crossoverHz =
    input.promise?.crossoverHz ??
    input.settings.channels.find((c) => c.highPass)?.highPass?.frequencyHz ??
    input.settings.subwoofer?.lowPass?.frequencyHz ??
    null;
  const curve: TargetCurve = input.promise?.targetCurve ?? { kind: 'flat' };
  const responses: Verification['responses'] = [];

  const channels = input.settings.channels.map((c): ChannelVerification => {
    const arrival = arrivals.get(c.id);
    const reading = readings.get(c.id);
    const promised = input.promise?.channels.find((p) => p.id === c.id);
    const offset = LFE_LABEL.test(c.id) ? LFE_OFFSET_DB : 0;
    const expectedDb = promised?.expectedDb ?? (referenceDb !== null ? referenceDb + offset : null);
    const measuredDb = reading ? (reading.result.splDb as number) : null;

    // Responses: the power average over every position, newest per position, frequency responses preferred.
    const list = after.filter((m) => m.channel === c.id && magnitudeOf(m) !== null);
    const kind = list.some((m) => m.kind === 'frequencyResponse') ? 'frequencyResponse' : 'impulseResponse';
    const ofKind = list.filter((m) => m.kind === kind);
    const perPosition = [...new Set(ofKind.map((m) => m.micPosition))].map(
      (p) => newest(ofKind.filter((m) => m.micPosition === p)) as StoredMeasurement,
    );
    const averaged =
      perPosition.length > 0
        ? powerAverageResampled(perPosition.map((m) => magnitudeOf(m) as Magnitude))
        : null;
    if (averaged) responses.push({ channel: c.id, ...averaged });

    const range = correctedRange(c.id, c.bassManaged, promised, crossoverHz);
    // The subwoofer output is heard through its low-pass: that is part of what it promises.
    const lowPass =
      input.settings.subwoofer?.channel === c.id && input.settings.subwoofer.lowPass
        ? designCrossover(input.settings.subwoofer.lowPass, input.settings.sampleRateHz).lowPass.sections
        : null;
    const deviation = averaged
      ? responseDeviation(averaged, curve, range, (f) =>
          lowPass ? cascadeResponse(lowPass, f, input.settings.sampleRateHz).magnitudeDb : f.map(() => 0),
        )
      : null;
    const sum =
      averaged && c.bassManaged && crossoverHz !== null ? crossoverDip(averaged, crossoverHz) : null;
    return {
      id: c.id,
      arrival: LFE_LABEL.test(c.id)
        ? {
            status: 'notMeasured',
            arrivalMs: null,
            deviationMs: null,
            measurementIds: [],
            note: 'The subwoofer is timed by its sum with the mains at the crossover (see crossoverSum).',
          }
        : arrival && median !== null && arrivals.size >= 2
          ? {
              status: judge(arrival.ms - median, tol.arrivalMs),
              arrivalMs: arrival.ms,
              deviationMs: arrival.ms - median,
              measurementIds: [arrival.id],
            }
          : {
              status: 'notMeasured',
              arrivalMs: arrival?.ms ?? null,
              deviationMs: null,
              measurementIds: arrival ? [arrival.id] : [],
            },
      level:
        reading && expectedDb !== null && measuredDb !== null
          ? {
              status: judge(measuredDb - expectedDb, tol.levelDb),
              measuredDb,
              expectedDb,
              deviationDb: measuredDb - expectedDb,
              measurementIds: [reading.id],
            }
          : {
              status: 'notMeasured',
              measuredDb,
              expectedDb,
              deviationDb: null,
              measurementIds: reading ? [reading.id] : [],
            },
      response: deviation
        ? {
            status: worst([
              judge(deviation.rmsDb, tol.responseRmsDb),
              judge(deviation.largestDb, tol.responseMaxDb),
            ]),
            ...deviation,
            measurementIds: perPosition.map((m) => m.id),
            micPositions: perPosition.map((m) => m.micPosition),
          }
        : {
            status: 'notMeasured',
            rmsDb: null,
            largestDb: null,
            largestAtHz: null,
            fromHz: range.fromHz,
            toHz: range.toHz,
            measurementIds: perPosition.map((m) => m.id),
            micPositions: perPosition.map((m) => m.micPosition),
          },
      crossoverSum: sum
        ? {
            status: judge(sum.deepestDipDb, tol.crossoverDipDb),
            ...sum,
            measurementIds: perPosition.map((m) => m.id),
          }
        : {
            status: 'notMeasured',
            deepestDipDb: null,
            atHz: null,
            fromHz: null,
            toHz: null,
            measurementIds: [],
          },
    };
  });

  const spreadStatus: Status = spreadMs === null ? 'notMeasured' : judge(spreadMs, tol.arrivalMs);
  const all = [
    spreadStatus,
    ...channels.flatMap((c) => [c.arrival.status, c.level.status, c.response.status, c.crossoverSum.status]),
  ];
  const verdict = all.every((s) => s === 'notMeasured')
    ? 'incomplete'
    : (worst(all) as Verification['verdict']);
  if (after.length === 0) notes.push('No "after" measurements of this tuning version are stored.');
  return {
    verdict,
    micPosition,
    referenceDb,
    referenceFrom,
    arrivalSpread: {
      status: spreadStatus,
      spreadMs,
      channels: [...arrivals.keys()],
      timingReference:
        referencedKinds.size === 1 ? referencedKinds.has(true) : referencedKinds.size > 1 ? true : null,
    },
    channels,
    tolerances,
    notes,
    responses,
  };
}

function correctedRange(
  id: string,
  bassManaged: boolean,
  promised: TuningPromise['channels'][number] | undefined,
  crossoverHz: number | null,
): { fromHz: number; toHz: number } {
  if (promised?.correctedFromHz != null && promised.correctedToHz != null) {
    return { fromHz: promised.correctedFromHz, toHz: promised.correctedToHz };
  }
  if (LFE_LABEL.test(id))
    return { fromHz: FULL_RANGE.fromHz, toHz: crossoverHz !== null ? 2 * crossoverHz : LFE_TOP_HZ };
  if (bassManaged && crossoverHz !== null) return { fromHz: crossoverHz, toHz: FULL_RANGE.toHz };
  return { ...FULL_RANGE };
}

/** RMS and largest deviation from the target over the range, after removing the mean level difference. */
function responseDeviation(
  response: Magnitude,
  curve: TargetCurve,
  range: { fromHz: number; toHz: number },
  filterDb: (frequenciesHz: number[]) => number[],
): { rmsDb: number; largestDb: number; largestAtHz: number; fromHz: number; toHz: number } | null {
  const inRange = response.frequenciesHz
    .map((f, i) => ({ f, db: response.magnitudeDb[i] }))
    .filter((p) => p.f >= range.fromHz * (1 - 1e-9) && p.f <= range.toHz * (1 + 1e-9));
  const filter = filterDb(inRange.map((p) => p.f));
  const points = inRange.map((p, i) => ({ f: p.f, d: p.db - targetDb(curve, p.f) - filter[i] }));
  if (points.length < 2) return null;
  const mean = points.reduce((s, p) => s + p.d, 0) / points.length;
  let squares = 0;
  let largest = { d: 0, f: points[0].f };
  for (const p of points) {
    const d = p.d - mean;
    squares += d * d;
    if (Math.abs(d) > Math.abs(largest.d)) largest = { d, f: p.f };
  }
  return {
    rmsDb: Math.sqrt(squares / points.length),
    largestDb: largest.d,
    largestAtHz: largest.f,
    fromHz: points[0].f,
    toHz: points[points.length - 1].f,
  };
}

/** Deepest point below the mean level from fc/2 to 2·fc (1/6-octave smoothed, so one grid point is not a dip). */
function crossoverDip(
  response: Magnitude,
  crossoverHz: number,
): { deepestDipDb: number; atHz: number; fromHz: number; toHz: number } | null {
  const fromHz = crossoverHz / 2;
  const toHz = crossoverHz * 2;
  const band = response.frequenciesHz.filter((f) => f >= fromHz * (1 - 1e-9) && f <= toHz * (1 + 1e-9));
  if (band.length < 2 || response.frequenciesHz[0] > fromHz * 1.01) return null;
  const smoothed = smoothMagnitudeDb(response.frequenciesHz, response.magnitudeDb, 1 / 6, band);
  const mean = smoothed.reduce((s, x) => s + x, 0) / smoothed.length;
  let deepest = { d: 0, f: band[0] };
  smoothed.forEach((x, i) => {
    if (x - mean < deepest.d) deepest = { d: x - mean, f: band[i] };
  });
  return { deepestDipDb: deepest.d, atHz: deepest.f, fromHz: band[0], toHz: band[band.length - 1] };
}
