import type { Transaction } from 'sequelize';
import type { Actor } from '../auth/actor';
import { isAdmin } from '../auth/permissions';
import type { Models } from '../db/models';
import type { Room } from '../db/models/room';
import type { Tuning } from '../db/models/tuning';
import { notFound } from '../http/problem';

/** A caller of the API; stored rooms, tunings and measurements are only ever reached by one. */
export type Caller = Extract<Actor, { kind: 'caller' }>;

/**
 * Stored rooms and tunings are visible to their owner and to admins only. Anyone else gets the same
 * 404 as for an id that does not exist, so ids of other owners cannot be probed.
 */
export function ownerScope(caller: Caller): { ownerId?: string } {
  return isAdmin(caller.principal) ? {} : { ownerId: caller.principal.userId };
}

const visible = (caller: Caller, ownerId: string): boolean =>
  isAdmin(caller.principal) || ownerId === caller.principal.userId;

export async function findRoomFor(
  caller: Caller,
  models: Models,
  roomId: string,
  transaction?: Transaction,
): Promise<Room> {
  const room = await models.Room.findByPk(roomId, { transaction });
  if (!room || !visible(caller, room.ownerId)) throw notFound(`No room ${roomId}.`);
  return room;
}

/**
 * The room read again inside a write transaction. A room found before the write may have been deleted
 * by a request that took the write queue first (or by another process); what is written for it must
 * then answer 404, never fail on the foreign key.
 */
export async function roomStillThere(
  models: Models,
  roomId: string,
  transaction: Transaction,
): Promise<Room> {
  // PostgreSQL: locked, so writes for one room (its edits, its tunings' versions and room-state
  // revisions) from any instance run one after another, as SQLite's single writer runs them.
  const room = await models.Room.findByPk(roomId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!room) throw notFound(`No room ${roomId}.`);
  return room;
}

export async function findTuningFor(caller: Caller, models: Models, tuningId: string): Promise<Tuning> {
  const tuning = await models.Tuning.findByPk(tuningId);
  if (!tuning || !visible(caller, tuning.ownerId)) throw notFound(`No tuning ${tuningId}.`);
  return tuning;
}
