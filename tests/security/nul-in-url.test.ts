import request from 'supertest';
import { createTestContext, type TestContext } from '../support/test-context';

// Found by the contract fuzz test: a NUL in an id or a filter ended the SQL text inside SQLite (500).
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

it.each([
  ['GET', '/v1/rooms?startingAfter=a%00b', '/query/startingAfter'],
  ['GET', '/v1/rooms/%00', '/path'],
  ['DELETE', '/v1/tunings/%00', '/path'],
  ['GET', '/v1/tunings/compare?left=a%00b&right=x', '/query/left'],
  ['GET', '/v1/rooms/room_1/measurements?channel=M%00', '/query/channel'],
  ['GET', '/v1/usage?route=GET%00', '/query/route'],
  ['GET', '/v1/keys/key_%00', '/path'],
])('%s %s answers 400 naming where the NUL is', async (method, url, pointer) => {
  const call = method === 'DELETE' ? request(ctx.app).delete(url) : request(ctx.app).get(url);
  const res = await call.set('Authorization', `Bearer ${ctx.keys.admin}`);
  expect(res.status).toBe(400);
  expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
});
