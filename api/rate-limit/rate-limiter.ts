import type { Request, RequestHandler } from 'express';
import { MemoryStore, rateLimit, type Store } from 'express-rate-limit';
import { ProblemError } from '../http/problem';
import type { Services } from '../services';
import { contractRequestCost, withCost, type RequestCost } from './request-cost';

const WINDOW_MS = 60_000;

/** Whose allowance a request spends: its key's, or for a console session its user's. */
export function rateLimitSubject(req: Request): string {
  const principal = req.principal;
  if (!principal) throw new Error('The rate limiter runs after authentication');
  return principal.keyId ? `key:${principal.keyId}` : `user:${principal.userId}`;
}

export interface RateLimiterOptions {
  /** Where hits are counted; one store per limiter. In memory by default (one process). */
  store?: Store;
  /** Units a request spends; by default the contract's (`x-rate-limit-cost`, else 1). */
  cost?: RequestCost;
}

/**
 * Per-key rate limit over a one-minute window: each key's own `rateLimitPerMinute`, or the server
 * default. Mounted after authentication so the identity is the key, never the client address. Answers
 * with IETF draft-8 `RateLimit`/`RateLimit-Policy` headers and, past the limit, a 429 problem document
 * with `Retry-After`. Limits count units: a heavy operation spends its contract's `x-rate-limit-cost`.
 * Build it once per app; its store is shut down when the services close.
 */
export function createRateLimiter(services: Services, options: RateLimiterOptions = {}): RequestHandler {
  const store = options.store ?? new MemoryStore();
  const fallback = services.config.defaultRateLimitPerMinute;
  services.onClose.push(async () => {
    await store.shutdown?.();
  });
  const limiter = rateLimit({
    windowMs: WINDOW_MS,
    limit: (req) => req.principal?.rateLimitPerMinute ?? fallback,
    keyGenerator: rateLimitSubject,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store,
    // Through the one error path, like every other refusal (express-rate-limit has set Retry-After).
    handler: (req, _res, next, used) => {
      const limit = (req as Request & { rateLimit?: { limit: number } }).rateLimit?.limit ?? used.limit;
      next(
        new ProblemError({
          status: 429,
          title: 'Too many requests',
          detail: `This key may make ${String(limit)} requests per minute, a heavy operation counting as several (its x-rate-limit-cost). Retry after the time given in Retry-After (seconds).`,
          type: 'rate-limited',
        }),
      );
    },
  });
  return withCost(limiter, store, rateLimitSubject, options.cost ?? contractRequestCost());
}
