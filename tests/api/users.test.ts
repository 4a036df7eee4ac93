import { createHash } from 'node:crypto';
import request from 'supertest';
import {
  CONSOLE_HEADERS,
  givePasswords,
  sessionCookie,
  signedInAgent,
  TEST_PASSWORD,
} from '../support/console-session';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
const asAdmin = () => ({ Authorization: `Bearer ${ctx.keys.admin}` });

beforeAll(async () => {
  ctx = await createTestContext();
  await givePasswords(ctx);
});

afterAll(async () => {
  await ctx.close();
});

const tokenOf = (url: string): string => new URL(url).searchParams.get('token')!;

async function invite(email: string, role = 'developer', name?: string) {
  const res = await request(ctx.app)
    .post('/v1/users')
    .set(asAdmin())
    .send({ email, role, ...(name && { name }) });
  if (res.status !== 201) throw new Error(`invite failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as {
    user: { id: string; email: string };
    invitation: { url: string; expiresAt: string; emailSent: boolean };
  };
}

const accept = (token: string, password = 'first-light-at-stage-3') =>
  request(ctx.app).post('/auth/invitations/accept').set(CONSOLE_HEADERS).send({ token, password });

describe('GET /v1/users', () => {
  it('lists users oldest first, one page at a time, without password hashes', async () => {
    const first = await request(ctx.app).get('/v1/users?limit=2').set(asAdmin());
    expect(first.status).toBe(200);
    expect(first.body.data.map((u: { id: string }) => u.id)).toEqual([ctx.users.admin, ctx.users.developer]);
    expect(first.body.hasMore).toBe(true);
    const second = await request(ctx.app)
      .get(`/v1/users?limit=2&startingAfter=${ctx.users.developer}`)
      .set(asAdmin());
    expect(second.body.data.map((u: { id: string }) => u.id)).toEqual([ctx.users.viewer, ctx.users.other]);
    for (const user of [...first.body.data, ...second.body.data]) {
      expect(Object.keys(user).sort()).toEqual([
        'createdAt',
        'email',
        'id',
        'lastSignInAt',
        'name',
        'role',
        'status',
        'updatedAt',
      ]);
    }
  });

  it('refuses a page size outside 1–100 naming the parameter', async () => {
    const res = await request(ctx.app).get('/v1/users?limit=500').set(asAdmin());
    expect(res.status).toBe(400);
    expect(res.body.errors[0].pointer).toBe('/query/limit');
  });
});

describe('POST /v1/users (invite)', () => {
  it('creates an invited user, stores only a hash of the token, e-mails the link and returns it', async () => {
    const res = await request(ctx.app)
      .post('/v1/users')
      .set(asAdmin())
      .send({ email: 'Foley.Artist@Test.example', role: 'viewer', name: 'Foley artist' });
    expect(res.status).toBe(201);
    expect(res.headers.location).toBe(`/v1/users/${res.body.user.id}`);
    expect(res.body.user).toMatchObject({
      email: 'foley.artist@test.example',
      role: 'viewer',
      status: 'invited',
      name: 'Foley artist',
    });
    const { url, expiresAt, emailSent } = res.body.invitation;
    expect(emailSent).toBe(true);
    expect(url).toMatch(/^http:\/\/localhost:8080\/accept-invitation\?token=[A-Za-z0-9_-]{43}$/);
    // 7 days, give or take the request's own duration.
    const lifetimeMs = new Date(expiresAt).getTime() - new Date(res.body.user.createdAt).getTime();
    expect(Math.abs(lifetimeMs - 7 * 24 * 3600_000)).toBeLessThan(60_000);

    const rows = await ctx.db.models.Invitation.findAll({ where: { userId: res.body.user.id } });
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).toBe(createHash('sha256').update(tokenOf(url)).digest('hex'));

    const outbox = await request(ctx.app).get('/v1/outbox').set(asAdmin());
    const mail = outbox.body.data.find((m: { to: string }) => m.to === 'foley.artist@test.example');
    expect(mail.subject).toBe('You are invited to the Isochron console');
    expect(mail.text).toContain(url);
    expect(mail.text).toContain('Hello Foley artist,');
    expect(mail.text).toContain('admin@test.example invited you');

    const audit = await ctx.db.models.AuditEvent.findOne({
      where: { action: 'user.invited', targetId: res.body.user.id },
    });
    expect(audit!.actorKeyId).not.toBeNull();
    expect(audit!.details).not.toContain(tokenOf(url));
  });

  it('refuses an address already in use, whatever its case, with 409 naming the field', async () => {
    const res = await request(ctx.app)
      .post('/v1/users')
      .set(asAdmin())
      .send({ email: 'VIEWER@test.example', role: 'viewer' });
    expect(res.status).toBe(409);
    expect(res.body.errors).toEqual([{ pointer: '/body/email', message: 'is already in use' }]);
  });

  it('refuses a malformed address, an unknown role and extra fields, naming each', async () => {
    const res = await request(ctx.app)
      .post('/v1/users')
      .set(asAdmin())
      .send({ email: 'not-an-address', role: 'owner', password: 'x' });
    expect(res.status).toBe(400);
    const pointers = res.body.errors.map((e: { pointer: string }) => e.pointer);
    expect(pointers).toEqual(expect.arrayContaining(['/body/email', '/body/role', '/body/password']));
  });
});

describe('POST /auth/invitations/accept', () => {
  it('sets the password, activates the user and signs them in — once', async () => {
    const { user, invitation } = await invite('sound.designer@test.example');
    const token = tokenOf(invitation.url);
    const agent = request.agent(ctx.app);
    const res = await agent
      .post('/auth/invitations/accept')
      .set(CONSOLE_HEADERS)
      .send({ token, password: 'first-light-at-stage-3' });
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({
      id: user.id,
      email: 'sound.designer@test.example',
      name: null,
      role: 'developer',
    });
    expect(sessionCookie(res)).toBeDefined();
    expect((await agent.get('/auth/session')).body.user.id).toBe(user.id);
    expect((await ctx.db.models.User.findByPk(user.id))!.status).toBe('active');

    const again = await accept(token, 'another-password-entirely');
    expect(again.status).toBe(400);
    expect(again.body.detail).toMatch(/already been used/);
    expect(again.body.errors[0].pointer).toBe('/body/token');

    const signIn = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: 'sound.designer@test.example', password: 'first-light-at-stage-3' });
    expect(signIn.status).toBe(200);
    const actions = (await ctx.db.models.AuditEvent.findAll({ where: { targetId: user.id } })).map(
      (e) => e.action,
    );
    expect(actions).toEqual(expect.arrayContaining(['user.invited', 'user.passwordSet', 'session.signedIn']));
  });

  it('refuses an expired token', async () => {
    const { user, invitation } = await invite('late.arrival@test.example');
    await ctx.db.write((t) =>
      ctx.db.models.Invitation.update(
        { expiresAt: new Date(Date.now() - 1000) },
        { where: { userId: user.id }, transaction: t },
      ),
    );
    const res = await accept(tokenOf(invitation.url));
    expect(res.status).toBe(400);
    expect(res.body.detail).toMatch(/expired/);
    expect((await ctx.db.models.User.findByPk(user.id))!.status).toBe('invited');
  });

  it('refuses an unknown token, and a token for a user disabled meanwhile', async () => {
    expect((await accept('A'.repeat(43))).status).toBe(400);
    const { user, invitation } = await invite('changed.mind@test.example');
    await request(ctx.app).patch(`/v1/users/${user.id}`).set(asAdmin()).send({ status: 'disabled' });
    const res = await accept(tokenOf(invitation.url));
    expect(res.status).toBe(400);
    expect(res.body.detail).toMatch(/no longer valid/);
  });

  it('refuses a short password (400) and one built from the e-mail address (422), leaving the token usable', async () => {
    const { invitation } = await invite('dialogue.editor@test.example');
    const token = tokenOf(invitation.url);
    const short = await accept(token, 'short');
    expect(short.status).toBe(400);
    expect(short.body.errors[0].pointer).toBe('/body/password');
    const fromEmail = await accept(token, 'Dialogue.Editor-2026');
    expect(fromEmail.status).toBe(422);
    expect(fromEmail.body.errors[0].pointer).toBe('/body/password');
    expect((await accept(token)).status).toBe(200);
  });

  it('lets an admin issue a new link that replaces the old one', async () => {
    const { user, invitation } = await invite('second.try@test.example');
    const res = await request(ctx.app).post(`/v1/users/${user.id}/invitations`).set(asAdmin());
    expect(res.status).toBe(201);
    expect(res.body.invitation.url).not.toBe(invitation.url);
    expect((await accept(tokenOf(invitation.url))).status).toBe(400);
    expect((await accept(tokenOf(res.body.invitation.url))).status).toBe(200);
    const afterAccept = await request(ctx.app).post(`/v1/users/${user.id}/invitations`).set(asAdmin());
    expect(afterAccept.status).toBe(409);
  });
});

describe('PATCH /v1/users/{userId}', () => {
  it('changes a role and records user.roleChanged with from and to', async () => {
    const { user } = await invite('assistant@test.example', 'viewer');
    const res = await request(ctx.app)
      .patch(`/v1/users/${user.id}`)
      .set(asAdmin())
      .send({ role: 'developer' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('developer');
    const event = await ctx.db.models.AuditEvent.findOne({
      where: { action: 'user.roleChanged', targetId: user.id },
    });
    expect(JSON.parse(event!.details!)).toEqual({ from: 'viewer', to: 'developer', keys: [] });
  });

  it('disables a user: sign-in refused, open sessions end, user.disabled recorded; re-enabling restores', async () => {
    const session = await signedInAgent(ctx, 'viewer');
    const res = await request(ctx.app)
      .patch(`/v1/users/${ctx.users.viewer}`)
      .set(asAdmin())
      .send({ status: 'disabled' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('disabled');
    expect((await session.get('/auth/session')).status).toBe(401);
    expect((await session.get('/v1/users/me')).status).toBe(401);
    const signIn = await request(ctx.app)
      .post('/auth/session')
      .set(CONSOLE_HEADERS)
      .send({ email: 'viewer@test.example', password: TEST_PASSWORD });
    expect(signIn.status).toBe(401);
    expect(
      await ctx.db.models.AuditEvent.count({
        where: { action: 'user.disabled', targetId: ctx.users.viewer },
      }),
    ).toBe(1);

    const enable = await request(ctx.app)
      .patch(`/v1/users/${ctx.users.viewer}`)
      .set(asAdmin())
      .send({ status: 'active' });
    expect(enable.body.status).toBe('active');
    expect((await signedInAgent(ctx, 'viewer').then((a) => a.get('/auth/session'))).status).toBe(200);
  });

  it('sends a disabled user who never accepted back to invited, and will not activate an invited one', async () => {
    const { user } = await invite('pending@test.example');
    const activate = await request(ctx.app)
      .patch(`/v1/users/${user.id}`)
      .set(asAdmin())
      .send({ status: 'active' });
    expect(activate.status).toBe(409);
    await request(ctx.app).patch(`/v1/users/${user.id}`).set(asAdmin()).send({ status: 'disabled' });
    const enable = await request(ctx.app)
      .patch(`/v1/users/${user.id}`)
      .set(asAdmin())
      .send({ status: 'active' });
    expect(enable.body.status).toBe('invited');
  });

  it('does not let an admin demote or disable themselves', async () => {
    const admin = await signedInAgent(ctx, 'admin');
    const demote = await admin
      .patch(`/v1/users/${ctx.users.admin}`)
      .set(CONSOLE_HEADERS)
      .send({ role: 'viewer' });
    expect(demote.status).toBe(409);
    expect(demote.body.errors[0].pointer).toBe('/body/role');
    const disable = await admin
      .patch(`/v1/users/${ctx.users.admin}`)
      .set(CONSOLE_HEADERS)
      .send({ status: 'disabled' });
    expect(disable.status).toBe(409);
    // The admin key acts for its owner, the same admin.
    const byKey = await request(ctx.app)
      .patch(`/v1/users/${ctx.users.admin}`)
      .set(asAdmin())
      .send({ status: 'disabled' });
    expect(byKey.status).toBe(409);
    const user = await ctx.db.models.User.findByPk(ctx.users.admin);
    expect(user).toMatchObject({ role: 'admin', status: 'active' });
    // Renaming oneself is fine.
    const rename = await admin
      .patch(`/v1/users/${ctx.users.admin}`)
      .set(CONSOLE_HEADERS)
      .send({ name: 'Head of post' });
    expect(rename.body.name).toBe('Head of post');
    const clear = await admin.patch(`/v1/users/${ctx.users.admin}`).set(CONSOLE_HEADERS).send({ name: null });
    expect(clear.body.name).toBeNull();
  });

  it('answers an unknown user with 404 and an empty change with 400', async () => {
    expect(
      (await request(ctx.app).patch('/v1/users/usr_nobody').set(asAdmin()).send({ role: 'viewer' })).status,
    ).toBe(404);
    expect((await request(ctx.app).get('/v1/users/usr_nobody').set(asAdmin())).status).toBe(404);
    expect(
      (await request(ctx.app).patch(`/v1/users/${ctx.users.developer}`).set(asAdmin()).send({})).status,
    ).toBe(400);
  });
});

describe('only admins manage users', () => {
  const calls: Array<[string, string, object?]> = [
    ['get', '/v1/users'],
    ['post', '/v1/users', { email: 'intruder@test.example', role: 'admin' }],
    ['get', '/v1/users/USER'],
    ['patch', '/v1/users/USER', { role: 'admin' }],
    ['post', '/v1/users/USER/invitations'],
    ['get', '/v1/outbox'],
  ];

  it.each(['calculate', 'tuning', 'otherTuning'] as const)(
    'refuses a %s key with 403 insufficient_scope',
    async (key) => {
      for (const [method, path, body] of calls) {
        const client = request(ctx.app);
        const call = client[method as 'get'](path.replace('USER', ctx.users.developer)).set(
          'Authorization',
          `Bearer ${ctx.keys[key]}`,
        );
        const res = body ? await call.send(body) : await call;
        expect([method, path, res.status]).toEqual([method, path, 403]);
        expect(res.headers['www-authenticate']).toContain('insufficient_scope');
      }
    },
  );

  it.each(['developer', 'viewer'] as const)('refuses a %s session with 403', async (who) => {
    const agent = await signedInAgent(ctx, who);
    for (const [method, path, body] of calls) {
      const call = agent[method as 'get'](path.replace('USER', ctx.users.developer)).set(CONSOLE_HEADERS);
      const res = body ? await call.send(body) : await call;
      expect([method, path, res.status]).toEqual([method, path, 403]);
    }
    expect(await ctx.db.models.User.count({ where: { email: 'intruder@test.example' } })).toBe(0);
    expect((await ctx.db.models.User.findByPk(ctx.users.developer))!.role).toBe('developer');
  });

  it('answers GET /v1/users/me for a key with its owner', async () => {
    const res = await request(ctx.app)
      .get('/v1/users/me')
      .set('Authorization', `Bearer ${ctx.keys.calculate}`);
    expect(res.status).toBe(200);
    expect(res.body.id).toBe(ctx.users.developer);
  });
});

describe('GET /v1/outbox', () => {
  it('lists sent mail newest first with cursor pagination', async () => {
    await invite('outbox.one@test.example');
    await invite('outbox.two@test.example');
    const first = await request(ctx.app).get('/v1/outbox?limit=1').set(asAdmin());
    expect(first.status).toBe(200);
    expect(first.body.data[0].to).toBe('outbox.two@test.example');
    expect(first.body.hasMore).toBe(true);
    const second = await request(ctx.app)
      .get(`/v1/outbox?limit=1&startingAfter=${first.body.data[0].id}`)
      .set(asAdmin());
    expect(second.body.data[0].to).toBe('outbox.one@test.example');
    expect(Object.keys(second.body.data[0]).sort()).toEqual(['id', 'sentAt', 'subject', 'text', 'to']);
  });
});
