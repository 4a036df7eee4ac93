import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { roomReportRouter } from './report.router';
import { RoomsService } from './rooms.service';

/** /v1/rooms: a caller's rooms (all rooms for admins). */
export function roomsRouter(services: Services): Router {
  const rooms = new RoomsService(services.db);
  const router = Router();
  const tuning = requirePermission('tuning');

  router.get(
    '/rooms',
    tuning,
    validate('listRooms', async ({ query }, req, res) => {
      res.json(await rooms.list(callerOf(req), query));
    }),
  );

  router.post(
    '/rooms',
    tuning,
    validate('createRoom', async ({ body }, req, res) => {
      const room = await rooms.create(callerOf(req), body);
      res.status(201).location(`/v1/rooms/${room.id}`).json(room);
    }),
  );

  router.get(
    '/rooms/:roomId',
    tuning,
    validate('getRoom', async ({ params }, req, res) => {
      res.json(await rooms.get(callerOf(req), params.roomId));
    }),
  );

  router.patch(
    '/rooms/:roomId',
    tuning,
    validate('updateRoom', async ({ params, body }, req, res) => {
      res.json(await rooms.update(callerOf(req), params.roomId, body));
    }),
  );

  router.delete(
    '/rooms/:roomId',
    tuning,
    validate('deleteRoom', async ({ params }, req, res) => {
      await rooms.delete(callerOf(req), params.roomId);
      res.status(204).end();
    }),
  );

  router.use(roomReportRouter(services));
  return router;
}
