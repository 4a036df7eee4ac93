import { Router } from 'express';
import { designFilterSet } from '../../shared/filters/filter-set';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';

/** POST /v1/biquads: normalised second-order sections for parametric filters, with their response. */
export const biquadsRouter = Router();

biquadsRouter.post(
  '/biquads',
  requirePermission('calculate'),
  validate('designBiquads', ({ body }, _req, res) => {
    res.json(designFilterSet(body));
  }),
);
