import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { burst } from '../support/http-burst';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
const bearer = (secret: string) => ({ Authorization: `Bearer ${secret}` });
const asAdmin = () => bearer(ctx.keys.admin);

beforeAll(async () => {
  ctx = await createTestContext();
});

afterAll(async () => {
  await ctx.close();
});

async function newKey(role = 'calculate'): Promise<{ id: string; secret: string }> {
  const res = await request(ctx.app).post('/v1/keys').set(asAdmin()).send({ name: 'Access check', role });
  if (res.status !== 201) throw new Error(`${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

describe('revocation', () => {
  it('refuses a revoked key on its very next request, though the key was just cached', async () => {
    const key = await newKey();
    for (let i = 0; i < 3; i += 1)
      await request(ctx.app).get('/v1/layouts').set(bearer(key.secret)).expect(200);
    await request(ctx.app).delete(`/v1/keys/${key.id}`).set(asAdmin()).expect(200);
    const refused = await request(ctx.app).get('/v1/layouts').set(bearer(key.secret));
    expect(refused.status).toBe(401);
    expect(refused.headers['www-authenticate']).toBe('Bearer realm="isochron", error="invalid_token"');
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
  });

  it('lets no call made after the revocation answered through, even with calls racing it', async () => {
    const key = await newKey();
    const server = ctx.app.listen(0);
    try {
      await new Promise((resolve) => server.once('listening', resolve));
      const port = (server.address() as AddressInfo).port;
      const calls = () =>
        burst(
          port,
          Array.from({ length: 200 }, () => ({
            method: 'GET' as const,
            path: '/v1/layouts/5.1',
            headers: bearer(key.secret),
          })),
          { sockets: 16 },
        );
      // Lookups in flight while the revocation commits must not put the old answer back in the cache.
      const [before, revoked] = await Promise.all([
        calls(),
        request(server).delete(`/v1/keys/${key.id}`).set(asAdmin()),
      ]);
      expect(revoked.status).toBe(200);
      expect(before.every((o) => 'status' in o && (o.status === 200 || o.status === 401))).toBe(true);
      const after = await calls();
      expect(after.map((o) => ('status' in o ? o.status : o.error))).toEqual(Array(200).fill(401));
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
  });
});

describe('each key role is refused what it may not do (403 insufficient_scope)', () => {
  const someKey = 'key_0000000000000000000aa';
  const someUser = 'usr_0000000000000000000aa';
  const platform: Array<[string, string, object?]> = [
    ['get', '/v1/keys'],
    ['post', '/v1/keys', { name: 'Sneaky', role: 'admin' }],
    ['get', `/v1/keys/${someKey}`],
    ['patch', `/v1/keys/${someKey}`, { rateLimitPerMinute: 1000000 }],
    ['delete', `/v1/keys/${someKey}`],
    ['get', '/v1/usage'],
    ['get', '/v1/users'],
    ['post', '/v1/users', { email: 'sneaky@test.example', role: 'admin' }],
    ['get', `/v1/users/${someUser}`],
    ['patch', `/v1/users/${someUser}`, { role: 'admin' }],
  ];
  const stored: Array<[string, string, object?]> = [
    ['get', '/v1/rooms'],
    ['post', '/v1/rooms', { name: 'Stage 3' }],
  ];
  const cases = [
    ...[...platform, ...stored].map(([m, p, b]) => ['calculate', m, p, b] as const),
    ...platform.map(([m, p, b]) => ['tuning', m, p, b] as const),
  ];

  it.each(cases)('%s key: %s %s', async (role, method, path, body) => {
    const secret = role === 'calculate' ? ctx.keys.calculate : ctx.keys.tuning;
    const call = request(ctx.app)[method as 'get'](path).set(bearer(secret));
    const res = body ? await call.send(body) : await call;
    expect(res.status).toBe(403);
    expect(res.headers['www-authenticate']).toBe('Bearer realm="isochron", error="insufficient_scope"');
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body.type).toBe('https://isochron.dev/problems/insufficient-scope');
  });

  it('the same calls with an admin key are not refused for scope', async () => {
    for (const [method, path, body] of platform) {
      const call = request(ctx.app)[method as 'get'](path).set(asAdmin());
      const res = body ? await call.send(body) : await call;
      expect(res.status).not.toBe(403);
    }
  });
});

describe('keys outside the Authorization header', () => {
  it.each([
    ['the query string', () => request(ctx.app).get(`/v1/usage?access_token=${ctx.keys.admin}`)],
    [
      'the query string, beside a valid header',
      () =>
        request(ctx.app)
          .get(`/v1/layouts?access_token=${ctx.keys.calculate}`)
          .set(bearer(ctx.keys.calculate)),
    ],
    [
      'a JSON body',
      () =>
        request(ctx.app)
          .post('/v1/keys')
          .send({ access_token: ctx.keys.admin, name: 'x', role: 'calculate' }),
    ],
    [
      'a form body',
      () =>
        request(ctx.app)
          .post('/v1/keys')
          .type('form')
          .send({ access_token: ctx.keys.admin, name: 'x', role: 'calculate' }),
    ],
  ])('are refused in %s', async (_where, call) => {
    const res = await call();
    expect([400, 401]).toContain(res.status);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.headers['www-authenticate']).toMatch(/^Bearer realm="isochron"/);
    const keysNow = await ctx.db.models.ApiKey.count({ where: { name: 'x' } });
    expect(keysNow).toBe(0);
  });

  it('a JSON body key is named as the wrong place, not merely unknown', async () => {
    const res = await request(ctx.app).post('/v1/biquads').send({ access_token: ctx.keys.calculate });
    expect(res.status).toBe(400);
    expect(res.body.type).toBe('https://isochron.dev/problems/key-outside-header');
  });
});

describe('a disabled user', () => {
  it('has its keys refused like revoked ones', async () => {
    const disabled = await request(ctx.app)
      .patch(`/v1/users/${ctx.users.other}`)
      .set(asAdmin())
      .send({ status: 'disabled' });
    expect(disabled.status).toBe(200);
    const res = await request(ctx.app).get('/v1/layouts').set(bearer(ctx.keys.otherTuning));
    expect(res.status).toBe(401);
    expect(res.headers['www-authenticate']).toContain('error="invalid_token"');
  });
});
