import { Router } from 'express';
import { planCrossover } from '../../shared/filters/crossover';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';

/** POST /v1/crossovers: Butterworth and Linkwitz-Riley low/high-pass cascades and their sum. */
export const crossoversRouter = Router();

crossoversRouter.post(
  '/crossovers',
  requirePermission('calculate'),
  validate('designCrossover', ({ body }, _req, res) => {
    res.json(planCrossover(body));
  }),
);
