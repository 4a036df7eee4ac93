import { Router } from 'express';
import { planBassManagement } from '../../shared/bass-management/bass-management';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';

/** POST /v1/bass-management: high-passes, subwoofer feed and the headroom the summing needs. */
export const bassManagementRouter = Router();

bassManagementRouter.post(
  '/bass-management',
  requirePermission('calculate'),
  validate('planBassManagement', ({ body }, _req, res) => {
    res.json(planBassManagement(body));
  }),
);
