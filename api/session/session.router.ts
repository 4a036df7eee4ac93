import { Router } from 'express';
import { actorOf } from '../auth/actor';
import { ProblemError } from '../http/problem';
import { validate } from '../http/validate';
import type { Services } from '../services';
import {
  consoleRequestGuard,
  createSignInThrottles,
  normalizeEmail,
  recordSignedIn,
  recordSignedOut,
  recordSignInFailed,
  toConsoleUser,
  type ConsoleUser,
} from '.';
import { acceptInvitation } from '../users';
import { permissionsOf } from '../auth/permissions';

/** The session answer: who is signed in and what the server lets them do (one permission table). */
const sessionBody = (user: ConsoleUser) => ({
  user,
  permissions: [...permissionsOf({ kind: 'user', role: user.role, userId: user.id })],
});

// One answer for an unknown address, a wrong password, an account not yet activated and a disabled one.
const signInRefused = (): ProblemError =>
  new ProblemError({
    status: 401,
    title: 'Sign-in failed',
    detail: 'The e-mail address or the password is wrong.',
    type: 'sign-in-failed',
  });

const notSignedIn = (): ProblemError =>
  new ProblemError({
    status: 401,
    title: 'Not signed in',
    detail: 'Sign in with POST /auth/session.',
    type: 'not-signed-in',
  });

/** Console sign-in under `/auth` (outside `/v1`): sign in, who am I, sign out, take up an invitation. */
export function sessionRouter(services: Services): Router {
  const { db, sessions } = services;
  const throttles = createSignInThrottles(undefined, undefined, (name, limits, now) =>
    services.shared.throttleCounter(name, limits, now),
  );
  const router = Router();
  router.use(consoleRequestGuard(services.config.publicUrl));
  router.use(sessions.middleware);

  router.get(
    '/session',
    validate('getSession', (_input, req, res) => {
      if (!req.user) throw notSignedIn();
      res.json(sessionBody(req.user as ConsoleUser));
    }),
  );

  router.post(
    '/session',
    validate('signIn', throttles.signIn, async ({ body }, req, res) => {
      const check = await sessions.checkPassword(req, res);
      if ('failure' in check) {
        await recordSignInFailed(db, req, check.failure, normalizeEmail(body.email));
        throw signInRefused();
      }
      await sessions.signIn(req, check.user);
      await recordSignedIn(db, req, check.user.id);
      res.json(sessionBody(check.user));
    }),
  );

  router.delete(
    '/session',
    validate('signOut', async (_input, req, res) => {
      const user = req.user as ConsoleUser | undefined;
      if (user) {
        await recordSignedOut(db, req, user.id);
        await sessions.signOut(req, res);
      }
      res.status(204).end();
    }),
  );

  router.post(
    '/invitations/accept',
    validate('acceptInvitation', throttles.invitation, async ({ body }, req, res) => {
      const { token, password } = body;
      const user = toConsoleUser(await acceptInvitation(services, actorOf(req), token, password));
      await sessions.signIn(req, user);
      await recordSignedIn(db, req, user.id);
      res.json(sessionBody(user));
    }),
  );

  return router;
}
