import { Router } from 'express';
import { checkRoomDefinition, type RoomDefinition } from '../../shared/geometry';
import { requirePermission } from '../auth/permissions';
import { newId } from '../db/ids';
import type { StoredLimits } from '../db/models/room';
import { validate } from '../http/validate';
import { callerId, findRoomFor, ownerScope, roomStillThere } from '../rooms/access';
import { pageById } from '../rooms/pagination';
import { roomDto } from '../rooms/room-dto';
import type { Services } from '../services';
import { roomReportRouter } from './room-report';

interface RoomInput extends RoomDefinition {
  name: string;
  limits?: StoredLimits;
  sampleRateHz?: number;
  notes?: string;
}

/** /v1/rooms: a caller's rooms (all rooms for admins). Every write goes through the write queue. */
export function roomsRouter(services: Services): Router {
  const { db } = services;
  const router = Router();
  const { Room, Tuning, TuningVersion, Measurement } = db.models;
  const tuning = requirePermission('tuning');

  router.get('/rooms', tuning, validate('listRooms'), async (req, res) => {
    const { limit, startingAfter } = req.valid.query as { limit: number; startingAfter?: string };
    const page = await pageById(Room, ownerScope(req), limit, startingAfter);
    res.json({ data: page.rows.map(roomDto), hasMore: page.hasMore });
  });

  router.post('/rooms', tuning, validate('createRoom'), async (req, res) => {
    const input = req.valid.body as RoomInput;
    const layout = checkRoomDefinition(input);
    const room = await db.write((transaction) =>
      Room.create(
        {
          id: newId('room'),
          ownerId: callerId(req),
          name: input.name,
          layoutId: layout.id,
          dimensions: input.dimensions,
          listener: input.listener,
          loudspeakers: [...input.loudspeakers],
          limits: input.limits ?? null,
          sampleRateHz: input.sampleRateHz ?? 48000,
          notes: input.notes ?? null,
        },
        { transaction },
      ),
    );
    res.status(201).location(`/v1/rooms/${room.id}`).json(roomDto(room));
  });

  router.get('/rooms/:roomId', tuning, validate('getRoom'), async (req, res) => {
    res.json(roomDto(await findRoomFor(req, db.models, String(req.valid.params.roomId))));
  });

  router.patch('/rooms/:roomId', tuning, validate('updateRoom'), async (req, res) => {
    const changes = req.valid.body as Partial<RoomInput>;
    const room = await findRoomFor(req, db.models, String(req.valid.params.roomId));
    const merged = {
      layout: changes.layout ?? room.layoutId,
      dimensions: changes.dimensions ?? room.dimensions,
      listener: changes.listener ?? room.listener,
      loudspeakers: changes.loudspeakers ?? room.loudspeakers,
    };
    const layout = checkRoomDefinition(merged);
    await db.write(async (transaction) => {
      await roomStillThere(db.models, room.id, transaction);
      await room.update(
        {
          ...(changes.name !== undefined && { name: changes.name }),
          ...(changes.limits !== undefined && { limits: changes.limits }),
          ...(changes.sampleRateHz !== undefined && { sampleRateHz: changes.sampleRateHz }),
          ...(changes.notes !== undefined && { notes: changes.notes }),
          layoutId: layout.id,
          dimensions: merged.dimensions,
          listener: merged.listener,
          loudspeakers: [...merged.loudspeakers],
        },
        { transaction },
      );
    });
    res.json(roomDto(room));
  });

  router.delete('/rooms/:roomId', tuning, validate('deleteRoom'), async (req, res) => {
    const room = await findRoomFor(req, db.models, String(req.valid.params.roomId));
    // A room takes its tunings, their versions and its measurements with it, in one transaction.
    await db.write(async (transaction) => {
      const tunings = await Tuning.findAll({ where: { roomId: room.id }, attributes: ['id'], transaction });
      const tuningIds = tunings.map((t) => t.id);
      if (tuningIds.length > 0) await TuningVersion.destroy({ where: { tuningId: tuningIds }, transaction });
      await Tuning.destroy({ where: { roomId: room.id }, transaction });
      await Measurement.destroy({ where: { roomId: room.id }, transaction });
      await room.destroy({ transaction });
    });
    res.status(204).end();
  });

  router.use(roomReportRouter(services));
  return router;
}
