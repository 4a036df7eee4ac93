import type { components } from '../../shared/contract/api-types';
import type { Transaction } from 'sequelize';
import { roomStateChanges, type RoomState } from '../../shared/plan/room-state';
import type { Models } from '../db/models';
import type { ProcessorProfileRow } from '../db/models/processor-profile';
import type { Room } from '../db/models/room';

/** What a tuning depends on in the room as it is stored now. */
export function roomStateOf(room: Room, profile: ProcessorProfileRow | null): RoomState {
  return {
    listener: { x: room.listener.x, y: room.listener.y, z: room.listener.z },
    loudspeakers: room.loudspeakers.map(({ id, x, y, z }) => ({ id, x, y, z })),
    limits: room.limits ?? null,
    sampleRateHz: room.sampleRateHz,
    profile: profile ? { id: profile.id, name: profile.name, settings: profile.settings } : null,
  };
}

export async function profileOfRoom(
  models: Models,
  room: Room,
  transaction?: Transaction,
): Promise<ProcessorProfileRow | null> {
  return room.profileId ? models.ProcessorProfile.findByPk(room.profileId, { transaction }) : null;
}

/**
 * Records the room's state after a write, inside that write's transaction: a new revision when what its
 * tunings depend on differs from the latest recorded one (the first write records revision 1). Tunings
 * keep the revision they were made from, so they can later say they are stale and since when.
 */
export async function recordRoomState(models: Models, room: Room, transaction: Transaction): Promise<void> {
  const state = roomStateOf(room, await profileOfRoom(models, room, transaction));
  const latest = await models.RoomState.findOne({
    where: { roomId: room.id },
    order: [['revision', 'DESC']],
    transaction,
  });
  if (latest && roomStateChanges(latest.state, state).length === 0) return;
  const revision = latest ? latest.revision + 1 : 1;
  await models.RoomState.create({ roomId: room.id, revision, state }, { transaction });
  if (room.stateRevision !== revision) await room.update({ stateRevision: revision }, { transaction });
}

/** Since when and why a tuning's settings no longer match its room (the contract's `TuningStale`). */
export type Staleness = components['schemas']['TuningStale'];

/**
 * Whether settings made from room state `revision` are stale now: null when the room's current state
 * is that revision or does not differ from it (a loudspeaker moved and moved back), else since when
 * (the first later revision) and what differs.
 */
export async function stalenessOf(models: Models, room: Room, revision: number): Promise<Staleness | null> {
  if (revision >= room.stateRevision) return null;
  const [made, next, now] = await Promise.all([
    models.RoomState.findOne({ where: { roomId: room.id, revision } }),
    models.RoomState.findOne({ where: { roomId: room.id, revision: revision + 1 } }),
    models.RoomState.findOne({ where: { roomId: room.id, revision: room.stateRevision } }),
  ]);
  if (!made || !next || !now) return null;
  const reasons = roomStateChanges(made.state, now.state);
  return reasons.length === 0 ? null : { since: next.createdAt.toISOString(), reasons };
}
