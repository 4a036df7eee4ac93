import request from 'supertest';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const layouts = (key: string) => request(ctx.app).get('/v1/layouts').set('Authorization', `Bearer ${key}`);

it("refuses a disabled user's keys on the very next request, and accepts them again once re-enabled", async () => {
  // The first call puts the key in the lookup cache; disabling must not wait for the cache to expire.
  expect((await layouts(ctx.keys.calculate)).status).toBe(200);

  const disable = await request(ctx.app)
    .patch(`/v1/users/${ctx.users.developer}`)
    .set('Authorization', `Bearer ${ctx.keys.admin}`)
    .send({ status: 'disabled' });
  expect(disable.status).toBe(200);
  const refused = await layouts(ctx.keys.calculate);
  expect(refused.status).toBe(401);
  expect(refused.headers['www-authenticate']).toContain('invalid_token');

  const enable = await request(ctx.app)
    .patch(`/v1/users/${ctx.users.developer}`)
    .set('Authorization', `Bearer ${ctx.keys.admin}`)
    .send({ status: 'active' });
  expect(enable.status).toBe(200);
  // This test user never set a password, so re-enabling returns them to "invited"; their keys work again.
  expect(enable.body.status).toBe('invited');
  expect((await layouts(ctx.keys.calculate)).status).toBe(200);
});
