import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { TuningsService } from './tunings.service';

/** /v1/tunings/{id}/versions: every version stays readable and can be restored as a new version. */
export function tuningVersionsRouter(tunings: TuningsService): Router {
  const router = Router();
  const tuning = requirePermission('tuning');

  router.get(
    '/tunings/:tuningId/versions',
    tuning,
    validate('listTuningVersions', async ({ params, query }, req, res) => {
      res.json(await tunings.versions(callerOf(req), params.tuningId, query));
    }),
  );
  router.get(
    '/tunings/:tuningId/versions/:version',
    tuning,
    validate('getTuningVersion', async ({ params }, req, res) => {
      res.json(await tunings.version(callerOf(req), params.tuningId, params.version));
    }),
  );
  router.post(
    '/tunings/:tuningId/versions/:version/restore',
    tuning,
    validate('restoreTuningVersion', async ({ params }, req, res) => {
      res.json(await tunings.restore(callerOf(req), params.tuningId, params.version));
    }),
  );
  return router;
}
