import request from 'supertest';
import { tableNames } from '../support/stored-bytes';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
const asAdmin = () => ({ Authorization: `Bearer ${ctx.keys.admin}` });

beforeAll(async () => {
  ctx = await createTestContext();
});

afterAll(async () => {
  await ctx.close();
});

// Classic injection strings (OWASP testing guide, SQL injection section) plus SQLite-specific ones.
const NAMES = [
  "Robert'); DROP TABLE api_keys;--",
  "' OR '1'='1",
  '" OR ""="',
  "'; UPDATE api_keys SET role='admin' WHERE '1'='1",
  "x' UNION SELECT secretHash, 1, 2 FROM api_keys --",
  '%_\\ LIKE wildcards',
  ':ownerId $1 ? @p0 replacement markers',
  '/* comment */ -- dash dash',
  'Kestrel ☕ Yard — Stage 3 ‘quotes’',
];

describe('SQL-injection strings', () => {
  it('are stored and answered verbatim in key names, and change nothing else', async () => {
    const rolesBefore = (await ctx.db.models.ApiKey.findAll({ order: [['id', 'ASC']] })).map((k) => [
      k.id,
      k.role,
    ]);
    const ids: string[] = [];
    for (const name of NAMES) {
      const res = await request(ctx.app).post('/v1/keys').set(asAdmin()).send({ name, role: 'calculate' });
      expect(res.status).toBe(201);
      expect(res.body.name).toBe(name);
      ids.push(res.body.id);
    }
    for (const [i, id] of ids.entries()) {
      const shown = await request(ctx.app).get(`/v1/keys/${id}`).set(asAdmin());
      expect(shown.body.name).toBe(NAMES[i]);
      const stored = await ctx.db.models.ApiKey.findByPk(id);
      expect(stored!.name).toBe(NAMES[i]);
      expect(stored!.role).toBe('calculate');
    }
    const renamed = await request(ctx.app)
      .patch(`/v1/keys/${ids[0]}`)
      .set(asAdmin())
      .send({ name: "'); DELETE FROM users; --" });
    expect(renamed.body.name).toBe("'); DELETE FROM users; --");

    expect(await ctx.db.models.User.count()).toBe(4);
    const rolesAfter = (
      await ctx.db.models.ApiKey.findAll({
        where: { id: rolesBefore.map(([id]) => id) },
        order: [['id', 'ASC']],
      })
    ).map((k) => [k.id, k.role]);
    expect(rolesAfter).toEqual(rolesBefore);
    expect(await tableNames(ctx)).toEqual(
      expect.arrayContaining(['api_keys', 'users', 'usage_buckets', 'audit_events']),
    );
  });

  it('in usage filters match nothing and break nothing', async () => {
    await request(ctx.app).get('/v1/layouts').set(asAdmin()).expect(200);
    await ctx.services.usage.flush();
    for (const route of NAMES) {
      const res = await request(ctx.app).get('/v1/usage').query({ route, groupBy: 'route' }).set(asAdmin());
      expect(res.status).toBe(200);
      expect(res.body.data).toEqual([]);
    }
    const all = await request(ctx.app).get('/v1/usage').query({ groupBy: 'route' }).set(asAdmin());
    expect(all.body.data.length).toBeGreaterThan(0);
  });

  it('as a list cursor are refused', async () => {
    // A cursor is an id; the contract's pattern refuses anything else before it reaches a query.
    const res = await request(ctx.app).get('/v1/keys').query({ startingAfter: "' OR 1=1 --" }).set(asAdmin());
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/query/startingAfter']);
    const ownerInjection = await request(ctx.app)
      .get('/v1/keys')
      .query({ ownerId: "usr_x' OR '1'='1" })
      .set(asAdmin());
    expect(ownerInjection.status).toBe(400);
  });
});
