import type { RequestHandler } from 'express';
import { analysisRouter } from './analysis/analysis.router';
import { calculationsRouter } from './calculations/calculations.router';
import { dispatchByFirstSegment } from './http/segment-dispatch';
import { keysRouter } from './keys/keys.router';
import { layoutsRouter } from './layouts/layouts.router';
import { outboxRouter } from './mail/outbox.router';
import { profilesRouter } from './profiles/profiles.router';
import { measurementsRouter } from './measurements/measurements.router';
import { roomPlansRouter } from './room-plans/room-plans.router';
import { roomsRouter } from './rooms/rooms.router';
import { targetCurvesRouter } from './target-curves/target-curves.router';
import type { Services } from './services';
import { testSignalsRouter } from './test-signals/test-signals.router';
import { tuningsRouter } from './tunings/tunings.router';
import { usageRouter } from './usage/usage.router';
import { usersRouter } from './users/users.router';

/**
 * Every `/v1` resource router, run after authentication, rate limiting and metering. Each resource has
 * its folder (`api/<resource>/`) with its router; add one line here per resource. A request goes only to
 * the routers that have a route for its first path segment (`dispatchByFirstSegment`), in this order,
 * as if they were mounted one after another; it calls `next()` when none answers.
 */
export function v1Router(services: Services): RequestHandler {
  return dispatchByFirstSegment([
    layoutsRouter(),
    calculationsRouter(services),
    analysisRouter(services),
    testSignalsRouter(),
    usersRouter(services),
    outboxRouter(services),
    keysRouter(services),
    usageRouter(services),
    profilesRouter(services),
    roomsRouter(services),
    measurementsRouter(services),
    roomPlansRouter(services),
    tuningsRouter(services),
    targetCurvesRouter(services),
  ]);
}
