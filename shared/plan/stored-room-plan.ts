import { powerAverageResampled } from '../analysis/spatial-average';
import { CalculationInputError } from '../errors';
import type { RoomDimensions } from '../geometry/analyse-geometry';
import type { RoomPoint } from '../geometry/coordinates';
import type { CalculationWarning } from '../notices';
import type { ProcessorProfileSettings } from '../processor/profile';
import {
  planRoom,
  type PlanChannel,
  type PlanChannelInput,
  type PlanInput,
  type PlanSubwoofer,
  type RoomPlan,
} from './plan-room';
import { requireStoredPlanBudget } from './plan-budget';
import { integrateSubwoofer, type ComplexResponse, type SubwooferIntegration } from './subwoofer-integration';

/** A stored measurement as the plan reads it (the API's row, without I/O). */
export interface StoredMeasurement {
  id: string;
  channel: string;
  micPosition: string;
  kind: 'impulseResponse' | 'frequencyResponse' | 'spl';
  stage: 'before' | 'after' | null;
  result: Record<string, unknown>;
}

export interface StoredRoom {
  layoutId: string;
  dimensions: RoomDimensions;
  listener: RoomPoint;
  loudspeakers: ReadonlyArray<{ id: string; x: number; y: number; z: number }>;
  limits: PlanInput['limits'] | null;
  sampleRateHz: number;
  /** The room's processor profile: its ranges narrow the limits the plan works within. */
  profile?: ProcessorProfileSettings | null;
}

/**
 * The limits a plan works within: the room's, narrowed by its processor profile's ranges (delay, trim,
 * band count, largest boost and cut). A profile without peaking filters allows no EQ bands.
 */
export function effectiveLimits(room: StoredRoom): PlanInput['limits'] | undefined {
  const base = room.limits ?? undefined;
  const p = room.profile;
  if (!p) return base;
  const lower = (a: number | undefined, b: number) => (a === undefined ? b : Math.min(a, b));
  const higher = (a: number | undefined, b: number) => (a === undefined ? b : Math.max(a, b));
  const delayMaxMs = p.delay.unit === 'ms' ? p.delay.max : (p.delay.max / room.sampleRateHz) * 1000;
  return {
    ...base,
    delayMaxMs: lower(base?.delayMaxMs, delayMaxMs),
    trimMinDb: higher(base?.trimMinDb, p.trimDb.min),
    trimMaxDb: lower(base?.trimMaxDb, p.trimDb.max),
    eqBandsPerChannel: lower(
      base?.eqBandsPerChannel,
      p.eq.filterTypes.includes('peaking') ? p.eq.bandsPerChannel : 0,
    ),
    eqMaxBoostDb: lower(base?.eqMaxBoostDb, Math.max(0, p.eq.gainDb.max)),
    eqMaxCutDb: lower(base?.eqMaxCutDb, Math.max(0, -p.eq.gainDb.min)),
  };
}

/** What a request may change; everything else comes from the stored room and its measurements. */
export interface StoredPlanOverrides {
  targets?: PlanInput['targets'];
  temperatureC?: number;
  sampleRateHz?: number;
  /** Channels handed to the subwoofer; default every channel but the LFE ones when the room has an LFE channel. */
  bassManaged?: string[];
  measurements?: {
    /** Use only these measurements (an "after" measurement is used only when listed here). */
    include?: string[];
    exclude?: string[];
    /** Position whose arrivals and SPL readings count; default the position with the most of them. */
    micPosition?: string;
    /** Where delays come from; `auto`: measured arrivals when every channel has one, else geometry. */
    delaysFrom?: 'auto' | 'measuredArrival' | 'geometry';
  };
}

export interface ChannelSources {
  delay: {
    source: 'measuredArrival' | 'geometry';
    measurementIds: string[];
    micPosition: string | null;
    /** True when the arrival is relative to the measurement's timing reference (loopback). */
    timingReference: boolean | null;
  };
  level: {
    source: 'splReading' | 'none';
    measurementIds: string[];
    micPosition: string | null;
    weighting: string | null;
  };
  response: {
    source: 'responseAverage' | 'none';
    measurementIds: string[];
    micPositions: string[];
    kind: 'frequencyResponse' | 'impulseResponse' | null;
  };
}

export type SubwooferSetting = { delayMs: number; delaySamples: number; polarity: 'normal' | 'inverted' };

export type IntegrationReport =
  | ({
      source: 'measuredResponses';
      measurementIds: string[];
      micPosition: string;
      mains: string[];
      /**
       * Gain that matched the subwoofer's response to the mains' before summing, dB: each path is set to the
       * same level over its own pass band (subwoofer fc/4..fc/2, mains 2·fc..8·fc), as the level calibration
       * intends, whatever gain the captures were made at. The summed responses are relative to that level.
       */
      subGainDb: number;
      searchedUpToMs: number;
      geometric: SubwooferSetting;
    } & SubwooferIntegration)
  | { source: 'geometry'; measurementIds: []; reason: string };

export interface StoredRoomPlan extends Omit<RoomPlan, 'channels' | 'subwoofer'> {
  channels: Array<PlanChannel & { sources: ChannelSources }>;
  subwoofer: (PlanSubwoofer & { integration: IntegrationReport }) | null;
  measurements: {
    referencePosition: string | null;
    used: string[];
    ignored: Array<{ id: string; reason: string }>;
  };
}

const LFE_LABEL = /^LFE\d*$/;
/**
 * Subwoofer delays are searched up to the room's delay limit, but never beyond this, ms: ten periods of a
 * 100 Hz crossover, far past any sensible subwoofer delay, and it bounds the work [product choice].
 */
const MAX_SUB_SEARCH_MS = 100;
/** The sum is scored over at most this many bass-managed channels (the first measured ones) [product choice]. */
const MAX_INTEGRATION_MAINS = 16;

interface Arrival {
  ms: number;
  id: string;
  referenced: boolean;
}

const arrivalOf = (m: StoredMeasurement): Arrival | null => {
  const r = m.result as {
    arrival?: { arrivalMs?: number };
    timingReference?: { arrivalMs?: number };
  };
  if (typeof r.arrival?.arrivalMs !== 'number') return null;
  const reference = r.timingReference?.arrivalMs;
  return typeof reference === 'number'
    ? { ms: r.arrival.arrivalMs - reference, id: m.id, referenced: true }
    : { ms: r.arrival.arrivalMs, id: m.id, referenced: false };
};

type Magnitude = { frequenciesHz: number[]; magnitudeDb: number[] };
/** The magnitude response a measurement carries, if any (an analysis's smoothed response, or the response). */
export const magnitudeOf = (m: StoredMeasurement): Magnitude | null => {
  const r = (
    m.kind === 'impulseResponse' ? (m.result as { frequencyResponse?: unknown }).frequencyResponse : m.result
  ) as Partial<Magnitude> | undefined;
  return m.kind !== 'spl' && Array.isArray(r?.frequenciesHz) && Array.isArray(r?.magnitudeDb)
    ? { frequenciesHz: r.frequenciesHz, magnitudeDb: r.magnitudeDb }
    : null;
};

/**
 * The complex response a measurement carries, timed against its capture: a frequency response's own
 * phase, or an impulse-response analysis's phase (stored relative to its arrival) with the arrival put
 * back, −360·f·(arrival − timing reference).
 */
const complexOf = (m: StoredMeasurement): ComplexResponse | null => {
  if (m.kind === 'frequencyResponse') {
    const r = m.result as { frequenciesHz?: number[]; magnitudeDb?: number[]; phaseDeg?: number[] };
    return Array.isArray(r.phaseDeg) && r.frequenciesHz && r.magnitudeDb
      ? { frequenciesHz: r.frequenciesHz, magnitudeDb: r.magnitudeDb, phaseDeg: r.phaseDeg }
      : null;
  }
  if (m.kind !== 'impulseResponse') return null;
  const r = m.result as {
    arrival?: { arrivalMs?: number };
    timingReference?: { arrivalMs?: number };
    frequencyResponse?: { frequenciesHz?: number[]; magnitudeDb?: number[]; phaseDeg?: number[] };
  };
  const fr = r.frequencyResponse;
  if (typeof r.arrival?.arrivalMs !== 'number' || !fr?.frequenciesHz || !fr.magnitudeDb || !fr.phaseDeg)
    return null;
  const delayS = (r.arrival.arrivalMs - (r.timingReference?.arrivalMs ?? 0)) / 1000;
  const phaseDeg = fr.phaseDeg;
  return {
    frequenciesHz: fr.frequenciesHz,
    magnitudeDb: fr.magnitudeDb,
    phaseDeg: fr.frequenciesHz.map((f, i) => phaseDeg[i] - 360 * f * delayS),
  };
};

/** The newest of a list (ids are time-sortable): a re-measurement replaces the one before it. */
const newest = <T extends { id: string }>(list: T[]): T | undefined =>
  list.reduce<T | undefined>((best, m) => (best === undefined || m.id > best.id ? m : best), undefined);

/**
 * Plans a stored room from what is stored: geometry, limits and sample rate of the room; per channel the
 * measured arrival (impulse-response analyses, relative to the timing reference where the measurement
 * has one), the SPL reading and the spatial (power) average of its responses over the microphone
 * positions. One plan engine: the inputs are assembled here and planned by planRoom. When the
 * subwoofer's and bass-managed channels' complex responses (with phase) were measured at the reference
 * position, the subwoofer's delay and polarity come from integrateSubwoofer instead of geometry.
 * Every channel says where each number came from and which measurements fed it.
 * "after" measurements (taken with a tuning loaded) never feed a plan unless listed in `include`.
 * @throws CalculationInputError naming the override (`/measurements/delaysFrom`) or the plan field.
 */
export function planStoredRoom(
  room: StoredRoom,
  stored: readonly StoredMeasurement[],
  overrides: StoredPlanOverrides = {},
): StoredRoomPlan {
  const labels = new Set(room.loudspeakers.map((s) => s.id));
  const choice = overrides.measurements ?? {};
  const include = choice.include ? new Set(choice.include) : null;
  const exclude = new Set(choice.exclude ?? []);
  const known = new Set(stored.map((m) => m.id));
  (choice.include ?? []).forEach((id, i) => {
    if (!known.has(id))
      throw new CalculationInputError(`no measurement ${id} in this room`, `/measurements/include/${i}`);
  });
  const ignored: Array<{ id: string; reason: string }> = [];
  const usable = stored.filter((m) => {
    const reason =
      include && !include.has(m.id)
        ? 'not in measurements.include'
        : exclude.has(m.id)
          ? 'in measurements.exclude'
          : !include && m.stage === 'after'
            ? 'taken after a tuning was loaded (verification data)'
            : !labels.has(m.channel)
              ? `channel ${m.channel} is no longer a loudspeaker of the room`
              : null;
    if (reason) ignored.push({ id: m.id, reason });
    return reason === null;
  });

  // The reference position: where arrivals and SPL readings are taken.
  const pointCounts = new Map<string, number>();
  for (const m of usable) {
    if (m.kind === 'spl' || (m.kind === 'impulseResponse' && arrivalOf(m))) {
      pointCounts.set(m.micPosition, (pointCounts.get(m.micPosition) ?? 0) + 1);
    }
  }
  const referencePosition =
    choice.micPosition ??
    [...pointCounts.entries()].reduce<[string, number] | null>(
      (best, e) => (best === null || e[1] > best[1] ? e : best),
      null,
    )?.[0] ??
    null;

  const warnings: CalculationWarning[] = [];
  const used = new Set<string>();
  const channelIds = room.loudspeakers.map((s) => s.id);
  const at = (channel: string, kind: StoredMeasurement['kind']) =>
    usable.filter((m) => m.channel === channel && m.kind === kind && m.micPosition === referencePosition);

  // Arrivals: all measured, and all with or all without a timing reference, or none are used.
  const arrivals = new Map<string, Arrival>();
  for (const id of channelIds) {
    const a = newest(at(id, 'impulseResponse').filter((m) => arrivalOf(m) !== null));
    if (a) arrivals.set(id, arrivalOf(a) as Arrival);
  }
  const delaysFrom = choice.delaysFrom ?? 'auto';
  const missing = channelIds.filter((id) => !arrivals.has(id));
  const referenced = new Set([...arrivals.values()].map((a) => a.referenced));
  let useArrivals = delaysFrom !== 'geometry' && missing.length === 0 && referenced.size === 1;
  if (delaysFrom === 'measuredArrival' && !useArrivals) {
    throw new CalculationInputError(
      missing.length > 0
        ? `no impulse-response arrival at position ${referencePosition ?? '(none)'} for ${missing.join(', ')}`
        : 'some arrivals are relative to a timing reference and some are not; they cannot be compared',
      '/measurements/delaysFrom',
    );
  }
  if (delaysFrom === 'auto' && arrivals.size > 0 && !useArrivals) {
    warnings.push({
      code: 'arrivalsNotUsed',
      message:
        missing.length > 0
          ? `Delays come from the loudspeaker positions: ${missing.join(', ')} ha${missing.length === 1 ? 's' : 've'} no measured arrival at position ${referencePosition}, and arrivals of different captures are only comparable all together.`
          : 'Delays come from the loudspeaker positions: some arrivals are relative to a timing reference and some are not.',
    });
    useArrivals = false;
  }
  if (useArrivals && referenced.has(false)) {
    warnings.push({
      code: 'noTimingReference',
      message:
        'Measured arrivals have no timing reference (loopback); they are compared as they are, which is right only if every capture had the same latency.',
    });
  }

  // SPL readings at the reference position.
  const readings = new Map<string, StoredMeasurement>();
  for (const id of channelIds) {
    const r = newest(at(id, 'spl'));
    if (r) readings.set(id, r);
  }
  const weightings = new Set([...readings.values()].map((r) => String(r.result.weighting)));
  if (weightings.size > 1) {
    warnings.push({
      code: 'mixedWeightings',
      message: `SPL readings use different frequency weightings (${[...weightings].join(', ')}); read every channel the same way (C-weighted is the calibration habit).`,
    });
  }

  // Responses: the spatial average over every position, newest per position, one kind per channel.
  const limits = effectiveLimits(room);
  const eqBands = limits?.eqBandsPerChannel;
  const responses = new Map<string, { sources: StoredMeasurement[]; averaged: Magnitude }>();
  for (const id of channelIds) {
    const byKind = (kind: 'frequencyResponse' | 'impulseResponse') => {
      const list = usable.filter((m) => m.channel === id && m.kind === kind && magnitudeOf(m) !== null);
      const positions = [...new Set(list.map((m) => m.micPosition))];
      return positions.map((p) => newest(list.filter((m) => m.micPosition === p)) as StoredMeasurement);
    };
    const fr = byKind('frequencyResponse');
    const ir = byKind('impulseResponse');
    const chosen = fr.length >= ir.length ? fr : ir;
    if (chosen.length === 0) continue;
    if (fr.length > 0 && ir.length > 0) {
      warnings.push({
        code: 'mixedResponseKinds',
        channel: id,
        message: `${id} has frequency responses and impulse-response analyses; only the ${chosen === fr ? 'frequency responses' : 'impulse-response analyses'} are averaged (their levels are on different scales).`,
      });
    }
    const averaged = powerAverageResampled(chosen.map((m) => magnitudeOf(m) as Magnitude));
    responses.set(id, { sources: chosen, averaged });
  }
  if (responses.size > 0 && eqBands === undefined) {
    warnings.push({
      code: 'noEqBandLimit',
      message:
        "Responses were measured but the room's limits give no eqBandsPerChannel, so no EQ was fitted; set limits.eqBandsPerChannel on the room.",
    });
  }

  const hasLfe = channelIds.some((id) => LFE_LABEL.test(id));
  const managed = new Set(
    overrides.bassManaged ?? (hasLfe ? channelIds.filter((id) => !LFE_LABEL.test(id)) : []),
  );
  (overrides.bassManaged ?? []).forEach((id, i) => {
    if (!labels.has(id) || LFE_LABEL.test(id))
      throw new CalculationInputError(`${id} is not a main loudspeaker of the room`, `/bassManaged/${i}`);
  });

  const channels: PlanChannelInput[] = room.loudspeakers.map((s) => {
    const arrival = useArrivals ? arrivals.get(s.id) : undefined;
    const reading = readings.get(s.id);
    const response = eqBands !== undefined ? responses.get(s.id) : undefined;
    return {
      id: s.id,
      position: { x: s.x, y: s.y, z: s.z },
      ...(arrival && { arrivalMs: arrival.ms }),
      ...(reading && { measuredDb: reading.result.splDb as number }),
      ...(response && { measuredResponse: response.averaged }),
      bassManaged: managed.has(s.id),
    };
  });
  requireStoredPlanBudget(channels.filter((c) => c.measuredResponse !== undefined).map((c) => c.id));
  const input: PlanInput = {
    layout: room.layoutId,
    room: room.dimensions,
    listener: room.listener,
    channels,
    targets: overrides.targets,
    limits,
    temperatureC: overrides.temperatureC,
    sampleRateHz: overrides.sampleRateHz ?? room.sampleRateHz,
  };
  const plan = planRoom(input);

  const sourcesOf = (id: string): ChannelSources => {
    const arrival = useArrivals ? arrivals.get(id) : undefined;
    const reading = readings.get(id);
    const response = eqBands !== undefined ? responses.get(id) : undefined;
    for (const m of [arrival, reading, ...(response?.sources ?? [])]) if (m) used.add(m.id);
    return {
      delay: arrival
        ? {
            source: 'measuredArrival',
            measurementIds: [arrival.id],
            micPosition: referencePosition,
            timingReference: arrival.referenced,
          }
        : { source: 'geometry', measurementIds: [], micPosition: null, timingReference: null },
      level: reading
        ? {
            source: 'splReading',
            measurementIds: [reading.id],
            micPosition: reading.micPosition,
            weighting: String(reading.result.weighting),
          }
        : { source: 'none', measurementIds: [], micPosition: null, weighting: null },
      response: response
        ? {
            source: 'responseAverage',
            measurementIds: response.sources.map((m) => m.id),
            micPositions: response.sources.map((m) => m.micPosition),
            kind: response.sources[0].kind as 'frequencyResponse' | 'impulseResponse',
          }
        : { source: 'none', measurementIds: [], micPositions: [], kind: null },
    };
  };
  const planned = plan.channels.map((c) => ({ ...c, sources: sourcesOf(c.id) }));

  let subwoofer: StoredRoomPlan['subwoofer'] = null;
  if (plan.subwoofer) {
    const integration = integrationFrom(plan, room, usable, referencePosition);
    for (const id of integration.measurementIds) used.add(id);
    subwoofer =
      integration.source === 'measuredResponses'
        ? {
            ...plan.subwoofer,
            suggestedDelayMs: integration.chosen.delayMs,
            suggestedDelaySamples: integration.chosen.delaySamples,
            suggestedPolarity: integration.chosen.polarity,
            integration,
          }
        : { ...plan.subwoofer, integration };
  }
  for (const m of usable)
    if (!used.has(m.id)) ignored.push({ id: m.id, reason: unusedReason(m, referencePosition) });
  return {
    ...plan,
    warnings: [...warnings, ...plan.warnings],
    channels: planned,
    subwoofer,
    measurements: { referencePosition, used: [...used].sort(), ignored },
  };
}

function unusedReason(m: StoredMeasurement, referencePosition: string | null): string {
  if (m.kind !== 'frequencyResponse' && m.micPosition !== referencePosition)
    return `arrivals and SPL readings are taken at position ${referencePosition}`;
  return 'superseded by a newer measurement of the same kind at the same position, or not needed';
}

function integrationFrom(
  plan: RoomPlan,
  room: StoredRoom,
  usable: readonly StoredMeasurement[],
  position: string | null,
): IntegrationReport {
  const sub = plan.subwoofer as PlanSubwoofer;
  const geometric = (reason: string): IntegrationReport => ({
    source: 'geometry',
    measurementIds: [],
    reason,
  });
  const managed = plan.channels.filter((c) => c.role === 'managed' && c.highPass);
  if (!sub.channel || managed.length === 0) {
    return geometric('Nothing is bass-managed, so there is no crossover to integrate the subwoofer at.');
  }
  // One timing basis: the subwoofer's kind of capture (frequency responses, or impulse responses with or
  // without a loopback reference) decides which mains can be summed with it.
  const basis = (m: StoredMeasurement) =>
    m.kind === 'impulseResponse'
      ? `ir:${(m.result as { timingReference?: unknown }).timingReference ? 'ref' : 'none'}`
      : m.kind;
  const complexAt = (channel: string, wanted?: string) => {
    const m = newest(
      usable.filter(
        (x) =>
          x.channel === channel &&
          x.micPosition === position &&
          (wanted === undefined || basis(x) === wanted) &&
          complexOf(x) !== null,
      ),
    );
    return m ? { id: m.id, basis: basis(m), response: complexOf(m) as ComplexResponse } : null;
  };
  const subResponse = complexAt(sub.channel);
  const mains = subResponse
    ? managed
        .flatMap((c) => {
          const r = complexAt(c.id, subResponse.basis);
          return r ? [{ channel: c, ...r }] : [];
        })
        .slice(0, MAX_INTEGRATION_MAINS)
    : [];
  if (!subResponse || mains.length === 0) {
    return geometric(
      `No responses with phase (frequency responses with phaseDeg, or impulse responses) of ${!subResponse ? `the subwoofer (${sub.channel})` : 'a bass-managed channel captured the same way as the subwoofer'} at position ${position ?? '(none)'}; the delay and polarity are the geometric suggestion (phase of the crossover filters at ${sub.lowPass.frequencyHz} Hz after distance alignment). Measure both with the same timing reference to integrate from responses.`,
    );
  }
  const fs = plan.sampleRateHz;
  const fc = sub.lowPass.frequencyHz;
  // Level match as the calibration intends: each path at 0 dB over its own pass band (the subwoofer from
  // fc/4 to fc/2, a main from 2·fc to 8·fc), whatever gain the captures were made at.
  const mainsBand = { fromHz: 2 * fc, toHz: Math.min(8 * fc, 0.45 * fs) };
  const subBand = { fromHz: fc / 4, toHz: fc / 2 };
  const subLevel = bandLevelDb(subResponse.response, subBand);
  const mainLevels = mains.map((m) => bandLevelDb(m.response, mainsBand));
  if (subLevel === null || mainLevels.some((x) => x === null)) {
    return geometric(
      `The responses with phase do not cover the pass bands the levels are matched over (subwoofer ${subBand.fromHz}–${subBand.toHz} Hz, mains ${mainsBand.fromHz}–${mainsBand.toHz} Hz); the delay and polarity are the geometric suggestion.`,
    );
  }
  const meanMainsDb = (mainLevels as number[]).reduce((a, b) => a + b, 0) / mainLevels.length;
  const subGainDb = meanMainsDb - subLevel;
  const searchedUpToMs = Math.min(effectiveLimits(room)?.delayMaxMs ?? MAX_SUB_SEARCH_MS, MAX_SUB_SEARCH_MS);
  try {
    const result = integrateSubwoofer({
      sub: { response: subResponse.response, gainDb: subGainDb - meanMainsDb },
      mains: mains.map((m, k) => ({
        id: m.channel.id,
        response: m.response,
        delayMs: (m.channel.delaySamples / fs) * 1000,
        gainDb: -(mainLevels[k] as number),
        polarity: m.channel.polarity,
      })),
      lowPass: sub.lowPass.sections,
      highPass: managed[0].highPass?.sections ?? [],
      crossoverHz: sub.lowPass.frequencyHz,
      sampleRateHz: fs,
      delayMaxMs: searchedUpToMs,
    });
    return {
      source: 'measuredResponses',
      measurementIds: [subResponse.id, ...mains.map((m) => m.id)],
      micPosition: position as string,
      mains: mains.map((m) => m.channel.id),
      subGainDb,
      searchedUpToMs,
      geometric: {
        delayMs: sub.suggestedDelayMs,
        delaySamples: sub.suggestedDelaySamples,
        polarity: sub.suggestedPolarity,
      },
      ...result,
    };
  } catch (error) {
    if (!(error instanceof CalculationInputError)) throw error;
    return geometric(
      `The measured responses could not be used (${error.message}); the delay and polarity are the geometric suggestion.`,
    );
  }
}

/** Mean level of a response over a band, dB (points inside it; null when it has fewer than two). */
function bandLevelDb(r: ComplexResponse, band: { fromHz: number; toHz: number }): number | null {
  const inBand = r.magnitudeDb.filter(
    (_, i) => r.frequenciesHz[i] >= band.fromHz && r.frequenciesHz[i] <= band.toHz,
  );
  return inBand.length < 2 ? null : inBand.reduce((a, b) => a + b, 0) / inBand.length;
}
