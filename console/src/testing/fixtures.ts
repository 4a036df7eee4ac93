import type { ProcessorProfile, Room } from '../app/rooms/room.model';
import type { Tuning, TuningChannel, TuningVersion } from '../app/tunings/tuning.model';
import type {
  ImpulseResponseAnalysis,
  Measurement,
  StoredTargetCurve,
} from '../app/rooms/room-measurements/measurement.model';
import { analyzeImpulseResponse } from '../../../shared/analysis/analyze-impulse-response';
import { noisyDecay } from '../../../shared/analysis/test-signals';
import { STAGE3_PROFILE, STAGE3_ROOM } from '../../../seeds/demo-stage3-room';
import { roomGeometry } from '../../../shared/geometry';
import { findLayout } from '../../../shared/layouts';

/**
 * Answers of the API for the console's specs, built from the invented demo room (seeds/) and typed
 * with the contract's generated types, so a body that drifts from openapi/ fails the type check.
 */

export const ROOM_ID = 'room_stage3';
export const PROFILE_ID = 'prof_generic8';

/** The stored parts of a room, as a room is created. */
type RoomParts = Pick<
  Room,
  'id' | 'name' | 'layout' | 'dimensions' | 'listener' | 'loudspeakers' | 'limits' | 'sampleRateHz'
>;

/** A room as `GET /v1/rooms/{roomId}` answers it: its layout's name and its geometry worked out as the API does (roomGeometry). */
export function answeredRoom(parts: RoomParts, overrides: Partial<Room> = {}): Room {
  const layout = findLayout(parts.layout);
  if (!layout) throw new Error(`no layout ${parts.layout}`);
  const geometry = roomGeometry({
    layout: layout.id,
    dimensions: parts.dimensions,
    listener: parts.listener,
    loudspeakers: parts.loudspeakers,
  });
  return {
    ownerId: 'usr_1',
    ...parts,
    layoutName: layout.name,
    notes: null,
    profileId: null,
    // As it reaches the console: JSON (the computed ranges are read-only tuples in TypeScript).
    geometry: JSON.parse(
      JSON.stringify({
        angleToleranceDeg: geometry.angleToleranceDeg,
        speakers: geometry.speakers,
        warnings: geometry.warnings,
      }),
    ) as Room['geometry'],
    createdAt: '2026-03-02T09:00:00.000Z',
    updatedAt: '2026-03-02T09:00:00.000Z',
    ...overrides,
  };
}

/** Stage 3 as `GET /v1/rooms/{roomId}` answers it. */
export function demoRoom(overrides: Partial<Room> = {}): Room {
  return answeredRoom(
    {
      id: ROOM_ID,
      name: STAGE3_ROOM.name,
      layout: STAGE3_ROOM.layout,
      dimensions: STAGE3_ROOM.dimensions,
      listener: STAGE3_ROOM.listener,
      loudspeakers: STAGE3_ROOM.loudspeakers,
      limits: STAGE3_ROOM.limits,
      sampleRateHz: STAGE3_ROOM.sampleRateHz,
    },
    overrides,
  );
}

/** The demo processor profile as `GET /v1/processor-profiles/{profileId}` answers it. */
export function demoProfile(overrides: Partial<ProcessorProfile> = {}): ProcessorProfile {
  return {
    id: PROFILE_ID,
    ownerId: 'usr_1',
    ...STAGE3_PROFILE,
    createdAt: '2026-03-01T09:00:00.000Z',
    updatedAt: '2026-03-01T09:00:00.000Z',
    ...overrides,
  };
}

/** Four channels of Stage 3: the fronts bass-managed to LFE1 at 80 Hz, one cut on the centre. */
export function demoChannels(): TuningChannel[] {
  const highPass = { family: 'linkwitzRiley' as const, order: 4, frequencyHz: 80 };
  return [
    { id: 'M+030', delayMs: 1.5625, trimDb: -0.6, polarity: 'normal', bassManaged: true, highPass, eq: [] },
    { id: 'M-030', delayMs: 1.5, trimDb: -0.9, polarity: 'normal', bassManaged: true, highPass, eq: [] },
    {
      id: 'M+000',
      delayMs: 1.6875,
      trimDb: -1.8,
      polarity: 'normal',
      bassManaged: true,
      highPass,
      eq: [{ type: 'peaking', frequencyHz: 125, gainDb: -4.5, q: 4 }],
    },
    { id: 'LFE1', delayMs: 0, trimDb: 0, polarity: 'inverted', bassManaged: false, highPass: null, eq: [] },
  ];
}

/** A stored tuning of Stage 3 at `version` of `latestVersion`, as `GET /v1/tunings/{tuningId}` answers it. */
export function demoTuning(overrides: Partial<Tuning> = {}): Tuning {
  return {
    id: 'tun_bm80',
    roomId: ROOM_ID,
    ownerId: 'usr_1',
    name: 'Bass-managed 80 Hz',
    notes: null,
    origin: 'edit',
    duplicatedFromId: null,
    version: 3,
    latestVersion: 3,
    sampleRateHz: 48000,
    channels: demoChannels(),
    subwoofer: {
      channel: 'LFE1',
      lfeGainDb: 10,
      lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
    },
    cautions: [],
    profileSteps: [],
    stale: null,
    createdAt: '2026-03-02T10:00:00.000Z',
    updatedAt: '2026-03-03T11:30:00.000Z',
    versionCreatedAt: '2026-03-03T11:30:00.000Z',
    ...overrides,
  };
}

/** One entry of `GET /v1/tunings/{tuningId}/versions`. */
export function demoVersion(version: number, overrides: Partial<TuningVersion> = {}): TuningVersion {
  const tuning = demoTuning();
  return {
    tuningId: tuning.id,
    version,
    name: tuning.name,
    notes: null,
    origin: version === 1 ? 'plan' : 'edit',
    restoredFromVersion: null,
    createdAt: `2026-03-0${version}T11:30:00.000Z`,
    createdBy: { userId: 'usr_1', keyId: null },
    sampleRateHz: tuning.sampleRateHz,
    channels: tuning.channels,
    subwoofer: tuning.subwoofer,
    ...overrides,
  };
}

/**
 * A synthetic impulse response of Stage 3's left side surround (2.80 m away, invented T60 0.30 s, noise
 * at −75 dB), analysed as the API does (the shared analysis, with the room's dimensions for its modes).
 */
export function demoImpulseResponse(): ImpulseResponseAnalysis {
  const fs = 48000;
  const arrival = Math.round((2.8 / 343.2) * fs);
  const samples = noisyDecay({
    sampleRateHz: fs,
    durationS: 1,
    t60S: 0.3,
    startSample: arrival,
    startRms: 0.05,
    noiseDb: -75,
    seed: 3,
  });
  samples[arrival] += 0.7;
  // As it reaches the console: JSON.
  return JSON.parse(
    JSON.stringify(analyzeImpulseResponse(samples, fs, { room: STAGE3_ROOM.dimensions })),
  ) as ImpulseResponseAnalysis;
}

/**
 * A stored measurement of Stage 3 as `GET /v1/rooms/{roomId}/measurements` lists it (no `result`; give one
 * for the detail): taken before any tuning, at the main listening position, with an empty summary unless
 * `overrides` give the kind's numbers.
 */
export function demoMeasurement(
  overrides: Partial<Measurement> & Pick<Measurement, 'id' | 'kind'>,
): Measurement {
  return {
    roomId: ROOM_ID,
    channel: 'M+030',
    micPosition: 'MLP',
    name: null,
    notes: null,
    source: overrides.kind === 'impulseResponse' ? { type: 'wav' } : { type: 'json' },
    summary: {},
    stage: 'before',
    tuningId: null,
    tuningVersion: null,
    createdAt: '2026-03-02T09:00:00.000Z',
    ...overrides,
  };
}

/** A stored target curve as `GET /v1/target-curves` lists it. */
export function demoTargetCurve(overrides: Partial<StoredTargetCurve> = {}): StoredTargetCurve {
  return {
    id: 'tc_warm',
    ownerId: 'usr_1',
    name: 'Warm small room',
    notes: null,
    points: [
      { frequencyHz: 20, gainDb: 3 },
      { frequencyHz: 200, gainDb: 0 },
      { frequencyHz: 20000, gainDb: -3 },
    ],
    createdAt: '2026-03-01T12:00:00.000Z',
    updatedAt: '2026-03-01T12:00:00.000Z',
    ...overrides,
  };
}

/** A list page as every list operation answers it. */
export function page<T>(data: T[], hasMore = false): { data: T[]; hasMore: boolean } {
  return { data, hasMore };
}
