import type { ProcessorProfile, Room } from '../app/rooms/room.model';
import type { Tuning, TuningChannel, TuningVersion } from '../app/tunings/tuning.model';
import { STAGE3_PROFILE, STAGE3_ROOM } from '../../../seeds/demo-stage3-room';
import { roomGeometry } from '../../../shared/geometry';
import { findLayout } from '../../../shared/layouts';

/**
 * Answers of the API for the console's specs, built from the invented demo room (seeds/) and typed
 * with the contract's generated types, so a body that drifts from openapi/ fails the type check.
 */

export const ROOM_ID = 'room_stage3';
export const PROFILE_ID = 'prof_generic8';

/** Stage 3 as `GET /v1/rooms/{roomId}` answers it, its geometry worked out as the API does (roomGeometry). */
export function demoRoom(overrides: Partial<Room> = {}): Room {
  const layout = findLayout(STAGE3_ROOM.layout);
  if (!layout) throw new Error(`no layout ${STAGE3_ROOM.layout}`);
  const geometry = roomGeometry({
    layout: layout.id,
    dimensions: STAGE3_ROOM.dimensions,
    listener: STAGE3_ROOM.listener,
    loudspeakers: STAGE3_ROOM.loudspeakers,
  });
  return {
    id: ROOM_ID,
    ownerId: 'usr_1',
    name: STAGE3_ROOM.name,
    layout: layout.id,
    layoutName: layout.name,
    dimensions: STAGE3_ROOM.dimensions,
    listener: STAGE3_ROOM.listener,
    loudspeakers: STAGE3_ROOM.loudspeakers,
    limits: STAGE3_ROOM.limits,
    sampleRateHz: STAGE3_ROOM.sampleRateHz,
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

/** A list page as every list operation answers it. */
export function page<T>(data: T[], hasMore = false): { data: T[]; hasMore: boolean } {
  return { data, hasMore };
}
