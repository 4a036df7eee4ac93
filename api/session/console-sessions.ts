import type { Request, RequestHandler, Response } from 'express';
import session from 'express-session';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { SessionPrincipalResolver } from '../auth/authenticate';
import type { Principal } from '../auth/permissions';
import type { Config } from '../config';
import type { Database } from '../db/database';
import type { SharedState } from '../shared-state/shared-state';
import type { User, UserRole } from '../db/models/user';
import { checkCredentials, type CredentialCheck } from './credentials';
import { crossSiteProblem, isStateChanging } from './console-request-guard';
import { SqliteSessionStore } from './session-store';

export const SESSION_COOKIE = 'isochron.sid';
/** Signed out after this long without a request (the cookie and the stored session roll forward). */
export const SESSION_IDLE_MS = 8 * 60 * 60_000;
/** Signed out this long after signing in, however busy the session (OWASP session management: absolute timeout). */
export const SESSION_ABSOLUTE_MS = 24 * 60 * 60_000;

/** The signed-in console user, as `/auth/session` shows it. */
export interface ConsoleUser {
  id: string;
  email: string;
  name: string | null;
  role: UserRole;
}

/** What the session keeps about its user: the id and when they signed in. */
interface StoredSignIn {
  id: string;
  signedInAt: number;
}

export type PasswordCheck = { user: ConsoleUser } | { failure: Extract<CredentialCheck, { ok: false }> };

export interface ConsoleSessions {
  /** express-session and passport for the `/auth` routes; sets `req.user` and `req.principal`. */
  middleware: RequestHandler[];
  /** The `/v1` resolver: a signed-in console user, or null. Refuses cross-site writes. */
  principal: SessionPrincipalResolver;
  /** Runs the passport-local strategy on the request's validated body. */
  checkPassword(req: Request, res: Response): Promise<PasswordCheck>;
  /** Starts a session for the user under a new session id (passport regenerates it). */
  signIn(req: Request, user: ConsoleUser): Promise<void>;
  signOut(req: Request, res: Response): Promise<void>;
  close(): void;
}

export const toConsoleUser = (user: User): ConsoleUser => ({
  id: user.id,
  email: user.email,
  name: user.name,
  role: user.role,
});

const toPrincipal = (user: ConsoleUser): Principal => ({ kind: 'user', role: user.role, userId: user.id });

function run(middleware: RequestHandler, req: Request, res: Response): Promise<void> {
  return new Promise((resolve, reject) => {
    void middleware(req, res, (err?: unknown) => (err ? reject(err) : resolve()));
  });
}

const hasSessionCookie = (req: Request): boolean =>
  (req.headers.cookie ?? '').split(';').some((part) => part.trim().startsWith(`${SESSION_COOKIE}=`));

/**
 * Console sessions: passport-local on its own Passport instance, express-session on the database's
 * `sessions` table, or in Redis (connect-redis) when instances share one.
 */
export function createConsoleSessions(
  services: { config: Config; db: Database; shared?: SharedState },
  now: () => number = Date.now,
): ConsoleSessions {
  const { config, db } = services;
  const sharedStore = services.shared?.sessionStore() ?? null;
  const tableStore = sharedStore ? null : new SqliteSessionStore(db, now);
  const store: session.Store = sharedStore ?? (tableStore as SqliteSessionStore);
  const secure = config.env === 'production';
  const cookie: session.CookieOptions = {
    httpOnly: true,
    sameSite: 'strict',
    secure,
    maxAge: SESSION_IDLE_MS,
    path: '/',
  };
  const sessionMiddleware = session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    unset: 'destroy',
    cookie,
  });

  const passport = new Passport();
  passport.use(
    new LocalStrategy(
      { usernameField: 'email', passwordField: 'password', session: false },
      (email, password, done) => {
        checkCredentials(db.models, email, password).then(
          (check) =>
            check.ok
              ? done(null, toConsoleUser(check.user))
              : done(null, false, { message: check.reason, ...check }),
          done,
        );
      },
    ),
  );
  passport.serializeUser<StoredSignIn>((user, done) =>
    done(null, { id: (user as ConsoleUser).id, signedInAt: now() }),
  );
  // Read on every request, so a disabled user or a changed role takes effect at once.
  passport.deserializeUser((stored: unknown, done) => {
    const signIn = stored as Partial<StoredSignIn> | null;
    if (
      typeof signIn?.id !== 'string' ||
      typeof signIn.signedInAt !== 'number' ||
      now() - signIn.signedInAt > SESSION_ABSOLUTE_MS
    ) {
      return done(null, false);
    }
    db.models.User.findByPk(signIn.id).then(
      (user) => done(null, user && user.status === 'active' ? toConsoleUser(user) : false),
      done,
    );
  });
  const initialize = passport.initialize() as RequestHandler;
  const restore = passport.session() as RequestHandler;
  const setPrincipal: RequestHandler = (req, _res, next) => {
    if (req.user) req.principal = toPrincipal(req.user as ConsoleUser);
    next();
  };
  const middleware = [sessionMiddleware, initialize, restore, setPrincipal];
  const publicOrigin = new URL(config.publicUrl).origin;

  return {
    middleware,
    async principal(req) {
      if (!hasSessionCookie(req)) return null;
      // Checked before the session is even read: a forged request learns nothing and changes nothing.
      if (isStateChanging(req.method)) {
        const problem = crossSiteProblem(req, publicOrigin);
        if (problem) throw problem;
      }
      const res = req.res as Response;
      for (const step of middleware) await run(step, req, res);
      return req.principal ?? null;
    },
    checkPassword(req, res) {
      return new Promise((resolve, reject) => {
        const callback = (err: unknown, user: ConsoleUser | false, info?: unknown) => {
          if (err) return reject(err);
          if (user) return resolve({ user });
          const failure = info as Extract<CredentialCheck, { ok: false }> | undefined;
          resolve({
            failure: failure?.reason ? failure : { ok: false, reason: 'unknownEmail', userId: null },
          });
        };
        void passport.authenticate('local', { session: false }, callback)(req, res, reject);
      });
    },
    signIn(req, user) {
      return new Promise((resolve, reject) => {
        req.login(user, (err?: unknown) => {
          if (err) return reject(err);
          req.principal = toPrincipal(user);
          resolve();
        });
      });
    },
    signOut(req, res) {
      return new Promise((resolve, reject) => {
        req.logout((logoutError?: unknown) => {
          if (logoutError) return reject(logoutError);
          // passport leaves a fresh, empty session behind; drop it so no new cookie is issued.
          req.session.destroy((destroyError?: unknown) => {
            if (destroyError) return reject(destroyError);
            res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'strict', secure, path: '/' });
            resolve();
          });
        });
      });
    },
    close: () => tableStore?.close(),
  };
}
