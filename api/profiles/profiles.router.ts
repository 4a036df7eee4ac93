import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { ProfilesService } from './profiles.service';

/** /v1/processor-profiles: what a room's processor accepts, stored per owner. */
export function profilesRouter(services: Services): Router {
  const profiles = new ProfilesService(services.db);
  const router = Router();
  const tuning = requirePermission('tuning');

  router.get(
    '/processor-profiles',
    tuning,
    validate('listProcessorProfiles', async ({ query }, req, res) => {
      res.json(await profiles.list(callerOf(req), query));
    }),
  );
  router.post(
    '/processor-profiles',
    tuning,
    validate('createProcessorProfile', async ({ body }, req, res) => {
      const created = await profiles.create(callerOf(req), body);
      res.status(201).location(`/v1/processor-profiles/${created.id}`).json(created);
    }),
  );
  router.get(
    '/processor-profiles/:profileId',
    tuning,
    validate('getProcessorProfile', async ({ params }, req, res) => {
      res.json(await profiles.get(callerOf(req), params.profileId));
    }),
  );
  router.put(
    '/processor-profiles/:profileId',
    tuning,
    validate('replaceProcessorProfile', async ({ params, body }, req, res) => {
      res.json(await profiles.replace(callerOf(req), params.profileId, body));
    }),
  );
  router.delete(
    '/processor-profiles/:profileId',
    tuning,
    validate('deleteProcessorProfile', async ({ params }, req, res) => {
      await profiles.delete(callerOf(req), params.profileId);
      res.status(204).end();
    }),
  );
  return router;
}
