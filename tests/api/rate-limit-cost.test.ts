import request from 'supertest';
import { loadOpenApiDocument } from '../../api/openapi/document';
import { operationCosts } from '../../api/rate-limit/request-cost';
import { createTestContext, type TestContext } from '../support/test-context';

// Draft-8 syntax: `RateLimit: "<policy>";r=<remaining>;t=<seconds>`, one item per policy: the key's
// own first (named after its quota), then the user's ceiling ("user").
const remaining = (header: string, policy: 'key' | 'user'): number =>
  Number((policy === 'user' ? /"user";\s*r=(\d+)/ : /^"[^"]+";\s*r=(\d+)/).exec(header)?.[1]);

const USER_CEILING = 70;
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({ env: { USER_RATE_LIMIT_PER_MINUTE: String(USER_CEILING) } });
});
afterAll(async () => {
  await ctx.close();
});

const plan = {
  layout: '2.0',
  channels: [
    { id: 'M+030', distance: 2 },
    { id: 'M-030', distance: 2 },
  ],
};
const fit = {
  measured: { frequenciesHz: [20, 100, 1000], magnitudeDb: [0, 6, 0] },
  maxBands: 1,
};
const levels = { channels: [{ id: 'L', measuredDb: 80 }] };
const post = (key: string, path: string, body: object) =>
  request(ctx.app).post(path).set('Authorization', `Bearer ${key}`).send(body);

describe('rate limits weighted by cost', () => {
  it('documents a cost on exactly the heavy operations', () => {
    const costs = operationCosts(loadOpenApiDocument()).map((c) => [c.operationId, [c.cost, c.when]]);
    expect(Object.fromEntries(costs)).toEqual({
      analyzeImpulseResponse: [10, undefined],
      readMicrophoneCalibrator: [10, undefined],
      createMeasurement: [10, 'multipart/form-data'],
      createPlan: [20, undefined],
      planStoredRoom: [20, undefined],
      createRoomTuning: [20, 'plan'],
      fitEq: [10, undefined],
    });
  });

  it("counts a plan as 20 of the key's units and a cheap call as 1, exactly up to the limit", async () => {
    await ctx.db.write((transaction) =>
      ctx.db.models.ApiKey.update(
        { rateLimitPerMinute: 41 },
        { where: { ownerId: ctx.users.developer, role: 'calculate' }, transaction },
      ),
    );
    ctx.services.keys.invalidate();
    const key = ctx.keys.calculate;
    const seen: Array<[number, number]> = [];
    for (const [path, body] of [
      ['/v1/plans', plan],
      ['/v1/plans', plan],
      ['/v1/levels', levels],
    ] as const) {
      const res = await post(key, path, body);
      seen.push([res.status, remaining(res.headers.ratelimit, 'key')]);
    }
    expect(seen).toEqual([
      [200, 21],
      [200, 1],
      [200, 0],
    ]);
    const refused = await post(key, '/v1/levels', levels);
    expect(refused.status).toBe(429);
    expect(refused.headers['retry-after']).toBeDefined();
  });

  it('charges a tuning made from settings 1 unit and one made from a plan 20', async () => {
    // The admin's own tuning key: its user spends nothing else in this file.
    const key = await ctx.addKey('tuning', ctx.users.admin, 'cost check');
    const room = await post(key, '/v1/rooms', {
      name: 'Cost check',
      layout: '2.0',
      dimensions: { widthM: 4, lengthM: 5, heightM: 2.8 },
      listener: { x: 2, y: 2.5, z: 1.2 },
      loudspeakers: [
        { id: 'M+030', x: 1, y: 0.5, z: 1.2 },
        { id: 'M-030', x: 3, y: 0.5, z: 1.2 },
      ],
    });
    expect(room.status).toBe(201);
    const left = async (body: object) => {
      const res = await post(key, `/v1/rooms/${room.body.id}/tunings`, body);
      expect(res.status).toBe(201);
      return remaining(res.headers.ratelimit, 'key');
    };
    const afterRoom = remaining(room.headers.ratelimit, 'key');
    const afterSettings = await left({
      name: 'Settings',
      channels: [{ id: 'M+030', delayMs: 0, trimDb: 0 }],
    });
    const afterPlan = await left({ name: 'Planned', plan: {} });
    expect([afterRoom - afterSettings, afterSettings - afterPlan]).toEqual([1, 20]);
  });

  it('refuses a heavy call that does not fit in what is left, though a cheap one would', async () => {
    // The other user's key has the default limit; their ceiling is 70 units: 3 plans, then a fit is
    // 60 + 10 = 70 (fits exactly), then any call is over.
    const key = ctx.keys.otherTuning;
    const users: number[] = [];
    for (const [path, body] of [
      ['/v1/plans', plan],
      ['/v1/plans', plan],
      ['/v1/plans', plan],
      ['/v1/eq/fit', fit],
    ] as const) {
      const res = await post(key, path, body);
      expect(res.status).toBe(200);
      users.push(remaining(res.headers.ratelimit, 'user'));
    }
    expect(users).toEqual([50, 30, 10, 0]);
    const refused = await post(key, '/v1/levels', levels);
    expect(refused.status).toBe(429);
    expect(refused.body.detail).toContain(`${USER_CEILING} requests per minute`);
  });
});
