import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { MeasurementsService } from './measurements.service';

/** /v1/rooms/{roomId}/measurements: uploads analysed on arrival and stored whole, or not at all. */
export function measurementsRouter({ db, work }: Services): Router {
  const measurements = new MeasurementsService(db, work);
  const router = Router();
  const tuning = requirePermission('tuning');
  const path = '/rooms/:roomId/measurements';

  router.post(
    path,
    tuning,
    validate('createMeasurement', async (input, req, res) => {
      const created = await measurements.create(callerOf(req), input.params.roomId, input);
      res.status(201).location(`/v1/rooms/${created.roomId}/measurements/${created.id}`).json(created);
    }),
  );
  router.get(
    path,
    tuning,
    validate('listMeasurements', async ({ params, query }, req, res) => {
      res.json(await measurements.list(callerOf(req), params.roomId, query));
    }),
  );
  router.get(
    `${path}/average`,
    tuning,
    validate('averageMeasurements', async ({ params, query }, req, res) => {
      res.json(
        await measurements.average(callerOf(req), params.roomId, query.channel, query.kind, query.stage),
      );
    }),
  );
  router.get(
    `${path}/:measurementId`,
    tuning,
    validate('getMeasurement', async ({ params }, req, res) => {
      res.json(await measurements.get(callerOf(req), params.roomId, params.measurementId));
    }),
  );
  router.delete(
    `${path}/:measurementId`,
    tuning,
    validate('deleteMeasurement', async ({ params }, req, res) => {
      await measurements.delete(callerOf(req), params.roomId, params.measurementId);
      res.status(204).end();
    }),
  );
  return router;
}
