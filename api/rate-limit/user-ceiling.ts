import type { Request, RequestHandler } from 'express';
import { MemoryStore, rateLimit, type Store } from 'express-rate-limit';
import { ProblemError, sendProblem } from '../http/problem';
import type { Services } from '../services';
import { contractRequestCost, withCost } from './request-cost';

const WINDOW_MS = 60_000;

/**
 * A ceiling per user over all their keys and their console session together, after each key's own
 * limit: one user cannot multiply their allowance by creating keys. Its policy is named `user` in the
 * draft-8 `RateLimit` and `RateLimit-Policy` headers, beside the key's own policy. It counts the same
 * units as the key's limit (heavy operations cost more than one).
 */
export function createUserRateLimiter(services: Services, options: { store?: Store } = {}): RequestHandler {
  const store = options.store ?? new MemoryStore();
  const limit = services.config.userRateLimitPerMinute;
  services.onClose.push(async () => {
    await store.shutdown?.();
  });
  const subject = (req: Request) => `user:${req.principal?.userId ?? ''}`;
  const limiter = rateLimit({
    windowMs: WINDOW_MS,
    limit,
    keyGenerator: subject,
    identifier: 'user',
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store,
    requestPropertyName: 'userRateLimit',
    handler: (req, res) => {
      sendProblem(
        res,
        new ProblemError({
          status: 429,
          title: 'Too many requests',
          detail: `All keys and the console session of one user together may make ${limit} requests per minute, a heavy operation counting as several (its x-rate-limit-cost). Retry after the time given in Retry-After (seconds).`,
          type: 'rate-limited',
        }),
        req.originalUrl.split('?')[0],
      );
    },
  });
  return withCost(limiter, store, subject, contractRequestCost());
}
