import { Router } from 'express';
import { analysisRouter } from './analysis/analysis.router';
import { calculationsRouter } from './calculations/calculations.router';
import { keysRouter } from './keys/keys.router';
import { layoutsRouter } from './layouts/layouts.router';
import { outboxRouter } from './mail/outbox.router';
import { profilesRouter } from './profiles/profiles.router';
import { measurementsRouter } from './measurements/measurements.router';
import { microphonesRouter } from './microphones/microphones.router';
import { roomPlansRouter } from './room-plans/room-plans.router';
import { roomsRouter } from './rooms/rooms.router';
import { targetCurvesRouter } from './target-curves/target-curves.router';
import type { Services } from './services';
import { testSignalsRouter } from './test-signals/test-signals.router';
import { tuningsRouter } from './tunings/tunings.router';
import { usageRouter } from './usage/usage.router';
import { usersRouter } from './users/users.router';

/**
 * Every `/v1` resource router, mounted after authentication, rate limiting and metering. Each resource
 * has its folder (`api/<resource>/`) with its router; add one line here per resource.
 */
export function v1Router(services: Services): Router {
  const router = Router();
  router.use(layoutsRouter());
  router.use(calculationsRouter(services));
  router.use(analysisRouter(services));
  router.use(testSignalsRouter());
  router.use(usersRouter(services));
  router.use(outboxRouter(services));
  router.use(keysRouter(services));
  router.use(usageRouter(services));
  router.use(profilesRouter(services));
  router.use(roomsRouter(services));
  router.use(measurementsRouter(services));
  router.use(roomPlansRouter(services));
  router.use(tuningsRouter(services));
  router.use(targetCurvesRouter(services));
  router.use(microphonesRouter(services));
  return router;
}
