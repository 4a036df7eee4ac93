import request from 'supertest';
import {
  CONSOLE_HEADERS,
  givePasswords,
  sessionCookie,
  sessionIdOf,
  signedInAgent,
  TEST_EMAILS,
  TEST_PASSWORD,
} from '../support/console-session';
import { storedSession } from '../support/stored-sessions';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;

beforeAll(async () => {
  ctx = await createTestContext();
  await givePasswords(ctx);
});

afterAll(async () => {
  await ctx.close();
});

const auditActions = async (targetId: string): Promise<string[]> =>
  (await ctx.db.models.AuditEvent.findAll({ where: { targetId }, order: [['createdAt', 'ASC']] })).map(
    (e) => e.action,
  );

describe('sign in, who am I, sign out', () => {
  it('signs in with e-mail and password and sets a HttpOnly, SameSite session cookie', async () => {
    const res = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: TEST_EMAILS.developer, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    // The answer carries the server's own permissions for the role, so the console keeps no table of its own.
    expect(res.body).toEqual({
      user: { id: ctx.users.developer, email: TEST_EMAILS.developer, name: null, role: 'developer' },
      permissions: ['calculate', 'tuning', 'keys:own', 'usage:own'],
    });
    const setCookie = (res.headers['set-cookie'] as unknown as string[]).find((c) =>
      c.startsWith('isochron.sid='),
    )!;
    expect(setCookie).toMatch(/; HttpOnly/);
    expect(setCookie).toMatch(/; SameSite=Strict/);
    expect(setCookie).toMatch(/; Path=\//);
    // Secure only in production (the test service speaks plain HTTP).
    expect(setCookie).not.toMatch(/; Secure/);
  });

  it('answers who am I while signed in, and 401 problem+json when not', async () => {
    const agent = await signedInAgent(ctx, 'viewer');
    const me = await agent.get('/auth/session');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ id: ctx.users.viewer, role: 'viewer' });

    const anonymous = await request(ctx.app).get('/auth/session');
    expect(anonymous.status).toBe(401);
    expect(anonymous.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(anonymous.body).toMatchObject({ status: 401, title: 'Not signed in' });
  });

  it('matches e-mail addresses without regard to case or surrounding spaces', async () => {
    const res = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: '  Dev@TEST.example ', password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user.id).toBe(ctx.users.developer);
  });

  it('signs out with 204, and the old cookie no longer works', async () => {
    const agent = request.agent(ctx.app);
    const signIn = await agent
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: TEST_EMAILS.viewer, password: TEST_PASSWORD });
    const cookie = sessionCookie(signIn)!;
    const out = await agent.delete('/auth/session').set(CONSOLE_HEADERS);
    expect(out.status).toBe(204);
    expect((out.headers['set-cookie'] as unknown as string[]).join('\n')).toMatch(
      /isochron\.sid=;.*Expires=Thu, 01 Jan 1970/,
    );
    expect(sessionCookie(out)).toBeUndefined();
    expect((await agent.get('/auth/session')).status).toBe(401);
    // Replaying the cookie by hand: the session is gone on the server, not just in the browser.
    const replay = await request(ctx.app).get('/auth/session').set('Cookie', `isochron.sid=${cookie}`);
    expect(replay.status).toBe(401);
    expect(await storedSession(ctx, sessionIdOf(cookie)).data()).toBeNull();
  });

  it('answers sign-out without a session with 204 too', async () => {
    expect((await request(ctx.app).delete('/auth/session').set(CONSOLE_HEADERS)).status).toBe(204);
  });

  it('rolls the session forward: every signed-in answer renews the cookie', async () => {
    const agent = await signedInAgent(ctx, 'developer');
    const res = await agent.get('/auth/session');
    const renewed = (res.headers['set-cookie'] as unknown as string[]).find((c) =>
      c.startsWith('isochron.sid='),
    );
    expect(renewed).toMatch(/Expires=/);
  });

  it('records sign-in and sign-out in the audit trail and stamps lastSignInAt', async () => {
    await ctx.db.write((t) =>
      ctx.db.models.User.update({ lastSignInAt: null }, { where: { id: ctx.users.other }, transaction: t }),
    );
    const agent = await signedInAgent(ctx, 'other');
    await agent.delete('/auth/session').set(CONSOLE_HEADERS);
    const actions = await auditActions(ctx.users.other);
    expect(actions).toEqual(expect.arrayContaining(['session.signedIn', 'session.signedOut']));
    const signedIn = await ctx.db.models.AuditEvent.findOne({
      where: { targetId: ctx.users.other, action: 'session.signedIn' },
    });
    expect(signedIn!.actorUserId).toBe(ctx.users.other);
    const user = await ctx.db.models.User.findByPk(ctx.users.other);
    expect(user!.lastSignInAt).toBeInstanceOf(Date);
  });

  it('refuses a body with extra fields or missing password with 400 naming the field', async () => {
    const res = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: TEST_EMAILS.admin });
    expect(res.status).toBe(400);
    expect(res.body.errors).toEqual(
      expect.arrayContaining([expect.objectContaining({ pointer: '/body/password' })]),
    );
    const extra = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: TEST_EMAILS.admin, password: TEST_PASSWORD, role: 'admin' });
    expect(extra.status).toBe(400);
    expect(extra.body.errors).toEqual(
      expect.arrayContaining([expect.objectContaining({ pointer: '/body/role' })]),
    );
  });

  it('refuses credentials sent in the query string', async () => {
    const res = await request(ctx.app)
      .post(`/auth/session?email=${TEST_EMAILS.admin}&password=${TEST_PASSWORD}`)
      .set(CONSOLE_HEADERS)
      .send({});
    expect(res.status).toBe(400);
    expect(sessionCookie(res)).toBeUndefined();
  });
});

describe('a signed-in user on /v1 gets the same role checks as a key', () => {
  it('lets an admin session list users, and refuses developer and viewer sessions with 403', async () => {
    const admin = await signedInAgent(ctx, 'admin');
    expect((await admin.get('/v1/users')).status).toBe(200);
    for (const who of ['developer', 'viewer'] as const) {
      const agent = await signedInAgent(ctx, who);
      const res = await agent.get('/v1/users');
      expect(res.status).toBe(403);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      // A session is not a bearer key: no Bearer challenge on its refusals.
      expect(res.headers['www-authenticate']).toBeUndefined();
    }
  });

  it('answers GET /v1/users/me for every role', async () => {
    for (const who of ['admin', 'developer', 'viewer'] as const) {
      const agent = await signedInAgent(ctx, who);
      const res = await agent.get('/v1/users/me');
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({
        id: ctx.users[who],
        email: TEST_EMAILS[who],
        role: who,
        status: 'active',
      });
      expect(res.body).not.toHaveProperty('passwordHash');
    }
  });

  it('uses the API key, not the session, when a request carries both', async () => {
    const viewer = await signedInAgent(ctx, 'viewer');
    const withAdminKey = await viewer.get('/v1/users').set('Authorization', `Bearer ${ctx.keys.admin}`);
    expect(withAdminKey.status).toBe(200);
    const admin = await signedInAgent(ctx, 'admin');
    const withCalculateKey = await admin
      .get('/v1/users')
      .set('Authorization', `Bearer ${ctx.keys.calculate}`);
    expect(withCalculateKey.status).toBe(403);
  });

  it('applies a role change to a session that is already open', async () => {
    const developer = await signedInAgent(ctx, 'other');
    expect((await developer.get('/v1/users')).status).toBe(403);
    const promote = await request(ctx.app)
      .patch(`/v1/users/${ctx.users.other}`)
      .set('Authorization', `Bearer ${ctx.keys.admin}`)
      .send({ role: 'admin' });
    expect(promote.status).toBe(200);
    expect((await developer.get('/v1/users')).status).toBe(200);
    expect((await developer.get('/auth/session')).body.user.role).toBe('admin');
    await request(ctx.app)
      .patch(`/v1/users/${ctx.users.other}`)
      .set('Authorization', `Bearer ${ctx.keys.admin}`)
      .send({ role: 'developer' });
    expect((await developer.get('/v1/users')).status).toBe(403);
  });

  it('answers /v1 without key or session with 401', async () => {
    expect((await request(ctx.app).get('/v1/users/me')).status).toBe(401);
    const forged = await request(ctx.app)
      .get('/v1/users/me')
      .set('Cookie', 'isochron.sid=s%3Anot-a-session.bad-signature');
    expect(forged.status).toBe(401);
  });
});

describe('session lifetime', () => {
  it('keeps sessions under a hash of the session id, never the id itself', async () => {
    const res = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: TEST_EMAILS.viewer, password: TEST_PASSWORD });
    const sid = sessionIdOf(sessionCookie(res)!);
    expect(await storedSession(ctx, sid, { unhashed: true }).data()).toBeNull();
    const data = await storedSession(ctx, sid).data();
    expect(data).toContain(ctx.users.viewer);
    expect(data).not.toContain(TEST_PASSWORD);
  });

  it('ends a session that has been idle past its expiry', async () => {
    const res = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: TEST_EMAILS.viewer, password: TEST_PASSWORD });
    const cookie = sessionCookie(res)!;
    await storedSession(ctx, sessionIdOf(cookie)).expire();
    expect((await request(ctx.app).get('/auth/session').set('Cookie', `isochron.sid=${cookie}`)).status).toBe(
      401,
    );
  });

  it('ends a session 24 hours after sign-in even when it is busy', async () => {
    const res = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: TEST_EMAILS.viewer, password: TEST_PASSWORD });
    const cookie = sessionCookie(res)!;
    const check = () => request(ctx.app).get('/auth/session').set('Cookie', `isochron.sid=${cookie}`);
    expect((await check()).status).toBe(200);
    const stored = storedSession(ctx, sessionIdOf(cookie));
    const data = JSON.parse((await stored.data())!);
    data.passport.user.signedInAt = Date.now() - 24 * 60 * 60_000 - 1000;
    await stored.setData(JSON.stringify(data));
    expect((await check()).status).toBe(401);
  });
});
