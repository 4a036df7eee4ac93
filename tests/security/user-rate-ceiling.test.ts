import request from 'supertest';
import { createTestContext, type TestContext } from '../support/test-context';

/** A ceiling of 6 requests a minute per user over keys of 100 each. */
let tight: TestContext;
beforeAll(async () => {
  tight = await createTestContext({
    env: { DEFAULT_RATE_LIMIT_PER_MINUTE: '100', USER_RATE_LIMIT_PER_MINUTE: '6' },
  });
});
afterAll(async () => {
  await tight.close();
});

const layouts = (key: string) =>
  request(tight.app).get('/v1/layouts/5.1').set('Authorization', `Bearer ${key}`);

describe('the per-user ceiling', () => {
  it("holds across all of one user's keys, whatever each key's own limit, and leaves other users alone", async () => {
    const extra = await tight.addKey('calculate', tight.users.developer, 'third key');
    const keys = [tight.keys.calculate, tight.keys.tuning, extra];
    const statuses: number[] = [];
    for (let round = 0; round < 3; round += 1) {
      for (const key of keys) statuses.push((await layouts(key)).status);
    }
    // Each key made 3 calls of its 100; together they made 9 of the user's 6.
    expect(statuses).toEqual([200, 200, 200, 200, 200, 200, 429, 429, 429]);
    const refused = await layouts(extra);
    expect(refused.status).toBe(429);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(refused.body.detail).toContain('6 requests per minute');
    expect((await layouts(tight.keys.otherTuning)).status).toBe(200);
  });

  it("names both policies in the RateLimit headers: the key's and the user's", async () => {
    const res = await layouts(tight.keys.otherTuning);
    expect(res.headers['ratelimit-policy']).toMatch(/"100-in-1min"; q=100; w=60.*"user"; q=6; w=60/);
    expect(res.headers.ratelimit).toMatch(/"user"; r=\d+; t=\d+/);
  });

  it("does not charge the user's ceiling for calls the key's own limit refused", async () => {
    const admin = tight.keys.admin;
    const created = await request(tight.app)
      .post('/v1/keys')
      .set('Authorization', `Bearer ${admin}`)
      .send({ name: 'One a minute', role: 'calculate', rateLimitPerMinute: 1 })
      .expect(201);
    const statuses: number[] = [];
    for (let i = 0; i < 5; i += 1) statuses.push((await layouts(created.body.secret as string)).status);
    expect(statuses).toEqual([200, 429, 429, 429, 429]);
    // The admin spent 3 of 6: the key's creation, its one allowed call and this one. Had the four
    // refusals counted too, this call would be the seventh, and refused.
    const res = await layouts(admin);
    expect(res.status).toBe(200);
    expect(Number(/"user"; r=(\d+)/.exec(res.headers.ratelimit)?.[1])).toBe(3);
  });

  it("lists both policies in one RateLimit and one RateLimit-Policy field, the key's first", async () => {
    const res = await layouts(tight.keys.tuning);
    expect(res.headers.ratelimit).toMatch(/^"100-in-1min"; r=\d+; t=\d+, "user"; r=\d+; t=\d+$/);
    expect(res.headers['ratelimit-policy']).toMatch(
      /^"100-in-1min"; q=100; w=60; pk=:[A-Za-z0-9+/=]+:, "user"; q=6; w=60; pk=:[A-Za-z0-9+/=]+:$/,
    );
  });
});
