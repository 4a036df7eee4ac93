import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { VerificationService } from './verification.service';

/** GET /v1/tunings/{id}/verification and PUT …/versions/{version}/sign-off. */
export function verificationRouter({ db }: Services): Router {
  const verification = new VerificationService(db);
  const router = Router();
  const tuning = requirePermission('tuning');
  router.get(
    '/tunings/:tuningId/verification',
    tuning,
    validate('getTuningVerification', async ({ params, query }, req, res) => {
      res.json(await verification.answer(callerOf(req), params.tuningId, query));
    }),
  );
  router.put(
    '/tunings/:tuningId/versions/:version/sign-off',
    tuning,
    validate('signOffTuningVersion', async ({ params, body }, req, res) => {
      res.json(await verification.signOff(callerOf(req), params.tuningId, params.version, body, new Date()));
    }),
  );
  return router;
}
