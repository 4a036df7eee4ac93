import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { MicrophonesService } from './microphones.service';

/** /v1/microphones: a caller's own measurement microphones and their calibrations. */
export function microphonesRouter(services: Services): Router {
  const microphones = new MicrophonesService(services.db, services.work);
  const router = Router();
  const tuning = requirePermission('tuning');

  router.get(
    '/microphones',
    tuning,
    validate('listMicrophones', async ({ query }, req, res) => {
      res.json(await microphones.list(callerOf(req), query));
    }),
  );
  router.post(
    '/microphones',
    tuning,
    validate('createMicrophone', async ({ body }, req, res) => {
      const mic = await microphones.create(callerOf(req), body);
      res.status(201).location(`/v1/microphones/${mic.id}`).json(mic);
    }),
  );
  router.get(
    '/microphones/:microphoneId',
    tuning,
    validate('getMicrophone', async ({ params }, req, res) => {
      res.json(await microphones.get(callerOf(req), params.microphoneId));
    }),
  );
  router.patch(
    '/microphones/:microphoneId',
    tuning,
    validate('updateMicrophone', async ({ params, body }, req, res) => {
      res.json(await microphones.update(callerOf(req), params.microphoneId, body));
    }),
  );
  router.delete(
    '/microphones/:microphoneId',
    tuning,
    validate('deleteMicrophone', async ({ params }, req, res) => {
      await microphones.delete(callerOf(req), params.microphoneId);
      res.status(204).end();
    }),
  );
  router.post(
    '/microphones/:microphoneId/calibrator',
    tuning,
    validate('readMicrophoneCalibrator', async ({ params, body, file }, req, res) => {
      res.json(await microphones.readCalibrator(callerOf(req), params.microphoneId, body, file));
    }),
  );
  return router;
}
