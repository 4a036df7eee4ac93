import request from 'supertest';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({
    env: {
      DEFAULT_RATE_LIMIT_PER_MINUTE: '100',
      USER_RATE_LIMIT_PER_MINUTE: '1000',
      MAX_ACTIVE_KEYS_PER_USER: '4',
    },
  });
});
afterAll(async () => {
  await ctx.close();
});

const asAdmin = (req: request.Test) => req.set('Authorization', `Bearer ${ctx.keys.admin}`);

describe('the cap on active keys per user', () => {
  it('refuses a fifth active key with 409 until one is revoked; expired keys do not count', async () => {
    const create = (name: string) =>
      asAdmin(request(ctx.app).post('/v1/keys')).send({ name, role: 'calculate', ownerId: ctx.users.other });
    // The other developer holds one key (otherTuning); three more make four.
    for (const name of ['two', 'three', 'four']) expect((await create(name)).status).toBe(201);
    const fifth = await create('five');
    expect(fifth.status).toBe(409);
    expectToMatchContract('createKey', 409, fifth.body);
    expect(fifth.body.detail).toContain('4 active keys');
    expect(await ctx.db.models.ApiKey.count({ where: { name: 'five' } })).toBe(0);

    const two = await ctx.db.models.ApiKey.findOne({ where: { name: 'two' } });
    await asAdmin(request(ctx.app).delete(`/v1/keys/${two!.id}`)).expect(200);
    expect((await create('five')).status).toBe(201);
    expect((await create('six')).status).toBe(409);

    const three = await ctx.db.models.ApiKey.findOne({ where: { name: 'three' } });
    await ctx.db.write((transaction) =>
      three!.update({ expiresAt: new Date(Date.now() - 1000) }, { transaction }),
    );
    expect((await create('six')).status).toBe(201);
  });
});

describe('GET /v1/usage', () => {
  it('shows the limits in force and the active keys of the one user it covers', async () => {
    const own = await request(ctx.app).get('/v1/usage').set('Authorization', `Bearer ${ctx.keys.admin}`);
    expect(own.status).toBe(200);
    expectToMatchContract('getUsage', 200, own.body);
    expect(own.body.limits).toEqual({
      keyRateLimitPerMinute: 100,
      userRateLimitPerMinute: 1000,
      maxActiveKeysPerUser: 4,
      activeKeys: null,
    });
    const forOther = await asAdmin(request(ctx.app).get(`/v1/usage?userId=${ctx.users.other}`));
    expect(forOther.body.limits.activeKeys).toBe(4);
  });
});
