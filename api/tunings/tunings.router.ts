import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { tuningVersionsRouter } from './tuning-versions.router';
import { TuningsService } from './tunings.service';
import { verificationRouter } from './verification.router';

/** Tunings of stored rooms: versioned on every edit, duplicable, comparable, exportable. */
export function tuningsRouter(services: Services): Router {
  const tunings = new TuningsService(services.db, services.work);
  const router = Router();
  const tuning = requirePermission('tuning');

  router.get(
    '/rooms/:roomId/tunings',
    tuning,
    validate('listRoomTunings', async ({ params, query }, req, res) => {
      res.json(await tunings.list(callerOf(req), params.roomId, query));
    }),
  );
  router.post(
    '/rooms/:roomId/tunings',
    tuning,
    validate('createRoomTuning', async ({ params, body }, req, res) => {
      const created = await tunings.create(callerOf(req), params.roomId, body);
      res.status(201).location(`/v1/tunings/${created.id}`).json(created);
    }),
  );
  router.get(
    '/tunings/compare',
    tuning,
    validate('compareTunings', async ({ query }, req, res) => {
      res.json(await tunings.compare(callerOf(req), query));
    }),
  );
  router.get(
    '/tunings/:tuningId',
    tuning,
    validate('getTuning', async ({ params, query }, req, res) => {
      res.json(await tunings.get(callerOf(req), params.tuningId, query.version));
    }),
  );
  router.patch(
    '/tunings/:tuningId',
    tuning,
    validate('updateTuning', async ({ params, body }, req, res) => {
      res.json(await tunings.update(callerOf(req), params.tuningId, body));
    }),
  );
  router.delete(
    '/tunings/:tuningId',
    tuning,
    validate('deleteTuning', async ({ params }, req, res) => {
      await tunings.delete(callerOf(req), params.tuningId);
      res.status(204).end();
    }),
  );
  router.post(
    '/tunings/:tuningId/duplicate',
    tuning,
    validate('duplicateTuning', async ({ params, body }, req, res) => {
      const copy = await tunings.duplicate(callerOf(req), params.tuningId, body ?? {});
      res.status(201).location(`/v1/tunings/${copy.id}`).json(copy);
    }),
  );
  router.get(
    '/tunings/:tuningId/export',
    tuning,
    validate('exportTuning', async ({ params, query }, req, res) => {
      const exported = await tunings.export(callerOf(req), params.tuningId, query);
      if ('csv' in exported) {
        res.type('text/csv; charset=utf-8').attachment(exported.fileName).send(exported.csv);
      } else {
        res.json(exported.json);
      }
    }),
  );

  router.use(tuningVersionsRouter(tunings));
  router.use(verificationRouter(services));
  return router;
}
