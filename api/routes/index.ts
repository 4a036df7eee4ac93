import { Router } from 'express';
import type { Services } from '../services';

/**
 * Every `/v1` resource router, mounted after authentication, rate limiting and metering.
 * Add one line per resource: `router.use(delaysRouter)` or `router.use(roomsRouter(services))`.
 */
export function v1Router(_services: Services): Router {
  const router = Router();
  return router;
}
