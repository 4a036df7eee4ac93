import type { Request } from 'express';
import type { Transaction } from 'sequelize';
import { isAdmin } from '../auth/permissions';
import type { Models } from '../db/models';
import type { Room } from '../db/models/room';
import type { Tuning } from '../db/models/tuning';
import { notFound, ProblemError } from '../http/problem';

/**
 * Stored rooms and tunings are visible to their owner and to admins only. Anyone else gets the same
 * 404 as for an id that does not exist, so ids of other owners cannot be probed.
 */
export function ownerScope(req: Request): { ownerId?: string } {
  return isAdmin(req.principal) ? {} : { ownerId: callerId(req) };
}

/** The user the caller acts for; routes under /v1 are authenticated before they get here. */
export function callerId(req: Request): string {
  const userId = req.principal?.userId;
  if (!userId)
    throw new ProblemError({ status: 401, title: 'Unauthorized', detail: 'Credentials are required.' });
  return userId;
}

function visible(req: Request, ownerId: string): boolean {
  return isAdmin(req.principal) || ownerId === req.principal?.userId;
}

export async function findRoomFor(req: Request, models: Models, roomId: string): Promise<Room> {
  const room = await models.Room.findByPk(roomId);
  if (!room || !visible(req, room.ownerId)) throw notFound(`No room ${roomId}.`);
  return room;
}

export async function findTuningFor(req: Request, models: Models, tuningId: string): Promise<Tuning> {
  const tuning = await models.Tuning.findByPk(tuningId);
  if (!tuning || !visible(req, tuning.ownerId)) throw notFound(`No tuning ${tuningId}.`);
  return tuning;
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
  const room = await models.Room.findByPk(roomId, { transaction });
  if (!room) throw notFound(`No room ${roomId}.`);
  return room;
}
