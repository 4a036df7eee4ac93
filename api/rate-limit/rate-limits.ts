import { createHash } from 'node:crypto';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import { ProblemError } from '../http/problem';
import type { Services } from '../services';
import { contractRequestCost, type RequestCost } from './request-cost';

/** Both limits count over a one-minute window. */
const WINDOW_MS = 60_000;
const WINDOW_S = WINDOW_MS / 1000;

/** Whose allowance a request spends first: its key's, or for a console session its user's. */
export function rateLimitSubject(req: Request): string {
  const principal = req.principal;
  if (!principal) throw new Error('The rate limiter runs after authentication');
  return principal.keyId ? `key:${principal.keyId}` : `user:${principal.userId}`;
}

export interface RateLimitStores {
  /** Hits per key (or per console session's user), each against the key's own `rateLimitPerMinute`. */
  key: Store;
  /** Hits per user over all their keys and their console session, against the user ceiling. */
  user: Store;
}

/**
 * The two rate limits of `/v1` as one stage, after authentication: first each key's own limit (its
 * `rateLimitPerMinute`, or the server default), then a ceiling per user over all their keys and their
 * console session together, so one user cannot multiply their allowance by creating keys. Limits count
 * units: a heavy operation spends its contract's `x-rate-limit-cost`.
 *
 * Counting is express-rate-limit's: its `Store`s (its memory store in one process, rate-limit-redis
 * shared by every instance) hold the hits and windows. This stage is the thin part around them, written
 * here because express-rate-limit's own middleware cost about 16 CPU-µs per request per limiter
 * (`npm run bench:profile`): an async function with seven awaits, the client address worked out for a
 * debug line, a SHA-256 for every header, checks meant for its own configuration mistakes. Here the two
 * limits take one pass and one header each.
 *
 * Headers as draft-ietf-httpapi-ratelimit-headers-08 writes them, one list member per policy, the key's
 * first: `RateLimit: "600-in-1min"; r=599; t=60, "user"; r=1199; t=60` and `RateLimit-Policy: "600-in-1min";
 * q=600; w=60; pk=:…:, "user"; q=1200; w=60; pk=:…:`. Past a limit: 429 problem with `Retry-After`, and
 * the user's ceiling is not charged for a request its key's limit refused.
 */
export function createRateLimits(
  services: Services,
  stores: RateLimitStores,
  cost: RequestCost = contractRequestCost(),
): RequestHandler {
  const fallback = services.config.defaultRateLimitPerMinute;
  const userLimit = services.config.userRateLimitPerMinute;
  // The stores read their window from express-rate-limit's options at start, as its middleware passes them.
  for (const store of [stores.key, stores.user]) {
    void store.init?.({ windowMs: WINDOW_MS } as Options);
    services.onClose.push(async () => {
      await store.shutdown?.();
    });
  }
  const userPolicy = `"user"; q=${userLimit}; w=${WINDOW_S}; pk=:`;

  return (req: Request, res: Response, next: NextFunction) => {
    const principal = req.principal;
    if (!principal) {
      next(new Error('The rate limits run after authentication'));
      return;
    }
    const keySubject = principal.keyId ? `key:${principal.keyId}` : `user:${principal.userId}`;
    const userSubject = `user:${principal.userId}`;
    const keyLimit = principal.rateLimitPerMinute ?? fallback;
    const units = cost(req);

    void charge(stores.key, keySubject, units)
      .then((key) => {
        const keyName = `"${keyLimit}-in-1min"`;
        const keyRemaining = Math.max(keyLimit - key.totalHits, 0);
        if (key.totalHits > keyLimit) {
          res.setHeader('RateLimit', `${keyName}; r=0; t=${resetSeconds(key)}`);
          res.setHeader(
            'RateLimit-Policy',
            `${keyName}; q=${keyLimit}; w=${WINDOW_S}; pk=:${partitionKey(keySubject)}:`,
          );
          next(refusal(res, key, keyLimitDetail(keyLimit)));
          return;
        }
        return charge(stores.user, userSubject, units).then((user) => {
          const userRemaining = Math.max(userLimit - user.totalHits, 0);
          res.setHeader(
            'RateLimit',
            `${keyName}; r=${keyRemaining}; t=${resetSeconds(key)}, "user"; r=${userRemaining}; t=${resetSeconds(user)}`,
          );
          res.setHeader(
            'RateLimit-Policy',
            `${keyName}; q=${keyLimit}; w=${WINDOW_S}; pk=:${partitionKey(keySubject)}:, ${userPolicy}${partitionKey(userSubject)}:`,
          );
          if (user.totalHits > userLimit) next(refusal(res, user, userLimitDetail(userLimit)));
          else next();
        });
      })
      .catch(next);
  };
}

/**
 * Adds a request's units to a subject's count: the store counts one hit per `increment`, so a heavy
 * request of cost n calls it n times, one after the other (a Redis store answers in order).
 */
function charge(store: Store, subject: string, units: number): Promise<ClientRateLimitInfo> {
  // Most requests cost one unit: the store's own promise, without an async function around it.
  if (units === 1) return Promise.resolve(store.increment(subject));
  return chargeUnits(store, subject, units);
}

async function chargeUnits(store: Store, subject: string, units: number): Promise<ClientRateLimitInfo> {
  let info = await store.increment(subject);
  for (let i = 1; i < units; i += 1) info = await store.increment(subject);
  return info;
}

/** Seconds until the window of this count ends (the whole window when the store does not say). */
function resetSeconds(info: ClientRateLimitInfo): number {
  if (!info.resetTime) return WINDOW_S;
  return Math.max(0, Math.ceil((info.resetTime.getTime() - Date.now()) / 1000));
}

function refusal(res: Response, info: ClientRateLimitInfo, detail: string): ProblemError {
  res.setHeader('Retry-After', String(resetSeconds(info)));
  return new ProblemError({ status: 429, title: 'Too many requests', detail, type: 'rate-limited' });
}

const keyLimitDetail = (limit: number) =>
  `This key may make ${limit} requests per minute, a heavy operation counting as several (its x-rate-limit-cost). Retry after the time given in Retry-After (seconds).`;
const userLimitDetail = (limit: number) =>
  `All keys and the console session of one user together may make ${limit} requests per minute, a heavy operation counting as several (its x-rate-limit-cost). Retry after the time given in Retry-After (seconds).`;

/**
 * The draft's partition key: an opaque name of whose count this is that does not reveal the key id —
 * the first 12 hex digits of the subject's SHA-256, in base64 (as express-rate-limit writes it). Worked
 * out once per subject; the cache is emptied when it holds more subjects than one instance meets in a
 * window.
 */
const partitionKeys = new Map<string, string>();
const MAX_CACHED_PARTITION_KEYS = 10_000;
function partitionKey(subject: string): string {
  let pk = partitionKeys.get(subject);
  if (pk === undefined) {
    if (partitionKeys.size >= MAX_CACHED_PARTITION_KEYS) partitionKeys.clear();
    const hex = createHash('sha256').update(subject).digest('hex').slice(0, 12);
    pk = Buffer.from(hex).toString('base64');
    partitionKeys.set(subject, pk);
  }
  return pk;
}
