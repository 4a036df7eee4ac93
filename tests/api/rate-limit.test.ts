import request from 'supertest';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

// Header syntax from draft-ietf-httpapi-ratelimit-headers-08: `RateLimit: "<policy>"; r=<remaining>; t=<seconds>`
// and `RateLimit-Policy: "<policy>"; q=<quota>; w=<window seconds>; pk=:<partition key>:`.
const remainingOf = (header: string): number => Number(/;\s*r=(\d+)/.exec(header)?.[1]);
const quotaOf = (header: string): number => Number(/;\s*q=(\d+)/.exec(header)?.[1]);
const windowOf = (header: string): number => Number(/;\s*w=(\d+)/.exec(header)?.[1]);

let ctx: TestContext;
const DEFAULT_LIMIT = 5;

beforeAll(async () => {
  ctx = await createTestContext({ env: { DEFAULT_RATE_LIMIT_PER_MINUTE: String(DEFAULT_LIMIT) } });
  // The admin key makes the keys under test; give it room of its own.
  await ctx.db.write((transaction) =>
    ctx.db.models.ApiKey.update({ rateLimitPerMinute: 1000 }, { where: { role: 'admin' }, transaction }),
  );
});

afterAll(async () => {
  await ctx.close();
});

async function newKey(rateLimitPerMinute?: number): Promise<{ id: string; secret: string }> {
  const res = await request(ctx.app)
    .post('/v1/keys')
    .set('Authorization', `Bearer ${ctx.keys.admin}`)
    .send({ name: 'Limit check', role: 'calculate', ...(rateLimitPerMinute && { rateLimitPerMinute }) });
  if (res.status !== 201) throw new Error(`${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

const call = (secret: string) => request(ctx.app).get('/v1/layouts').set('Authorization', `Bearer ${secret}`);

describe('per-key rate limit', () => {
  it('sends the draft-8 RateLimit headers with the default limit, and no legacy headers', async () => {
    const key = await newKey();
    const res = await call(key.secret);
    expect(res.status).toBe(200);
    expect(quotaOf(res.headers['ratelimit-policy'])).toBe(DEFAULT_LIMIT);
    expect(windowOf(res.headers['ratelimit-policy'])).toBe(60);
    expect(remainingOf(res.headers.ratelimit)).toBe(DEFAULT_LIMIT - 1);
    expect(res.headers).not.toHaveProperty('x-ratelimit-limit');
    expect(res.headers).not.toHaveProperty('x-ratelimit-remaining');
  });

  it("answers 429 with a problem document and Retry-After once the key's own limit is spent", async () => {
    const key = await newKey(3);
    const remaining = [];
    for (let i = 0; i < 3; i += 1) {
      const res = await call(key.secret);
      expect(res.status).toBe(200);
      expect(quotaOf(res.headers['ratelimit-policy'])).toBe(3);
      remaining.push(remainingOf(res.headers.ratelimit));
    }
    expect(remaining).toEqual([2, 1, 0]);

    const refused = await call(key.secret);
    expect(refused.status).toBe(429);
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
    expectToMatchContract('listLayouts', 429, refused.body);
    expect(refused.body).toMatchObject({ status: 429, type: 'https://isochron.dev/problems/rate-limited' });
    expect(refused.body.detail).toContain('3 requests per minute');
    expect(refused.body.requestId).toBe(refused.headers['request-id']);
    const retryAfter = Number(refused.headers['retry-after']);
    expect(Number.isInteger(retryAfter)).toBe(true);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(60);
    expect(remainingOf(refused.headers.ratelimit)).toBe(0);
  });

  it('counts each key on its own, whatever address the calls come from', async () => {
    const spent = await newKey(1);
    const fresh = await newKey(1);
    expect((await call(spent.secret)).status).toBe(200);
    expect((await call(spent.secret)).status).toBe(429);
    expect((await call(fresh.secret)).status).toBe(200);
  });

  it('applies a raised limit from the very next request', async () => {
    const key = await newKey(2);
    await call(key.secret).expect(200);
    await call(key.secret).expect(200);
    await call(key.secret).expect(429);
    await request(ctx.app)
      .patch(`/v1/keys/${key.id}`)
      .set('Authorization', `Bearer ${ctx.keys.admin}`)
      .send({ rateLimitPerMinute: 10 })
      .expect(200);
    const res = await call(key.secret);
    expect(res.status).toBe(200);
    expect(quotaOf(res.headers['ratelimit-policy'])).toBe(10);
  });

  it('does not limit calls that never got past authentication', async () => {
    for (let i = 0; i < DEFAULT_LIMIT + 2; i += 1) {
      const res = await request(ctx.app).get('/v1/layouts');
      expect(res.status).toBe(401);
      expect(res.headers).not.toHaveProperty('ratelimit');
    }
  });
});
