import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import { notifyKeyCreated } from '../mail';
import { KeyService } from './key-service';
import type { Services } from '../services';

/** `/v1/keys`: a caller's own keys with `keys:own`, everyone's with `keys:all`. */
export function keysRouter(services: Services): Router {
  const keys = new KeyService({
    db: services.db,
    keys: services.keys,
    keyHashSecret: services.config.keyHashSecret,
    logger: services.logger,
    notifyKeyCreated: (notice) => notifyKeyCreated(services, notice),
    maxActiveKeysPerUser: services.config.maxActiveKeysPerUser,
  });
  const router = Router();
  const mayManageKeys = requirePermission('keys:own', 'keys:all');

  router.get(
    '/keys',
    mayManageKeys,
    validate('listKeys', async ({ query }, req, res) => {
      res.json(await keys.list(callerOf(req), query));
    }),
  );

  router.post(
    '/keys',
    mayManageKeys,
    validate('createKey', async ({ body }, req, res) => {
      const created = await keys.create(callerOf(req), body);
      // The clear key is in this body and nowhere else; like every API answer it is sent with
      // Cache-Control: no-store (API_SECURITY_HEADERS), so no cache keeps it.
      res.status(201).location(`/v1/keys/${created.id}`).json(created);
    }),
  );

  router.get(
    '/keys/:keyId',
    mayManageKeys,
    validate('getKey', async ({ params }, req, res) => {
      res.json(await keys.get(callerOf(req), params.keyId));
    }),
  );

  router.patch(
    '/keys/:keyId',
    mayManageKeys,
    validate('updateKey', async ({ params, body }, req, res) => {
      res.json(await keys.update(callerOf(req), params.keyId, body));
    }),
  );

  router.delete(
    '/keys/:keyId',
    mayManageKeys,
    validate('revokeKey', async ({ params }, req, res) => {
      res.json(await keys.revoke(callerOf(req), params.keyId));
    }),
  );

  return router;
}
