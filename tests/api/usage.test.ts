import { rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { openDatabase } from '../../api/db/database';
import { closeServices } from '../../api/services';
import { givePasswords, signedInAgent } from '../support/console-session';
import { expectToMatchContract } from '../support/contract';
import { burst, completedResponses, type BurstRequest } from '../support/http-burst';
import { createTestContext, type TestContext } from '../support/test-context';

const bearer = (secret: string) => ({ Authorization: `Bearer ${secret}` });

async function newKey(ctx: TestContext, body: object): Promise<{ id: string; secret: string }> {
  const res = await request(ctx.app).post('/v1/keys').set(bearer(ctx.keys.admin)).send(body);
  if (res.status !== 201) throw new Error(`${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

interface Row {
  keyId: string | null;
  keyName: string | null;
  userId: string | null;
  route: string | null;
  bucket: string | null;
  count: number;
  errorCount: number;
}

describe('GET /v1/usage', () => {
  let ctx: TestContext;
  let meter: { id: string; secret: string };
  const startedAt = Date.now();
  const hour = new Date(Math.floor(startedAt / 3_600_000) * 3_600_000).toISOString();

  beforeAll(async () => {
    ctx = await createTestContext();
    await givePasswords(ctx);
    meter = await newKey(ctx, { name: '=Metered, "quoted" key', role: 'admin' });
    const as = bearer(meter.secret);
    for (let i = 0; i < 3; i += 1) await request(ctx.app).get('/v1/layouts').set(as).expect(200);
    await request(ctx.app).get('/v1/layouts/no-such-layout').set(as).expect(404);
    await request(ctx.app).get(`/v1/keys/${meter.id}`).set(as).expect(200);
    await request(ctx.app).get(`/v1/keys/${meter.id}`).set(as).expect(200);
    const other = await newKey(ctx, { name: 'Second', role: 'calculate' });
    await request(ctx.app).get(`/v1/keys/${other.id}`).set(as).expect(200);
    await request(ctx.app).get('/v1/nothing-here/key_123').set(as).expect(404);
    await ctx.services.usage.flush();
  });

  afterAll(async () => {
    await ctx.close();
  });

  const usage = (query: Record<string, string>, secret = ctx.keys.admin) =>
    request(ctx.app).get('/v1/usage').query(query).set(bearer(secret));

  it('counts per route template, never per raw id, with errors apart', async () => {
    const res = await usage({ keyId: meter.id, groupBy: 'route' });
    expect(res.status).toBe(200);
    expectToMatchContract('getUsage', 200, res.body);
    const byRoute = Object.fromEntries(
      (res.body.data as Row[]).map((r) => [r.route, [r.count, r.errorCount]]),
    );
    expect(byRoute).toEqual({
      'GET /v1/layouts': [3, 0],
      'GET /v1/layouts/{layoutId}': [1, 1],
      'GET /v1/keys/{keyId}': [3, 0],
      'GET /v1 (no route)': [1, 1],
    });
    expect(JSON.stringify(res.body.data)).not.toMatch(/key_[0-9a-z]/);
  });

  it('groups by hour and day with the key named, and by key', async () => {
    const hourly = await usage({ keyId: meter.id, groupBy: 'hour' });
    const rows = hourly.body.data as Row[];
    expect(
      rows.every((r) => r.bucket === hour && r.keyId === meter.id && r.keyName === '=Metered, "quoted" key'),
    ).toBe(true);
    expect(rows.reduce((sum, r) => sum + r.count, 0)).toBe(8);

    const daily = await usage({ keyId: meter.id, groupBy: 'day' });
    expect((daily.body.data as Row[]).map((r) => r.bucket)).toContain(`${hour.slice(0, 10)}T00:00:00.000Z`);

    const byKey = await usage({ keyId: meter.id, groupBy: 'key' });
    expect(byKey.body.data).toEqual([
      {
        keyId: meter.id,
        keyName: '=Metered, "quoted" key',
        userId: ctx.users.admin,
        route: null,
        bucket: null,
        count: 8,
        errorCount: 2,
      },
    ]);
  });

  it('moves the key’s lastUsedAt forward in the same flush', async () => {
    const key = await ctx.db.models.ApiKey.findByPk(meter.id);
    expect(key!.lastUsedAt!.getTime()).toBeGreaterThanOrEqual(startedAt);
  });

  it('answers CSV on Accept: text/csv, with formula-looking text defused and quotes doubled', async () => {
    const res = await request(ctx.app)
      .get('/v1/usage')
      .query({ keyId: meter.id, groupBy: 'key' })
      .set(bearer(ctx.keys.admin))
      .set('Accept', 'text/csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.text.split('\r\n')).toEqual([
      'bucket,keyId,keyName,userId,route,count,errorCount',
      `,${meter.id},"'=Metered, ""quoted"" key",${ctx.users.admin},,8,2`,
      '',
    ]);
  });

  it('counts console calls under the signed-in user, and shows a developer only its own usage', async () => {
    const dev = await signedInAgent(ctx, 'developer');
    await dev.get('/v1/layouts').expect(200);
    await request(ctx.app).get('/v1/layouts').set(bearer(ctx.keys.tuning)).expect(200);
    await ctx.services.usage.flush();
    const own = await dev.get('/v1/usage').query({ groupBy: 'key' });
    expect(own.status).toBe(200);
    const rows = own.body.data as Row[];
    expect(rows.length).toBeGreaterThanOrEqual(2);
    expect(rows.every((r) => r.userId === ctx.users.developer)).toBe(true);
    expect(rows.find((r) => r.keyId === null)?.count).toBeGreaterThanOrEqual(1);
    expect((await dev.get('/v1/usage').query({ userId: ctx.users.admin })).status).toBe(403);

    const viewer = await signedInAgent(ctx, 'viewer');
    const everyone = await viewer.get('/v1/usage').query({ groupBy: 'key' });
    expect(new Set((everyone.body.data as Row[]).map((r) => r.userId))).toEqual(
      new Set([ctx.users.admin, ctx.users.developer]),
    );
  });

  it('is refused to keys without a usage permission', async () => {
    const res = await usage({}, ctx.keys.calculate);
    expect(res.status).toBe(403);
    expect(res.headers['www-authenticate']).toContain('insufficient_scope');
  });

  it('names bad query fields', async () => {
    const cases: Array<[Record<string, string>, string]> = [
      [{ groupBy: 'week' }, '/query/groupBy'],
      [{ from: 'yesterday' }, '/query/from'],
      [{ from: '2026-03-02T00:00:00Z', to: '2026-03-01T00:00:00Z' }, '/query/from'],
      [{ from: '2020-01-01T00:00:00Z', to: '2026-01-01T00:00:00Z' }, '/query/from'],
      [{ keyId: "key_1' OR '1'='1" }, '/query/keyId'],
    ];
    for (const [query, pointer] of cases) {
      const res = await usage(query);
      expect(res.status).toBe(400);
      expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
    }
  });

  it('answers an empty report for a range with no calls', async () => {
    const res = await usage({ from: '2020-01-01T00:00:00Z', to: '2020-02-01T00:00:00Z' });
    expect(res.status).toBe(200);
    expect(res.body.data).toEqual([]);
  });
});

describe('metering under load', () => {
  it('2,000 parallel calls over 20 keys, with flushes and key writes racing them, count exactly 2,000', async () => {
    // Twenty keys of one user: lift the per-user ceiling and key cap, which are not what this test is about.
    const ctx = await createTestContext({
      env: {
        USAGE_FLUSH_INTERVAL_MS: '100',
        USER_RATE_LIMIT_PER_MINUTE: '100000',
        MAX_ACTIVE_KEYS_PER_USER: '100',
      },
    });
    const errors = jest.spyOn(ctx.services.logger, 'error');
    const server = ctx.app.listen(0);
    try {
      await new Promise((resolve) => server.once('listening', resolve));
      const port = (server.address() as AddressInfo).port;
      const keys = await Promise.all(
        Array.from({ length: 20 }, (_, i) => ctx.addKey('calculate', ctx.users.developer, `Load ${i}`)),
      );
      const rows = await ctx.db.models.ApiKey.findAll({ where: { name: keys.map((_, i) => `Load ${i}`) } });
      const requests: BurstRequest[] = Array.from({ length: 2000 }, (_, i) => ({
        method: 'GET',
        path: '/v1/layouts/5.1',
        headers: bearer(keys[i % 20]),
      }));
      // Other writes through the same queue while the burst runs: new keys and renames.
      const writes = Array.from({ length: 10 }, (_, i) =>
        request(server)
          .post('/v1/keys')
          .set(bearer(ctx.keys.admin))
          .send({ name: `Racing write ${i}`, role: 'calculate' }),
      );
      const [outcomes, written] = await Promise.all([burst(port, requests), Promise.all(writes)]);
      expect(outcomes.filter((o) => !('status' in o) || o.status !== 200)).toEqual([]);
      expect(written.map((r) => r.status)).toEqual(Array(10).fill(201));
      await ctx.services.usage.flush();

      const [{ total }] = await ctx.db.sequelize.query<{ total: number }>(
        `SELECT SUM(count) AS total FROM usage_buckets WHERE "keyId" IN (:ids)`,
        { replacements: { ids: rows.map((r) => r.id) }, type: QueryTypes.SELECT },
      );
      expect(Number(total)).toBe(2000);
      const report = await request(server)
        .get('/v1/usage')
        .query({ groupBy: 'route', route: 'GET /v1/layouts/{layoutId}' })
        .set(bearer(ctx.keys.admin));
      expect(report.body.data).toEqual([expect.objectContaining({ count: 2000, errorCount: 0 })]);
      const perKey = await Promise.all(
        rows.map(
          async (row) => (await ctx.db.models.UsageBucket.sum('count', { where: { keyId: row.id } })) ?? 0,
        ),
      );
      expect(perKey).toEqual(Array(20).fill(100));
      expect(errors).not.toHaveBeenCalled();
    } finally {
      await new Promise((resolve) => server.close(resolve));
      await ctx.close();
    }
  });

  it('a graceful stop in the middle of a burst loses no completed call', async () => {
    const ctx = await createTestContext();
    const server = ctx.app.listen(0);
    await new Promise((resolve) => server.once('listening', resolve));
    const port = (server.address() as AddressInfo).port;
    const keys = await Promise.all(
      Array.from({ length: 10 }, () => ctx.addKey('calculate', ctx.users.developer)),
    );
    const requests: BurstRequest[] = Array.from({ length: 1500 }, (_, i) => ({
      method: 'GET',
      path: '/v1/layouts/7.1.4',
      headers: bearer(keys[i % 10]),
    }));
    let closing: Promise<void> | undefined;
    const outcomes = await burst(port, requests, {
      onResponse: (completed) => {
        // Stop the way api/main.ts does on SIGTERM: no new connections, finish what is running, then close.
        if (completed === 400 && !closing) {
          closing = new Promise<void>((resolve) => {
            server.close(() => resolve());
            server.closeIdleConnections();
          }).then(() => closeServices(ctx.services));
        }
      },
    });
    await closing;
    const completed = completedResponses(outcomes);
    expect(completed).toBeGreaterThanOrEqual(400);
    expect(completed).toBeLessThan(1500);

    const reopened = await openDatabase(ctx.services.config.databaseUrl);
    try {
      expect(await reopened.models.UsageBucket.sum('count')).toBe(completed);
    } finally {
      await reopened.close();
      rmSync(ctx.dir, { recursive: true, force: true });
    }
  });
});
