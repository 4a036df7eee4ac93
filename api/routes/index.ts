import { Router } from 'express';
import type { Services } from '../services';
import { bassManagementRouter } from './bass-management';
import { biquadsRouter } from './biquads';
import { crossoversRouter } from './crossovers';
import { delaysRouter } from './delays';
import { analysisRouter } from './analysis';
import { eqFitRouter } from './eq-fit';
import { measurementsRouter } from './measurements';
import { geometryRouter } from './geometry';
import { levelsRouter } from './levels';
import { keysRouter } from './keys';
import { layoutsRouter } from './layouts';
import { plansRouter } from './plans';
import { outboxRouter } from './outbox';
import { usersRouter } from './users';
import { usageRouter } from './usage';
import { roomsRouter } from './rooms';
import { tuningsRouter } from './tunings';

/**
 * Every `/v1` resource router, mounted after authentication, rate limiting and metering.
 * Add one line per resource: `router.use(delaysRouter)` or `router.use(roomsRouter(services))`.
 */
export function v1Router(services: Services): Router {
  const router = Router();
  router.use(layoutsRouter);
  router.use(geometryRouter);
  router.use(plansRouter);
  router.use(delaysRouter);
  router.use(levelsRouter);
  router.use(biquadsRouter);
  router.use(crossoversRouter);
  router.use(bassManagementRouter);
  router.use(eqFitRouter);
  router.use(analysisRouter);
  router.use(usersRouter(services));
  router.use(outboxRouter(services));
  router.use(keysRouter(services));
  router.use(usageRouter(services));
  router.use(roomsRouter(services));
  router.use(measurementsRouter(services));
  router.use(tuningsRouter(services));
  return router;
}
