import { authorAsSeenBy } from '../auth/disclosure';
import type { Principal } from '../auth/permissions';
import type { Transaction } from 'sequelize';
import { findLayout } from '../../shared/layouts';
import { checkTuningSettings, tuningCautions, type TuningSettings } from '../../shared/plan';
import { findLimitViolations } from '../../shared/plan/tuning-limits';
import { profileStepRounding } from '../../shared/processor/profile-steps';
import type { ProcessorProfileSettings } from '../../shared/processor/profile';
import type { Database } from '../db/database';
import { newId } from '../db/ids';
import type { Room } from '../db/models/room';
import type { Tuning } from '../db/models/tuning';
import type { TuningOrigin, TuningVersion } from '../db/models/tuning-version';
import type { Models } from '../db/models';
import { notFound, ProblemError } from '../http/problem';
import type { TuningPromise } from '../../shared/verification';
import { roomStillThere, type Caller } from '../rooms/room-access';
import { profileOfRoom, type Staleness } from '../rooms/room-state-store';

export interface VersionContent {
  name: string;
  notes: string | null;
  settings: TuningSettings;
  origin: TuningOrigin;
  restoredFromVersion?: number | null;
  /** What the plan promised; absent: an edit keeps the promise of the version it edits. */
  promise?: TuningPromise | null;
  /** The room state the settings were made from; absent: the room as it is now. */
  roomRevision?: number;
}

/**
 * Where a refused setting sits in the request: maps a pointer into the tuning settings
 * (`/channels/3/trimDb`) to one into the request (`/body/channels/3/trimDb`, `/path/version`).
 */
export type SettingPointer = (setting: string) => string;

/** Settings written as the body gave them (`channels`, `sampleRateHz`, `subwoofer` at the body's top level). */
export const inBody: SettingPointer = (setting) => `/body${setting}`;

/**
 * Refuses settings outside the room's limits or its processor profile with one 422 listing every
 * setting outside, each naming the request field, the setting and the limit. Nothing is clamped.
 * Every tuning write runs it inside its transaction, on the room as read there; a caller that stores
 * settings from somewhere else (a plan) passes where they came from in `pointer`.
 */
export async function requireWithinRoomLimits(
  models: Models,
  room: Room,
  settings: TuningSettings,
  pointer: SettingPointer,
  transaction?: Transaction,
): Promise<void> {
  const profile = await profileOfRoom(models, room, transaction);
  const violations = findLimitViolations(settings, room.limits, profile?.settings);
  if (violations.length === 0) return;
  throw new ProblemError({
    status: 422,
    title: "Outside the room's limits",
    type: 'limit-exceeded',
    detail:
      violations.length === 1
        ? `${violations[0].message}. Nothing was stored.`
        : `${violations.length} settings are outside the room's limits or its processor profile (first: ${violations[0].message}). Nothing was stored.`,
    errors: violations.map((v) => ({
      pointer: pointer(v.setting),
      message: v.message,
      setting: v.setting,
      limit: v.limit,
    })),
  });
}

function settingsOf(version: TuningVersion): TuningSettings {
  return { sampleRateHz: version.sampleRateHz, channels: version.channels, subwoofer: version.subwoofer };
}

export { settingsOf };

/**
 * The API shape of a tuning at one of its versions; `stale` from stalenessOf; `profile` the room's
 * processor profile, whose steps `profileSteps` holds the settings to (what its export will round).
 */
export function tuningDto(
  tuning: Tuning,
  version: TuningVersion,
  room: Room | null,
  stale: Staleness | null,
  profile: ProcessorProfileSettings | null,
) {
  const settings = settingsOf(version);
  return {
    id: tuning.id,
    roomId: tuning.roomId,
    ownerId: tuning.ownerId,
    name: version.name,
    notes: version.notes,
    version: version.version,
    latestVersion: tuning.currentVersion,
    origin: version.origin,
    duplicatedFromId: tuning.duplicatedFromId,
    sampleRateHz: version.sampleRateHz,
    channels: version.channels,
    subwoofer: version.subwoofer,
    createdAt: tuning.createdAt.toISOString(),
    updatedAt: tuning.updatedAt.toISOString(),
    versionCreatedAt: version.createdAt.toISOString(),
    stale,
    profileSteps: profile ? profileStepRounding(settings, profile) : [],
    cautions: tuningCautions(settings, {
      layout: room ? findLayout(room.layoutId) : undefined,
      limits: room?.limits,
    }),
  };
}

/** The API shape of one stored version; who made it only for the author and admins. */
export function versionDto(version: TuningVersion, caller: Principal | undefined) {
  return {
    tuningId: version.tuningId,
    version: version.version,
    name: version.name,
    notes: version.notes,
    origin: version.origin,
    restoredFromVersion: version.restoredFromVersion,
    sampleRateHz: version.sampleRateHz,
    channels: version.channels,
    subwoofer: version.subwoofer,
    createdAt: version.createdAt.toISOString(),
    signOff: version.signOff ?? null,
    createdBy: authorAsSeenBy(caller, { userId: version.createdByUserId, keyId: version.createdByKeyId }),
  };
}

async function insertVersion(
  models: Models,
  caller: Caller,
  tuningId: string,
  number: number,
  content: VersionContent,
  room: Room,
  transaction: Transaction,
): Promise<TuningVersion> {
  return models.TuningVersion.create(
    {
      id: newId('tver'),
      tuningId,
      version: number,
      name: content.name,
      notes: content.notes,
      sampleRateHz: content.settings.sampleRateHz,
      channels: content.settings.channels,
      subwoofer: content.settings.subwoofer,
      origin: content.origin,
      restoredFromVersion: content.restoredFromVersion ?? null,
      promise: content.promise ?? null,
      roomRevision: content.roomRevision ?? room.stateRevision,
      createdByUserId: caller.principal.userId,
      createdByKeyId: caller.principal.keyId ?? null,
    },
    { transaction },
  );
}

/**
 * Stores a new tuning with its first version, after checking the settings (422 naming the field) and
 * holding them to the room's limits and processor profile (requireWithinRoomLimits; `pointer` says where
 * a refused setting sits in the request).
 */
export async function createTuning(
  db: Database,
  caller: Caller,
  room: Room,
  content: VersionContent,
  pointer: SettingPointer,
  duplicatedFromId: string | null = null,
): Promise<{ tuning: Tuning; version: TuningVersion }> {
  checkTuningSettings(content.settings);
  return db.write(async (transaction) => {
    const current = await roomStillThere(db.models, room.id, transaction);
    await requireWithinRoomLimits(db.models, current, content.settings, pointer, transaction);
    const tuning = await db.models.Tuning.create(
      {
        id: newId('tun'),
        roomId: room.id,
        ownerId: room.ownerId,
        name: content.name,
        currentVersion: 1,
        duplicatedFromId,
      },
      { transaction },
    );
    const version = await insertVersion(db.models, caller, tuning.id, 1, content, current, transaction);
    return { tuning, version };
  });
}

/**
 * Adds the next version of a tuning. `build` receives the current version as read inside the write
 * transaction with the tuning row locked, so two edits at once get versions n+1 and n+2, never the
 * same number, on either engine and from any number of instances (the unique index on tuningId and
 * version is the backstop).
 */
export async function addVersion(
  db: Database,
  caller: Caller,
  tuningId: string,
  build: (current: TuningVersion) => VersionContent,
  pointer: (content: VersionContent) => SettingPointer,
): Promise<{ tuning: Tuning; version: TuningVersion }> {
  return db.write(async (transaction) => {
    const found = await db.models.Tuning.findByPk(tuningId, { transaction });
    if (!found) throw notFound(`No tuning ${tuningId}.`);
    // PostgreSQL: the room is locked before the tuning, the order a room's deletion takes them, so an
    // edit racing a deletion waits for it (and answers 404) instead of deadlocking with it. The tuning's
    // row lock then makes a concurrent edit (from any instance) wait and read the number this one wrote.
    // SQLite ignores both: its write transactions already run one at a time.
    const room = await roomStillThere(db.models, found.roomId, transaction);
    const tuning = await db.models.Tuning.findByPk(tuningId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!tuning) throw notFound(`No tuning ${tuningId}.`);
    const current = await findVersion(db.models, tuning, tuning.currentVersion, transaction);
    const built = build(current);
    const content = { ...built, promise: built.promise !== undefined ? built.promise : current.promise };
    checkTuningSettings(content.settings);
    await requireWithinRoomLimits(db.models, room, content.settings, pointer(content), transaction);
    const version = await insertVersion(
      db.models,
      caller,
      tuning.id,
      tuning.currentVersion + 1,
      content,
      room,
      transaction,
    );
    await tuning.update({ currentVersion: version.version, name: content.name }, { transaction });
    return { tuning, version };
  });
}

export async function findVersion(
  models: Models,
  tuning: Tuning,
  number: number | undefined,
  transaction?: Transaction,
): Promise<TuningVersion> {
  const wanted = number ?? tuning.currentVersion;
  const version = await models.TuningVersion.findOne({
    where: { tuningId: tuning.id, version: wanted },
    transaction,
  });
  if (!version) throw notFound(`Tuning ${tuning.id} has no version ${wanted}.`);
  return version;
}
