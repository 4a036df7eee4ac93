import { Router, type Request } from 'express';
import { principalOf, requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import { notifyKeyCreated } from '../mail';
import { KeyService, type CreateKeyInput, type KeyActor, type UpdateKeyInput } from '../keys/key-service';
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
    maxActiveKeysPerUser: services.config.maxActiveKeysPerUser,
  });
  const router = Router();
  const mayManageKeys = requirePermission('keys:own', 'keys:all');

  router.get('/keys', mayManageKeys, validate('listKeys'), async (req, res) => {
    const query = req.valid.query as {
      limit: number;
      startingAfter?: string;
      ownerId?: string;
      includeRevoked?: boolean;
    };
    res.json(await keys.list(caller(req), query));
  });

  router.post('/keys', mayManageKeys, validate('createKey'), async (req, res) => {
    const created = await keys.create(caller(req), req.valid.body as CreateKeyInput);
    // The clear key is in this body and nowhere else: no cache may keep it.
    res.setHeader('Cache-Control', 'no-store');
    res.status(201).location(`/v1/keys/${created.id}`).json(created);
  });

  router.get('/keys/:keyId', mayManageKeys, validate('getKey'), async (req, res) => {
    res.json(await keys.get(caller(req), String(req.valid.params.keyId)));
  });

  router.patch('/keys/:keyId', mayManageKeys, validate('updateKey'), async (req, res) => {
    res.json(
      await keys.update(caller(req), String(req.valid.params.keyId), req.valid.body as UpdateKeyInput),
    );
  });

  router.delete('/keys/:keyId', mayManageKeys, validate('revokeKey'), async (req, res) => {
    res.json(await keys.revoke(caller(req), String(req.valid.params.keyId)));
  });

  return router;
}
