import type { NextFunction, Request, RequestHandler } from 'express';
import { Strategy as BearerStrategy } from 'passport-http-bearer';
import { ProblemError } from '../http/problem';
import { KEY_PATTERN } from './key-secret';
import type { ActiveKey, KeyStore } from './key-store';
import type { Principal } from './permissions';

const REALM = 'Bearer realm="isochron"';

/** Resolves a console session to a principal; supplied by the session module. */
export type SessionPrincipalResolver = (req: Request) => Promise<Principal | null>;

function unauthorized(detail: string, challenge: string): ProblemError {
  return new ProblemError({
    status: 401,
    title: 'Unauthorized',
    detail,
    headers: { 'WWW-Authenticate': challenge },
  });
}

function tokenOutsideHeader(req: Request): boolean {
  const body = req.body as Record<string, unknown> | undefined;
  if (typeof body === 'object' && body !== null && 'access_token' in body) return true;
  // Most calls have no query string at all; parse it only when there is one.
  const url = req.originalUrl;
  return url.includes('?') && new URL(url, 'http://localhost').searchParams.has('access_token');
}

type BearerOutcome = { key: ActiveKey } | { failed: true } | { error: unknown };

/** One run of the bearer strategy, with the three outcomes Passport's strategy contract defines. */
interface BearerAttempt {
  success(key: ActiveKey): void;
  fail(): void;
  error(err: unknown): void;
  authenticate(req: Request): void;
}

/**
 * Every `/v1` call names its caller: an API key in the `Authorization` header, or a console session.
 * passport-http-bearer would also take a token from the query string or the body; those forms leak
 * into logs and histories, so they are refused before it runs.
 *
 * The bearer strategy is driven directly through its Passport strategy contract (`success`, `fail`,
 * `error`) rather than through `passport.authenticate`, which builds a middleware and adds seven
 * properties to every request object; on the hot path that cost about as much as the rest of the
 * authentication (measured with `npm run bench` and a CPU profile). A key found in the cache is
 * answered synchronously, without a promise.
 */
export function authenticate(keys: KeyStore, sessionPrincipal: SessionPrincipalResolver): RequestHandler {
  const bearer = new BearerStrategy((token, done) => {
    if (!KEY_PATTERN.test(token)) return done(null, false);
    const found = keys.find(token);
    if (found instanceof Promise) found.then((key) => done(null, key ?? false), done);
    else done(null, found ?? false);
  });

  const verifyBearer = (req: Request, settle: (outcome: BearerOutcome) => void): void => {
    const attempt = Object.create(bearer) as BearerAttempt;
    attempt.success = (key) => settle({ key });
    attempt.fail = () => settle({ failed: true });
    attempt.error = (error) => settle({ error });
    // The strategy reads the header, the body and the query. A token in the body or the query has been
    // refused already, so it is shown the header and, only when the URL has a query string, the query:
    // the same outcome, without Express 5 parsing the query again for every call without one.
    attempt.authenticate({
      headers: req.headers,
      body: undefined,
      query: req.originalUrl.includes('?') ? req.query : undefined,
    } as Request);
  };

  const withSession = async (req: Request, next: NextFunction): Promise<void> => {
    const principal = await sessionPrincipal(req);
    if (!principal) throw unauthorized('Send an API key as `Authorization: Bearer <key>` or sign in.', REALM);
    req.principal = principal;
    next();
  };

  return (req, _res, next) => {
    if (tokenOutsideHeader(req)) {
      return next(
        new ProblemError({
          status: 400,
          title: 'Key in the wrong place',
          detail:
            'Send API keys only in the Authorization header (Bearer); keys in URLs or bodies are refused.',
          type: 'key-outside-header',
          headers: { 'WWW-Authenticate': `${REALM}, error="invalid_request"` },
        }),
      );
    }
    const header = req.headers.authorization;
    if (header === undefined) {
      withSession(req, next).catch(next);
      return;
    }
    if (!/^Bearer [^\s]+$/i.test(header)) {
      return next(
        unauthorized('The Authorization header must be `Bearer <key>`.', `${REALM}, error="invalid_request"`),
      );
    }
    verifyBearer(req, (outcome) => {
      if ('error' in outcome) return next(outcome.error);
      if ('failed' in outcome) {
        return next(
          unauthorized('The API key is unknown, revoked or expired.', `${REALM}, error="invalid_token"`),
        );
      }
      const { key } = outcome;
      if (key.role === null) {
        return next(
          new ProblemError({
            status: 403,
            title: 'Forbidden',
            detail: `This key's owner now has the role ${key.ownerRole}, which may not use API keys; the key works again only if an admin gives the owner a role that allows it.`,
            type: 'key-owner-role',
            headers: { 'WWW-Authenticate': `${REALM}, error="insufficient_scope"` },
          }),
        );
      }
      req.principal = {
        kind: 'key',
        role: key.role,
        userId: key.ownerId,
        keyId: key.id,
        rateLimitPerMinute: key.rateLimitPerMinute,
      };
      next();
    });
  };
}
