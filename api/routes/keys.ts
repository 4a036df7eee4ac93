import { Router, type Request } from 'express';
import { principalOf, requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import { notifyKeyCreated } from '../mail';
import { KeyService, type KeyActor } from '../keys/key-service';
import type { Services } from '../services';

const caller = (req: Request): KeyActor => ({ kind: 'caller', principal: principalOf(req), req });

/** `/v1/keys`: a caller's own keys with `keys:own`, everyone's with `keys:all`. */
export function keysRouter(services: Services): Router {
  const keys = new KeyService({
    db: services.db,
    keys: services.keys,
    keyHashSecret: services.config.keyHashSecret,
    logger: services.logger,
    notifyKeyCreated: (notice) => notifyKeyCreated(services, notice),
  });
  const router = Router();
  const mayManageKeys = requirePermission('keys:own', 'keys:all');

  router.get(
    '/keys',
    mayManageKeys,
    validate('listKeys', async ({ query }, req, res) => {
      res.json(await keys.list(caller(req), query));
    }),
  );

  router.post(
    '/keys',
    mayManageKeys,
    validate('createKey', async ({ body }, req, res) => {
      const created = await keys.create(caller(req), body);
      // The clear key is in this body and nowhere else: no cache may keep it.
      res.setHeader('Cache-Control', 'no-store');
      res.status(201).location(`/v1/keys/${created.id}`).json(created);
    }),
  );

  router.get(
    '/keys/:keyId',
    mayManageKeys,
    validate('getKey', async ({ params }, req, res) => {
      res.json(await keys.get(caller(req), params.keyId));
    }),
  );

  router.patch(
    '/keys/:keyId',
    mayManageKeys,
    validate('updateKey', async ({ params, body }, req, res) => {
      res.json(await keys.update(caller(req), params.keyId, body));
    }),
  );

  router.delete(
    '/keys/:keyId',
    mayManageKeys,
    validate('revokeKey', async ({ params }, req, res) => {
      res.json(await keys.revoke(caller(req), params.keyId));
    }),
  );

  return router;
}
