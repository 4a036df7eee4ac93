import type { Request, RequestHandler, Response } from 'express';
import { Passport } from 'passport';
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
  const query = new URL(req.originalUrl, 'http://localhost').searchParams;
  const body = req.body as Record<string, unknown> | undefined;
  return query.has('access_token') || (typeof body === 'object' && body !== null && 'access_token' in body);
}

/**
 * Every `/v1` call names its caller: an API key in the `Authorization` header, or a console session.
 * passport-http-bearer would also take a token from the query string or the body; those forms leak
 * into logs and histories, so they are refused before it runs.
 */
export function authenticate(keys: KeyStore, sessionPrincipal: SessionPrincipalResolver): RequestHandler {
  const passport = new Passport();
  passport.use(
    new BearerStrategy((token, done) => {
      if (!KEY_PATTERN.test(token)) return done(null, false);
      keys.findActive(token).then((key) => done(null, key ?? false), done);
    }),
  );
  const verifyBearer = (req: Request, res: Response): Promise<ActiveKey | false> =>
    new Promise((resolve, reject) => {
      passport.authenticate('bearer', { session: false }, (err: unknown, key: ActiveKey | false) =>
        err ? reject(err) : resolve(key),
      )(req, res, reject);
    });

  return async (req, res, next) => {
    if (tokenOutsideHeader(req)) {
      throw new ProblemError({
        status: 400,
        title: 'Key in the wrong place',
        detail:
          'Send API keys only in the Authorization header (Bearer); keys in URLs or bodies are refused.',
        type: 'key-outside-header',
        headers: { 'WWW-Authenticate': `${REALM}, error="invalid_request"` },
      });
    }
    const header = req.get('Authorization');
    if (header === undefined) {
      const principal = await sessionPrincipal(req);
      if (!principal)
        throw unauthorized('Send an API key as `Authorization: Bearer <key>` or sign in.', REALM);
      req.principal = principal;
      return next();
    }
    if (!/^Bearer [^\s]+$/i.test(header)) {
      throw unauthorized(
        'The Authorization header must be `Bearer <key>`.',
        `${REALM}, error="invalid_request"`,
      );
    }
    const key = await verifyBearer(req, res);
    if (!key) {
      throw unauthorized('The API key is unknown, revoked or expired.', `${REALM}, error="invalid_token"`);
    }
    req.principal = {
      kind: 'key',
      role: key.role,
      userId: key.ownerId,
      keyId: key.id,
      rateLimitPerMinute: key.rateLimitPerMinute,
    };
    next();
  };
}
