import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { getUser, inviteUser, listUsers, reissueInvitation, updateUser } from '.';

/** Console users: anyone sees themselves; admins list, invite, change role or name, disable. */
export function usersRouter(services: Services): Router {
  const router = Router();
  const admin = requirePermission('users');

  router.get(
    '/users/me',
    validate('getCurrentUser', async (_input, req, res) => {
      const missing = 'The user behind this key or session no longer exists.';
      res.json(await getUser(services.db.models, callerOf(req).principal.userId, missing));
    }),
  );

  router.get(
    '/users',
    admin,
    validate('listUsers', async ({ query }, _req, res) => {
      res.json(await listUsers(services.db.models, query));
    }),
  );

  router.post(
    '/users',
    admin,
    validate('inviteUser', async ({ body }, req, res) => {
      const result = await inviteUser(services, callerOf(req), body);
      res.status(201).location(`/v1/users/${result.user.id}`).json(result);
    }),
  );

  router.get(
    '/users/:userId',
    admin,
    validate('getUser', async ({ params }, _req, res) => {
      res.json(await getUser(services.db.models, params.userId));
    }),
  );

  router.patch(
    '/users/:userId',
    admin,
    validate('updateUser', async ({ params, body }, req, res) => {
      res.json(await updateUser(services, callerOf(req), params.userId, body));
    }),
  );

  router.post(
    '/users/:userId/invitations',
    admin,
    validate('reissueInvitation', async ({ params }, req, res) => {
      res.status(201).json(await reissueInvitation(services, callerOf(req), params.userId));
    }),
  );

  return router;
}
