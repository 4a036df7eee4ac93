import type { Express } from 'express';
import request from 'supertest';
import { createApp } from '../../api/app';
import { createTestContext, type TestContext } from '../support/test-context';

// The service answers `/v1/…` past the app router (api/http/direct-mount.ts). The same requests, sent to
// the app with that way switched off, must get the same answers: status, headers and body.
let ctx: TestContext;
let viaRouter: Express;
beforeAll(async () => {
  ctx = await createTestContext();
  viaRouter = createApp(ctx.services, { directApi: false });
});
afterAll(async () => {
  await ctx.close();
});

const BIQUADS = {
  sampleRateHz: 48000,
  filters: [{ type: 'peaking', frequencyHz: 1000, gainDb: -3, q: 1.41 }],
};

interface Case {
  name: string;
  method: 'get' | 'post' | 'head' | 'options' | 'delete';
  url: string;
  key?: 'calculate' | 'tuning' | 'admin' | 'unknown';
  auth?: string;
  body?: string | object;
  type?: string;
}

const cases: Case[] = [
  { name: 'a calculation', method: 'post', url: '/v1/biquads', key: 'calculate', body: BIQUADS },
  { name: 'a query string', method: 'post', url: '/v1/biquads?x=1', key: 'calculate', body: BIQUADS },
  {
    name: 'input the contract refuses',
    method: 'post',
    url: '/v1/biquads',
    key: 'calculate',
    body: { sampleRateHz: 1 },
  },
  {
    name: 'JSON that does not parse',
    method: 'post',
    url: '/v1/biquads',
    key: 'calculate',
    body: '{"a":',
    type: 'application/json',
  },
  {
    name: 'a body that is not JSON',
    method: 'post',
    url: '/v1/biquads',
    key: 'calculate',
    body: 'a=1',
    type: 'text/plain',
  },
  {
    name: 'a body over the limit',
    method: 'post',
    url: '/v1/biquads',
    key: 'calculate',
    body: `{"x":"${'a'.repeat(2_200_000)}"}`,
    type: 'application/json',
  },
  { name: 'no key', method: 'post', url: '/v1/biquads', body: BIQUADS },
  { name: 'an unknown key', method: 'post', url: '/v1/biquads', key: 'unknown', body: BIQUADS },
  {
    name: 'a malformed Authorization header',
    method: 'post',
    url: '/v1/biquads',
    auth: 'Basic abc',
    body: BIQUADS,
  },
  { name: 'a key in the query', method: 'get', url: '/v1/layouts?access_token=abc', key: 'calculate' },
  { name: 'a NUL in the path', method: 'get', url: '/v1/lay%00outs', key: 'calculate' },
  { name: 'a list', method: 'get', url: '/v1/layouts', key: 'calculate' },
  { name: 'HEAD of a list', method: 'head', url: '/v1/layouts', key: 'calculate' },
  { name: 'OPTIONS', method: 'options', url: '/v1/biquads', key: 'calculate' },
  { name: 'a wrong method', method: 'get', url: '/v1/biquads', key: 'calculate' },
  { name: 'a role that may not', method: 'get', url: '/v1/keys', key: 'calculate' },
  { name: 'an admin list', method: 'get', url: '/v1/users?limit=1', key: 'admin' },
  { name: 'a path parameter not found', method: 'get', url: '/v1/rooms/room_nothing', key: 'tuning' },
  { name: 'a delete not found', method: 'delete', url: '/v1/keys/key_nothing', key: 'admin' },
  { name: 'no such route', method: 'get', url: '/v1/nowhere', key: 'calculate' },
  { name: 'a double slash', method: 'get', url: '/v1//layouts', key: 'calculate' },
  { name: 'an upper-case path', method: 'post', url: '/v1/BIQUADS', key: 'calculate', body: BIQUADS },
  {
    name: 'the mount in upper case (the router way both times)',
    method: 'post',
    url: '/V1/biquads',
    key: 'calculate',
    body: BIQUADS,
  },
  { name: 'the bare mount', method: 'get', url: '/v1', key: 'calculate' },
];

/** Headers that differ from one call to the next whichever way it goes. */
function comparable(headers: Record<string, string>): Record<string, string> {
  const { date: _date, 'request-id': requestId, ratelimit, ...rest } = headers;
  return {
    ...rest,
    'request-id': requestId === undefined ? 'none' : 'set',
    ratelimit: ratelimit === undefined ? 'none' : ratelimit.replace(/\d+/g, 'n'),
  };
}

describe('/v1 answered past the app router', () => {
  it.each(cases)('$name: $method $url answers as through the router', async (c) => {
    const send = (app: Express) => {
      let call = request(app)[c.method](c.url);
      const key = c.key === 'unknown' ? `iso_test_${'x'.repeat(43)}` : c.key && ctx.keys[c.key];
      if (key) call = call.set('Authorization', `Bearer ${key}`);
      if (c.auth) call = call.set('Authorization', c.auth);
      if (c.type) call = call.set('Content-Type', c.type);
      return c.body === undefined ? call : call.send(c.body);
    };
    const expected = await send(viaRouter);
    const actual = await send(ctx.app);
    expect(actual.status).toBe(expected.status);
    expect(comparable(actual.headers)).toEqual(comparable(expected.headers));
    // A problem names its request's own id.
    const text = (answer: request.Response) =>
      (answer.text ?? '').split(String(answer.headers['request-id'])).join('{request-id}');
    expect(text(actual)).toEqual(text(expected));
  });

  it('meters a call answered past the router under its route', async () => {
    await ctx.services.usage.flush();
    const before = await ctx.db.models.UsageBucket.sum('count', {
      where: { route: 'POST /v1/biquads', statusClass: '2xx' },
    });
    await request(ctx.app)
      .post('/v1/biquads')
      .set('Authorization', `Bearer ${ctx.keys.calculate}`)
      .send(BIQUADS)
      .expect(200);
    await ctx.services.usage.flush();
    const after = await ctx.db.models.UsageBucket.sum('count', {
      where: { route: 'POST /v1/biquads', statusClass: '2xx' },
    });
    expect(after - (before ?? 0)).toBe(1);
  });
});
