import { Router } from 'express';
import { computeLevelTrims } from '../../shared/level/level-trims';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';

/** POST /v1/levels: per-channel trims to a reference level. */
export const levelsRouter = Router();

levelsRouter.post(
  '/levels',
  requirePermission('calculate'),
  validate('computeLevels', ({ body }, _req, res) => {
    res.json(computeLevelTrims(body));
  }),
);
