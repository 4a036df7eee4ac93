import { Router } from 'express';
import { planRoom } from '../../shared/plan/plan-room';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';

/** POST /v1/plans: a whole room's corrections at once (not stored; see /v1/rooms/{id}/tunings). */
export const plansRouter = Router();

plansRouter.post(
  '/plans',
  requirePermission('calculate'),
  validate('createPlan', ({ body }, _req, res) => {
    res.json(planRoom(body));
  }),
);
