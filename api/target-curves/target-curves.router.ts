import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { TargetCurvesService } from './target-curves.service';

/** /v1/target-curves: a caller's stored target curves (every owner's for admins). */
export function targetCurvesRouter(services: Services): Router {
  const curves = new TargetCurvesService(services.db);
  const router = Router();
  const tuning = requirePermission('tuning');

  router.get(
    '/target-curves',
    tuning,
    validate('listTargetCurves', async ({ query }, req, res) => {
      res.json(await curves.list(callerOf(req), query));
    }),
  );

  router.post(
    '/target-curves',
    tuning,
    validate('createTargetCurve', async ({ body }, req, res) => {
      const curve = await curves.create(callerOf(req), body);
      res.status(201).location(`/v1/target-curves/${curve.id}`).json(curve);
    }),
  );

  router.get(
    '/target-curves/:targetCurveId',
    tuning,
    validate('getTargetCurve', async ({ params }, req, res) => {
      res.json(await curves.get(callerOf(req), params.targetCurveId));
    }),
  );

  router.patch(
    '/target-curves/:targetCurveId',
    tuning,
    validate('updateTargetCurve', async ({ params, body }, req, res) => {
      res.json(await curves.update(callerOf(req), params.targetCurveId, body));
    }),
  );

  router.delete(
    '/target-curves/:targetCurveId',
    tuning,
    validate('deleteTargetCurve', async ({ params }, req, res) => {
      await curves.delete(callerOf(req), params.targetCurveId);
      res.status(204).end();
    }),
  );

  return router;
}
