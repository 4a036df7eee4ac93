import type { Request, RequestHandler } from 'express';
import { MemoryStore, rateLimit, type Store } from 'express-rate-limit';
import { ProblemError, sendProblem } from '../http/problem';
import type { Services } from '../services';

const WINDOW_MS = 60_000;

/**
 * A ceiling per user over all their keys and their console session together, after each key's own
 * limit: one user cannot multiply their allowance by creating keys. Its policy is named `user` in the
 * draft-8 `RateLimit` and `RateLimit-Policy` headers, beside the key's own policy.
 */
export function createUserRateLimiter(services: Services, options: { store?: Store } = {}): RequestHandler {
  const store = options.store ?? new MemoryStore();
  const limit = services.config.userRateLimitPerMinute;
  services.onClose.push(async () => {
    await store.shutdown?.();
  });
  return rateLimit({
    windowMs: WINDOW_MS,
    limit,
    keyGenerator: (req: Request) => `user:${req.principal?.userId ?? ''}`,
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
          detail: `All keys and the console session of one user together may make ${limit} requests per minute. Retry after the time given in Retry-After (seconds).`,
          type: 'rate-limited',
        }),
        req.originalUrl.split('?')[0],
      );
    },
  });
}
