import { Router } from 'express';
import { requirePermission } from '../auth/permissions';
import { notFound } from '../http/problem';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { inviteUser, listUsers, reissueInvitation, toUserView, updateUser } from '../users';

/** Console users: anyone sees themselves; admins list, invite, change role or name, disable. */
export function usersRouter(services: Services): Router {
  const { User } = services.db.models;
  const router = Router();
  const admin = requirePermission('users');

  router.get(
    '/users/me',
    validate('getCurrentUser', async (_input, req, res) => {
      const user = await User.findByPk(req.principal?.userId ?? '');
      if (!user) throw notFound('The user behind this key or session no longer exists.');
      res.json(toUserView(user));
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
      const result = await inviteUser(services, req, body);
      res.status(201).location(`/v1/users/${result.user.id}`).json(result);
    }),
  );

  router.get(
    '/users/:userId',
    admin,
    validate('getUser', async ({ params }, _req, res) => {
      const user = await User.findByPk(params.userId);
      if (!user) throw notFound(`No user ${params.userId}.`);
      res.json(toUserView(user));
    }),
  );

  router.patch(
    '/users/:userId',
    admin,
    validate('updateUser', async ({ params, body }, req, res) => {
      res.json(await updateUser(services, req, params.userId, body));
    }),
  );

  router.post(
    '/users/:userId/invitations',
    admin,
    validate('reissueInvitation', async ({ params }, req, res) => {
      res.status(201).json(await reissueInvitation(services, req, params.userId));
    }),
  );

  return router;
}
