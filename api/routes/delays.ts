import { Router } from 'express';
import { alignDelays } from '../../shared/delay/align-delays';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';

/** POST /v1/delays: per-channel delays that make every loudspeaker arrive together. */
export const delaysRouter = Router();

delaysRouter.post(
  '/delays',
  requirePermission('calculate'),
  validate('computeDelays', ({ body }, _req, res) => {
    res.json(alignDelays(body));
  }),
);
