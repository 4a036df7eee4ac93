import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { RoomPlansService } from './room-plans.service';

/** POST /v1/rooms/{roomId}/plans: the whole-room plan from what is stored, optionally stored as a tuning. */
export function roomPlansRouter({ db }: Services): Router {
  const plans = new RoomPlansService(db);
  const router = Router();
  router.post(
    '/rooms/:roomId/plans',
    requirePermission('tuning'),
    validate('planStoredRoom', async ({ params, body }, req, res) => {
      const result = await plans.plan(callerOf(req), params.roomId, body);
      if (result.tuning) res.status(201).location(`/v1/tunings/${result.tuning.id}`);
      res.json(result);
    }),
  );
  return router;
}
