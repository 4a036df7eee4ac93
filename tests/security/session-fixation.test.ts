import request from 'supertest';
import {
  CONSOLE_HEADERS,
  givePasswords,
  sessionCookie,
  sessionIdOf,
  TEST_EMAILS,
  TEST_PASSWORD,
} from '../support/console-session';
import { storedSession } from '../support/stored-sessions';
import { createTestContext, type TestContext } from '../support/test-context';

// Session fixation (OWASP Session Management Cheat Sheet: "renew the session ID after any privilege level
// change"): a session id known before sign-in must never become the signed-in session.

let ctx: TestContext;

beforeAll(async () => {
  ctx = await createTestContext();
  await givePasswords(ctx);
});

afterAll(async () => {
  await ctx.close();
});

const signInWithCookie = (email: string, cookie: string) =>
  request(ctx.app)
    .post('/auth/session')
    .set(CONSOLE_HEADERS)
    .set('Cookie', `isochron.sid=${cookie}`)
    .send({ email, password: TEST_PASSWORD });

describe('session fixation', () => {
  it('gives a new session id at sign-in, and the planted one does not become the victim’s session', async () => {
    // The attacker signs in with their own low-privilege account and plants that cookie in the victim's browser.
    const attacker = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: TEST_EMAILS.viewer, password: TEST_PASSWORD });
    const planted = sessionCookie(attacker)!;

    const victim = await signInWithCookie(TEST_EMAILS.admin, planted);
    expect(victim.status).toBe(200);
    const issued = sessionCookie(victim)!;
    expect(sessionIdOf(issued)).not.toBe(sessionIdOf(planted));

    // The planted cookie does not carry the admin: it was destroyed when the session was regenerated.
    const withPlanted = await request(ctx.app).get('/auth/session').set('Cookie', `isochron.sid=${planted}`);
    expect(withPlanted.status).toBe(401);
    expect((await request(ctx.app).get('/v1/users').set('Cookie', `isochron.sid=${planted}`)).status).toBe(
      401,
    );
    const withIssued = await request(ctx.app).get('/auth/session').set('Cookie', `isochron.sid=${issued}`);
    expect(withIssued.body.user.id).toBe(ctx.users.admin);
  });

  it('ignores a made-up session id and stores nothing under it', async () => {
    const chosen = 'attacker-chosen-session-id-000000';
    const res = await signInWithCookie(TEST_EMAILS.developer, `s%3A${chosen}.bad`);
    expect(res.status).toBe(200);
    expect(sessionIdOf(sessionCookie(res)!)).not.toBe(chosen);
    expect(await storedSession(ctx, chosen).data()).toBeNull();
    // An unsigned id is not even read: express-session checks the cookie's HMAC signature first.
    const unsigned = await request(ctx.app).get('/auth/session').set('Cookie', `isochron.sid=${chosen}`);
    expect(unsigned.status).toBe(401);
  });

  it('issues ids with at least 128 bits of randomness, different every time', async () => {
    const ids = new Set<string>();
    for (let i = 0; i < 5; i++) {
      const res = await request(ctx.app)
        .post('/auth/session')
        .set(CONSOLE_HEADERS)
        .send({ email: TEST_EMAILS.viewer, password: TEST_PASSWORD });
      const id = sessionIdOf(sessionCookie(res)!);
      // express-session draws 24 bytes (uid-safe): 32 base64url characters = 192 bits; OWASP asks for at least 64 bits of entropy.
      expect(id).toMatch(/^[A-Za-z0-9_-]{32}$/);
      ids.add(id);
    }
    expect(ids.size).toBe(5);
  });

  it('does not issue a session cookie before sign-in', async () => {
    for (const res of [await request(ctx.app).get('/auth/session'), await request(ctx.app).get('/healthz')]) {
      expect(sessionCookie(res)).toBeUndefined();
    }
    const failed = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: TEST_EMAILS.viewer, password: 'not-the-password' });
    expect(failed.status).toBe(401);
    expect(sessionCookie(failed)).toBeUndefined();
  });
});
