import { authorAsSeenBy } from '../auth/disclosure';
import type { Principal } from '../auth/permissions';
import type { Transaction } from 'sequelize';
import { findLayout } from '../../shared/layouts';
import { checkTuningSettings, tuningCautions, type TuningSettings } from '../../shared/plan';
import type { Database } from '../db/database';
import { newId } from '../db/ids';
import type { Room } from '../db/models/room';
import type { Tuning } from '../db/models/tuning';
import type { TuningOrigin, TuningVersion } from '../db/models/tuning-version';
import type { Models } from '../db/models';
import { notFound } from '../http/problem';
import type { TuningPromise } from '../../shared/verification';
import { roomStillThere, type Caller } from '../rooms/room-access';

export interface VersionContent {
  name: string;
  notes: string | null;
  settings: TuningSettings;
  origin: TuningOrigin;
  restoredFromVersion?: number | null;
  /** What the plan promised; absent: an edit keeps the promise of the version it edits. */
  promise?: TuningPromise | null;
}

function settingsOf(version: TuningVersion): TuningSettings {
  return { sampleRateHz: version.sampleRateHz, channels: version.channels, subwoofer: version.subwoofer };
}

export { settingsOf };

/** The API shape of a tuning at one of its versions. */
export function tuningDto(tuning: Tuning, version: TuningVersion, room: Room | null) {
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
    cautions: tuningCautions(settings, room ? findLayout(room.layoutId) : undefined),
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
      createdByUserId: caller.principal.userId,
      createdByKeyId: caller.principal.keyId ?? null,
    },
    { transaction },
  );
}

/** Stores a new tuning with its first version, after checking the settings (422 naming the field). */
export async function createTuning(
  db: Database,
  caller: Caller,
  room: Room,
  content: VersionContent,
  duplicatedFromId: string | null = null,
): Promise<{ tuning: Tuning; version: TuningVersion }> {
  checkTuningSettings(content.settings);
  return db.write(async (transaction) => {
    await roomStillThere(db.models, room.id, transaction);
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
    const version = await insertVersion(db.models, caller, tuning.id, 1, content, transaction);
    return { tuning, version };
  });
}

/**
 * Adds the next version of a tuning. `build` receives the current version as read inside the write
 * transaction, so two edits at once get versions n+1 and n+2, never the same number.
 */
export async function addVersion(
  db: Database,
  caller: Caller,
  tuningId: string,
  build: (current: TuningVersion) => VersionContent,
): Promise<{ tuning: Tuning; version: TuningVersion }> {
  return db.write(async (transaction) => {
    const tuning = await db.models.Tuning.findByPk(tuningId, { transaction });
    if (!tuning) throw notFound(`No tuning ${tuningId}.`);
    const current = await findVersion(db.models, tuning, tuning.currentVersion, transaction);
    const built = build(current);
    const content = { ...built, promise: built.promise !== undefined ? built.promise : current.promise };
    checkTuningSettings(content.settings);
    const version = await insertVersion(
      db.models,
      caller,
      tuning.id,
      tuning.currentVersion + 1,
      content,
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
