import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { whenClientGone } from '../work/heavy-work';
import { RoomPlansService } from './room-plans.service';

/**
 * POST /v1/rooms/{roomId}/plans: the whole-room plan from what is stored (calculated on a worker thread),
 * optionally stored as a tuning.
 */
export function roomPlansRouter({ db, work }: Services): Router {
  const plans = new RoomPlansService(db, work);
  const router = Router();
  router.post(
    '/rooms/:roomId/plans',
    requirePermission('tuning'),
    validate('planStoredRoom', async ({ params, body }, req, res) => {
      const result = await plans.plan(callerOf(req), params.roomId, body, whenClientGone(res));
      if (result.tuning) res.status(201).location(`/v1/tunings/${result.tuning.id}`);
      res.json(result);
    }),
  );
  return router;
}
