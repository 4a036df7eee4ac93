import type { Request } from 'express';
import {
  ipKeyGenerator,
  rateLimit,
  type RateLimitInfo,
  type RateLimitRequestHandler,
} from 'express-rate-limit';
import { ProblemError } from '../http/problem';
import { validInput } from '../http/validate';
import { normalizeEmail } from './credentials';

export interface ThrottleLimits {
  /** Failed attempts allowed per window, per e-mail address tried. */
  perAccount: number;
  /** Failed attempts allowed per window, per client address. */
  perAddress: number;
  windowMs: number;
}

/**
 * Ten wrong passwords per account per quarter hour lets a person mistype but stops online guessing
 * (NIST SP 800-63B §5.2.2 requires a limit of at most 100 consecutive failures per account).
 */
export const DEFAULT_THROTTLE_LIMITS: ThrottleLimits = {
  perAccount: 10,
  perAddress: 30,
  windowMs: 15 * 60_000,
};

function limiter(
  name: string,
  limit: number,
  windowMs: number,
  keyGenerator: (req: Request) => string,
  detail: string,
): RateLimitRequestHandler {
  return rateLimit({
    windowMs,
    limit,
    keyGenerator,
    // Only failures count: a correct password takes its hit back when the response is a success.
    skipSuccessfulRequests: true,
    requestPropertyName: name,
    standardHeaders: false,
    legacyHeaders: false,
    handler: (req, _res, next, options) => {
      const info = (req as unknown as Record<string, RateLimitInfo | undefined>)[options.requestPropertyName];
      const resetAt = info?.resetTime?.getTime() ?? Date.now() + windowMs;
      const retryAfter = Math.max(1, Math.ceil((resetAt - Date.now()) / 1000));
      next(
        new ProblemError({
          status: 429,
          title: 'Too many attempts',
          detail: `${detail} Try again in ${Math.ceil(retryAfter / 60)} minute(s).`,
          type: 'too-many-attempts',
          headers: { 'Retry-After': String(retryAfter) },
        }),
      );
    },
  });
}

const clientAddress = (req: Request): string => ipKeyGenerator(req.ip ?? '');

const triedEmail = (req: Request): string => {
  return normalizeEmail(validInput(req, 'signIn').body.email);
};

/** Brakes on password and invitation guessing. Create once per app: each limiter keeps its own counts. */
export function createSignInThrottles(limits: ThrottleLimits = DEFAULT_THROTTLE_LIMITS) {
  const tooMany = 'Too many failed sign-in attempts.';
  return {
    perAccount: limiter('signInAccountLimit', limits.perAccount, limits.windowMs, triedEmail, tooMany),
    perAddress: limiter('signInAddressLimit', limits.perAddress, limits.windowMs, clientAddress, tooMany),
    invitationPerAddress: limiter(
      'invitationAddressLimit',
      limits.perAddress,
      limits.windowMs,
      clientAddress,
      'Too many failed attempts to use an invitation.',
    ),
  };
}
