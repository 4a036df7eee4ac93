import { Router } from 'express';
import type { Services } from '../services';
import { geometryRouter } from './geometry';
import { layoutsRouter } from './layouts';
import { outboxRouter } from './outbox';
import { roomsRouter } from './rooms';
import { usersRouter } from './users';

/**
 * Every `/v1` resource router, mounted after authentication, rate limiting and metering.
 * Add one line per resource: `router.use(delaysRouter)` or `router.use(roomsRouter(services))`.
 */
export function v1Router(services: Services): Router {
  const router = Router();
  router.use(layoutsRouter);
  router.use(geometryRouter);
  router.use(usersRouter(services));
  router.use(outboxRouter(services));
  router.use(roomsRouter(services));
  return router;
}
