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
});
