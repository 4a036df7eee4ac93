import request from 'supertest';
import { CONSOLE_HEADERS, givePasswords, signedInAgent } from '../support/console-session';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
let developer: Awaited<ReturnType<typeof signedInAgent>>;
beforeAll(async () => {
  ctx = await createTestContext();
  await givePasswords(ctx);
  developer = await signedInAgent(ctx, 'developer');
});
afterAll(async () => {
  await ctx.close();
});

const DAY = 86_400_000;
const inDays = (days: number) => new Date(Date.now() + days * DAY).toISOString();
/** The key's owner edits through the console (developers' keys cannot manage keys); the admin with a key. */
const patch = (as: 'owner' | 'admin', keyId: string, body: object) =>
  as === 'owner'
    ? developer.patch(`/v1/keys/${keyId}`).set(CONSOLE_HEADERS).send(body)
    : request(ctx.app).patch(`/v1/keys/${keyId}`).set('Authorization', `Bearer ${ctx.keys.admin}`).send(body);
const layouts = (key: string) =>
  request(ctx.app).get('/v1/layouts/5.1').set('Authorization', `Bearer ${key}`);

/** A developer's key with an expiry an admin set. */
async function keyWithExpiry(expiresAt: string): Promise<{ secret: string; id: string }> {
  const secret = await ctx.addKey('calculate', ctx.users.developer, `expiring ${expiresAt}`);
  const row = await ctx.db.models.ApiKey.findOne({ where: { name: `expiring ${expiresAt}` } });
  await ctx.db.write((transaction) => row!.update({ expiresAt: new Date(expiresAt) }, { transaction }));
  return { secret, id: row!.id };
}

describe("a key's owner (not an admin)", () => {
  it('cannot move an expiry later or remove it, only bring it nearer', async () => {
    const { id } = await keyWithExpiry(inDays(10));
    const later = await patch('owner', id, { expiresAt: inDays(30) });
    expect(later.status).toBe(403);
    expect((await patch('owner', id, { expiresAt: null })).status).toBe(403);
    expect((await ctx.db.models.ApiKey.findByPk(id))!.expiresAt!.getTime()).toBeLessThan(
      Date.now() + 11 * DAY,
    );

    const nearer = await patch('owner', id, { expiresAt: inDays(5) });
    expect(nearer.status).toBe(200);
    expect(Date.parse(nearer.body.expiresAt)).toBeLessThan(Date.now() + 6 * DAY);
  });

  it('may set an expiry on a key without one, and then cannot remove it', async () => {
    const secret = await ctx.addKey('calculate', ctx.users.developer, 'open-ended');
    const { id } = (await ctx.db.models.ApiKey.findOne({ where: { name: 'open-ended' } }))!;
    expect((await patch('owner', id, { expiresAt: inDays(3) })).status).toBe(200);
    expect((await patch('owner', id, { expiresAt: null })).status).toBe(403);
    expect((await layouts(secret)).status).toBe(200);
  });
});

describe('an admin', () => {
  it('may move an expiry later or remove it', async () => {
    const { id } = await keyWithExpiry(inDays(10));
    const later = await patch('admin', id, { expiresAt: inDays(30) });
    expect(later.status).toBe(200);
    const removed = await patch('admin', id, { expiresAt: null });
    expect(removed.status).toBe(200);
    expect(removed.body.expiresAt).toBeNull();
  });
});

describe('an expired key', () => {
  it('stays expired: nobody can move or remove its expiry, and it is still refused', async () => {
    const { secret, id } = await keyWithExpiry(inDays(1));
    expect((await layouts(secret)).status).toBe(200);
    // The expiry passes (written straight to the database, as time would).
    const row = (await ctx.db.models.ApiKey.findByPk(id))!;
    await ctx.db.write((transaction) =>
      row.update({ expiresAt: new Date(Date.now() - 1000) }, { transaction }),
    );
    ctx.services.keys.invalidate();
    expect((await layouts(secret)).status).toBe(401);

    for (const [as, body] of [
      ['owner', { expiresAt: inDays(30) }],
      ['owner', { expiresAt: null }],
      ['admin', { expiresAt: inDays(30) }],
      ['admin', { expiresAt: null }],
    ] as const) {
      const res = await patch(as, id, body);
      expect(res.status).toBe(409);
      expect(res.body.errors[0].pointer).toBe('/body/expiresAt');
    }
    expect((await ctx.db.models.ApiKey.findByPk(id))!.expiresAt!.getTime()).toBeLessThan(Date.now());
    expect((await layouts(secret)).status).toBe(401);
    // Renaming it for the record is still fine.
    expect((await patch('admin', id, { name: 'expired rig key' })).status).toBe(200);
  });
});
