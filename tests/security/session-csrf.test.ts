import request from 'supertest';
import {
  CONSOLE_HEADERS,
  givePasswords,
  sessionCookie,
  signedInAgent,
  TEST_EMAILS,
  TEST_PASSWORD,
} from '../support/console-session';
import { createTestContext, type TestContext } from '../support/test-context';

// Cross-site request forgery defences, as described by the OWASP CSRF Prevention Cheat Sheet
// ("custom request headers" and "verifying origin with standard headers"), on top of SameSite cookies.

let ctx: TestContext;

beforeAll(async () => {
  ctx = await createTestContext({ env: { PUBLIC_URL: 'https://isochron.test.example' } });
  await givePasswords(ctx);
});

afterAll(async () => {
  await ctx.close();
});

const signIn = () =>
  request(ctx.app).post('/auth/session').send({ email: TEST_EMAILS.admin, password: TEST_PASSWORD });

describe('CSRF on /auth writes', () => {
  it('refuses sign-in without X-Requested-With: isochron-console, with a 403 problem and no cookie', async () => {
    for (const res of [await signIn(), await signIn().set('X-Requested-With', 'XMLHttpRequest')]) {
      expect(res.status).toBe(403);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(res.body.detail).toContain('X-Requested-With');
      expect(sessionCookie(res)).toBeUndefined();
    }
  });

  it('refuses sign-in from a foreign or opaque origin, or marked cross-site by the browser', async () => {
    for (const origin of [
      'https://evil.example',
      'null',
      'https://isochron.test.example.evil.example',
      'http://isochron.test.example',
    ]) {
      const res = await signIn().set(CONSOLE_HEADERS).set('Origin', origin);
      expect([origin, res.status]).toEqual([origin, 403]);
    }
    const crossSite = await signIn().set(CONSOLE_HEADERS).set('Sec-Fetch-Site', 'cross-site');
    expect(crossSite.status).toBe(403);
  });

  it('accepts the public origin and the origin the request was addressed to', async () => {
    expect((await signIn().set(CONSOLE_HEADERS).set('Origin', 'https://isochron.test.example')).status).toBe(
      200,
    );
    const sameHost = await signIn()
      .set(CONSOLE_HEADERS)
      .set('Host', 'localhost:8080')
      .set('Origin', 'http://localhost:8080');
    expect(sameHost.status).toBe(200);
    expect((await signIn().set(CONSOLE_HEADERS).set('Sec-Fetch-Site', 'same-origin')).status).toBe(200);
  });

  it('refuses a forged sign-out and keeps the session alive', async () => {
    const agent = await signedInAgent(ctx, 'viewer');
    expect((await agent.delete('/auth/session')).status).toBe(403);
    expect(
      (await agent.delete('/auth/session').set(CONSOLE_HEADERS).set('Origin', 'https://evil.example')).status,
    ).toBe(403);
    expect((await agent.get('/auth/session')).status).toBe(200);
  });

  it('refuses an invitation acceptance without the console header', async () => {
    const res = await request(ctx.app)
      .post('/auth/invitations/accept')
      .send({ token: 'x'.repeat(43), password: 'long-enough-password' });
    expect(res.status).toBe(403);
  });
});

describe('CSRF on /v1 writes made with a session', () => {
  const newUser = (email: string) => ({ email, role: 'admin' });

  it('refuses a session write without the console header, and changes nothing', async () => {
    const admin = await signedInAgent(ctx, 'admin');
    const res = await admin.post('/v1/users').send(newUser('forged.admin@test.example'));
    expect(res.status).toBe(403);
    expect(res.body.type).toContain('cross-site-request');
    const patch = await admin.patch(`/v1/users/${ctx.users.developer}`).send({ role: 'admin' });
    expect(patch.status).toBe(403);
    expect(await ctx.db.models.User.count({ where: { email: 'forged.admin@test.example' } })).toBe(0);
    expect((await ctx.db.models.User.findByPk(ctx.users.developer))!.role).toBe('developer');
  });

  it('refuses a session write from a foreign origin even with the header', async () => {
    const admin = await signedInAgent(ctx, 'admin');
    const res = await admin
      .post('/v1/users')
      .set(CONSOLE_HEADERS)
      .set('Origin', 'https://evil.example')
      .send(newUser('forged.two@test.example'));
    expect(res.status).toBe(403);
    expect(await ctx.db.models.User.count({ where: { email: 'forged.two@test.example' } })).toBe(0);
  });

  it('accepts the console’s own write, and reads without the header', async () => {
    const admin = await signedInAgent(ctx, 'admin');
    const res = await admin
      .post('/v1/users')
      .set(CONSOLE_HEADERS)
      .set('Origin', 'https://isochron.test.example')
      .send({ email: 'welcome@test.example', role: 'viewer' });
    expect(res.status).toBe(201);
    expect((await admin.get('/v1/users')).status).toBe(200);
  });

  it('does not ask bearer-key callers for the header: a key cannot be forged by a browser', async () => {
    const res = await request(ctx.app)
      .post('/v1/users')
      .set('Authorization', `Bearer ${ctx.keys.admin}`)
      .send({ email: 'scripted@test.example', role: 'viewer' });
    expect(res.status).toBe(201);
  });
});
