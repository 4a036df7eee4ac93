import { Router } from 'express';
import { analyseGeometry } from '../../shared/geometry';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';

/** POST /v1/geometry: distances, angles and the BS.2051 placement rules for one room. */
export const geometryRouter = Router();

geometryRouter.post(
  '/geometry',
  requirePermission('calculate'),
  validate('computeGeometry', ({ body }, _req, res) => {
    res.json(analyseGeometry(body));
  }),
);
