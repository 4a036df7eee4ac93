import type { Request, RequestHandler, Response } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import { ProblemError } from '../http/problem';
import { validInput } from '../http/validate';
import { normalizeEmail } from './credentials';

export interface GrowingDelay {
  /** Failures allowed before any wait. */
  freeFailures: number;
  /** The first wait; each further failure doubles it. */
  firstDelayMs: number;
  maxDelayMs: number;
  /** A key without a failure for this long (and not waiting) starts again from nothing. */
  forgetAfterMs: number;
}

export interface ThrottleLimits {
  /** One account tried from one client address: the real user elsewhere is never held up by it. */
  perAccountAndAddress: GrowingDelay;
  /** One client address, whatever accounts it tries (password spraying). */
  perAddress: GrowingDelay;
  /** Invitation tokens guessed from one client address. */
  invitationPerAddress: GrowingDelay;
}

const MINUTE = 60_000;

/**
 * Five free failures for an account from one address, then waits of 1 s, 2 s, 4 s… up to 15 minutes;
 * twenty per address over all accounts. Keyed by address, an attacker elsewhere cannot lock a user out
 * (OWASP Authentication Cheat Sheet, account lockout; NIST SP 800-63B §5.2.2 rate limiting).
 */
export const DEFAULT_THROTTLE_LIMITS: ThrottleLimits = {
  perAccountAndAddress: {
    freeFailures: 5,
    firstDelayMs: 1000,
    maxDelayMs: 15 * MINUTE,
    forgetAfterMs: 15 * MINUTE,
  },
  perAddress: { freeFailures: 20, firstDelayMs: 1000, maxDelayMs: 15 * MINUTE, forgetAfterMs: 15 * MINUTE },
  invitationPerAddress: {
    freeFailures: 10,
    firstDelayMs: 1000,
    maxDelayMs: 15 * MINUTE,
    forgetAfterMs: 15 * MINUTE,
  },
};

/** Keys remembered per throttle; the oldest are forgotten first, so a flood of addresses stays bounded. */
const MAX_KEYS = 50_000;

interface Entry {
  failures: number;
  lastFailureAt: number;
  blockedUntil: number;
}

/** Failures per key with an exponentially growing wait after the free ones. Memory only, one process. */
export class GrowingDelayThrottle {
  private readonly entries = new Map<string, Entry>();

  constructor(
    private readonly limits: GrowingDelay,
    private readonly now: () => number = Date.now,
  ) {}

  /** Milliseconds the key must still wait, or 0. */
  waitMs(key: string): number {
    const entry = this.current(key);
    return entry ? Math.max(0, entry.blockedUntil - this.now()) : 0;
  }

  fail(key: string): void {
    const now = this.now();
    const entry = this.current(key) ?? { failures: 0, lastFailureAt: now, blockedUntil: 0 };
    entry.failures += 1;
    entry.lastFailureAt = now;
    const beyond = entry.failures - this.limits.freeFailures;
    if (beyond > 0) {
      const delay = Math.min(
        this.limits.maxDelayMs,
        this.limits.firstDelayMs * 2 ** Math.min(beyond - 1, 30),
      );
      entry.blockedUntil = now + delay;
    }
    this.entries.delete(key);
    this.entries.set(key, entry);
    if (this.entries.size > MAX_KEYS) this.entries.delete(this.entries.keys().next().value as string);
  }

  /** Counts a failure in advance and answers 0, or, while the key must wait, answers the wait and counts nothing. */
  attempt(key: string): number {
    const wait = this.waitMs(key);
    if (wait > 0) return wait;
    this.fail(key);
    return 0;
  }

  succeed(key: string): void {
    this.entries.delete(key);
  }

  /** Takes back one failure counted in advance for an attempt that turned out not to be one. */
  forgive(key: string): void {
    const entry = this.entries.get(key);
    if (!entry) return;
    entry.failures -= 1;
    if (entry.failures <= 0) this.entries.delete(key);
    else if (entry.failures <= this.limits.freeFailures) entry.blockedUntil = 0;
  }

  private current(key: string): Entry | undefined {
    const entry = this.entries.get(key);
    if (!entry) return undefined;
    const now = this.now();
    if (now >= entry.blockedUntil && now - entry.lastFailureAt > this.limits.forgetAfterMs) {
      this.entries.delete(key);
      return undefined;
    }
    return entry;
  }
}

const clientAddress = (req: Request): string => ipKeyGenerator(req.ip ?? '');

const triedEmail = (req: Request): string => {
  return normalizeEmail(validInput(req, 'signIn').body.email);
};

/**
 * The counting side of a throttle, in memory or shared through Redis (`api/shared-state/`). `attempt`
 * checks and counts in one step (a Lua script in Redis), so parallel guesses, on one instance or
 * several, cannot all pass the check before any of them is counted.
 */
export interface ThrottleCounting {
  attempt(key: string): number | Promise<number>;
  succeed(key: string): void | Promise<void>;
  forgive(key: string): void | Promise<void>;
}

export type ThrottleCounterFactory = (
  name: string,
  limits: GrowingDelay,
  now: () => number,
) => ThrottleCounting;

interface Rule {
  throttle: ThrottleCounting;
  key: (req: Request) => string;
  /** A success forgets the key's failures (the account-and-address pair), or not (an address). */
  resetOnSuccess: boolean;
}

/**
 * Refuses with 429 and `Retry-After` while any rule's key must wait (such a refusal is not checked and
 * not counted). An attempt let through counts as a failure at once, so a burst of parallel guesses
 * cannot all slip past before the first answer; once answered, a success (or a server error) takes it
 * back, and a success resets the rules that reset; a refusal (4xx) keeps it. Mount after validation, before the handler.
 */
function throttled(rules: Rule[], detail: string): RequestHandler {
  const settle = (req: Request, res: Response, keys: string[], waits: number[]): void => {
    const waitMs = Math.max(...waits);
    if (waitMs > 0) {
      // Rules that counted this attempt take it back: it is refused, not tried.
      rules.forEach((rule, i) => {
        if (waits[i] === 0) void Promise.resolve(rule.throttle.forgive(keys[i])).catch(() => undefined);
      });
      const retryAfter = Math.ceil(waitMs / 1000);
      throw new ProblemError({
        status: 429,
        title: 'Too many attempts',
        detail: `${detail} Wait ${retryAfter} second${retryAfter === 1 ? '' : 's'} before trying again; each further failure doubles the wait.`,
        type: 'too-many-attempts',
        headers: { 'Retry-After': String(retryAfter) },
      });
    }
    res.once('close', () => {
      // An attempt abandoned before its answer stays counted: aborting must not buy free guesses.
      if (!res.writableFinished) return;
      const status = res.statusCode;
      rules.forEach((rule, i) => {
        // After the answer: a shared store that fails now only leaves the failure counted.
        const undo =
          status < 400 && rule.resetOnSuccess
            ? rule.throttle.succeed(keys[i])
            : status < 400 || status >= 500
              ? rule.throttle.forgive(keys[i])
              : undefined;
        void Promise.resolve(undo).catch(() => undefined);
      });
    });
  };
  return (req, res, next) => {
    const keys = rules.map((rule) => rule.key(req));
    const attempts = rules.map((rule, i) => rule.throttle.attempt(keys[i]));
    if (attempts.every((a): a is number => typeof a === 'number')) {
      // In memory: checked and counted synchronously, before any other request runs.
      settle(req, res, keys, attempts);
      return next();
    }
    Promise.all(attempts)
      .then((waits) => {
        settle(req, res, keys, waits);
        next();
      }, next)
      .catch(next);
  };
}

/** Brakes on password and invitation guessing. Create once per app: each throttle keeps its own counts. */
export function createSignInThrottles(
  limits: ThrottleLimits = DEFAULT_THROTTLE_LIMITS,
  now: () => number = Date.now,
  counter: ThrottleCounterFactory = (_name, growing, clock) => new GrowingDelayThrottle(growing, clock),
) {
  const pair = counter('account-address', limits.perAccountAndAddress, now);
  const address = counter('address', limits.perAddress, now);
  const invitations = counter('invitation-address', limits.invitationPerAddress, now);
  return {
    signIn: throttled(
      [
        { throttle: address, key: clientAddress, resetOnSuccess: false },
        {
          throttle: pair,
          key: (req) => `${triedEmail(req)}\u0000${clientAddress(req)}`,
          resetOnSuccess: true,
        },
      ],
      'Too many failed sign-in attempts from your address.',
    ),
    invitation: throttled(
      [{ throttle: invitations, key: clientAddress, resetOnSuccess: false }],
      'Too many failed attempts to use an invitation from your address.',
    ),
  };
}
