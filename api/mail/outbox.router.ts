import { Router } from 'express';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';

/**
 * What the development mail server received, for the console. Exists only when the service runs its
 * own mail server (development and tests); in production mail leaves for real and this is a 404.
 */
export function outboxRouter(services: Services): Router {
  const router = Router();
  const outbox = services.mail.outbox;
  if (!outbox || services.config.env === 'production') return router;
  router.get(
    '/outbox',
    requirePermission('users'),
    validate('listOutbox', ({ query }, _req, res) => {
      res.json(outbox.list(query.limit, query.startingAfter));
    }),
  );
  return router;
}
