import request from 'supertest';
import { KEY_ROLES, type KeyRole } from '../../api/db/models/api-key';
import { newId } from '../../api/db/ids';
import { USER_ROLES, type UserRole } from '../../api/db/models/user';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const asAdmin = (req: request.Test) => req.set('Authorization', `Bearer ${ctx.keys.admin}`);

async function addUser(role: UserRole, email: string): Promise<string> {
  const id = newId('usr');
  await ctx.db.write((transaction) =>
    ctx.db.models.User.create(
      { id, email, name: null, role, passwordHash: null, lastSignInAt: null },
      { transaction },
    ),
  );
  return id;
}

/** One call that needs exactly each key role: a calculation, the stored rooms, the user list. */
const PROBES: Record<KeyRole, (key: string) => request.Test> = {
  calculate: (key) => request(ctx.app).get('/v1/layouts/5.1').set('Authorization', `Bearer ${key}`),
  tuning: (key) => request(ctx.app).get('/v1/rooms').set('Authorization', `Bearer ${key}`),
  admin: (key) => request(ctx.app).get('/v1/users').set('Authorization', `Bearer ${key}`),
};

/** What a key of `keyRole` may do for an owner of `ownerRole` (PRODUCT: a key never does more than its owner). */
const ALLOWED: Record<UserRole, readonly KeyRole[]> = {
  admin: ['calculate', 'tuning', 'admin'],
  developer: ['calculate', 'tuning'],
  viewer: [],
};
const rank = (role: KeyRole) => KEY_ROLES.indexOf(role);
const expectedEffective = (keyRole: KeyRole, ownerRole: UserRole): KeyRole | null =>
  [...ALLOWED[ownerRole]].reverse().find((r) => rank(r) <= rank(keyRole)) ?? null;

async function statuses(key: string): Promise<Record<KeyRole, number>> {
  return {
    calculate: (await PROBES.calculate(key)).status,
    tuning: (await PROBES.tuning(key)).status,
    admin: (await PROBES.admin(key)).status,
  };
}

function expectedStatuses(effective: KeyRole | null): Record<KeyRole, number> {
  const ok = (needed: KeyRole) => (effective !== null && rank(effective) >= rank(needed) ? 200 : 403);
  return { calculate: ok('calculate'), tuning: ok('tuning'), admin: ok('admin') };
}

const PAIRS = USER_ROLES.flatMap((from) => USER_ROLES.filter((to) => to !== from).map((to) => [from, to]));

describe.each(PAIRS)('an owner whose role changes from %s to %s', (from, to) => {
  it('has every key capped by the new role at the very next request, and the answer names the keys moved', async () => {
    const ownerId = await addUser(from, `${from}-to-${to}@test.example`);
    const keys = Object.fromEntries(
      await Promise.all(KEY_ROLES.map(async (role) => [role, await ctx.addKey(role, ownerId)] as const)),
    ) as Record<KeyRole, string>;

    // Before: each key does what the old role allows. These calls also fill the one-second key cache.
    for (const role of KEY_ROLES) {
      expect([role, await statuses(keys[role])]).toEqual([
        role,
        expectedStatuses(expectedEffective(role, from)),
      ]);
    }

    const change = await asAdmin(request(ctx.app).patch(`/v1/users/${ownerId}`)).send({ role: to });
    expect(change.status).toBe(200);
    expectToMatchContract('updateUser', 200, change.body);
    const moved = KEY_ROLES.filter((role) => expectedEffective(role, from) !== expectedEffective(role, to));
    expect(
      (
        change.body.keys as Array<{
          role: KeyRole;
          effectiveRoleBefore: unknown;
          effectiveRoleAfter: unknown;
        }>
      )
        .map((k) => [k.role, k.effectiveRoleBefore, k.effectiveRoleAfter])
        .sort(),
    ).toEqual(moved.map((role) => [role, expectedEffective(role, from), expectedEffective(role, to)]).sort());

    for (const role of KEY_ROLES) {
      expect([role, await statuses(keys[role])]).toEqual([
        role,
        expectedStatuses(expectedEffective(role, to)),
      ]);
    }

    const audit = await ctx.db.models.AuditEvent.findOne({
      where: { action: 'user.roleChanged', targetId: ownerId },
    });
    const details = JSON.parse(audit!.details!) as { from: string; to: string; keys: unknown[] };
    expect(details).toMatchObject({ from, to });
    expect(details.keys).toHaveLength(moved.length);
  });
});

describe('a demoted admin', () => {
  it('can no longer list users or keys, read the outbox, or mint keys with an admin key', async () => {
    const lead = await addUser('admin', 'lead@test.example');
    const key = await ctx.addKey('admin', lead);
    const as = (req: request.Test) => req.set('Authorization', `Bearer ${key}`);
    expect((await as(request(ctx.app).get('/v1/outbox'))).status).toBe(200);

    await asAdmin(request(ctx.app).patch(`/v1/users/${lead}`))
      .send({ role: 'viewer' })
      .expect(200);

    for (const res of [
      await as(request(ctx.app).get('/v1/users')),
      await as(request(ctx.app).get('/v1/keys')),
      await as(request(ctx.app).get('/v1/outbox')),
      await as(request(ctx.app).post('/v1/keys')).send({
        name: 'Back door',
        role: 'admin',
        ownerId: ctx.users.admin,
      }),
    ]) {
      expect(res.status).toBe(403);
      expect(res.body.type).toBe('https://isochron.dev/problems/key-owner-role');
    }

    // Made a developer instead, the same key acts as a tuning key: rooms yes, keys and users no.
    await asAdmin(request(ctx.app).patch(`/v1/users/${lead}`))
      .send({ role: 'developer' })
      .expect(200);
    expect((await as(request(ctx.app).get('/v1/rooms'))).status).toBe(200);
    expect((await as(request(ctx.app).get('/v1/outbox'))).status).toBe(403);
    const mint = await as(request(ctx.app).post('/v1/keys')).send({
      name: 'Back door',
      role: 'admin',
      ownerId: ctx.users.admin,
    });
    expect(mint.status).toBe(403);
    expect(await ctx.db.models.ApiKey.count({ where: { name: 'Back door' } })).toBe(0);
  });
});

describe('a demoted developer', () => {
  it('can no longer create rooms with a tuning key', async () => {
    const dev = await addUser('developer', 'rig-owner@test.example');
    const key = await ctx.addKey('tuning', dev);
    const room = {
      name: 'Stage 3',
      layout: '2.0',
      dimensions: { widthM: 6.1, lengthM: 7.4, heightM: 3.05 },
      listener: { x: 3.05, y: 3.3, z: 1.2 },
      loudspeakers: [
        { id: 'M+030', x: 1.49, y: 0.6, z: 1.2 },
        { id: 'M-030', x: 4.61, y: 0.6, z: 1.2 },
      ],
    };
    const create = () => request(ctx.app).post('/v1/rooms').set('Authorization', `Bearer ${key}`).send(room);
    expect((await create()).status).toBe(201);
    await asAdmin(request(ctx.app).patch(`/v1/users/${dev}`))
      .send({ role: 'viewer' })
      .expect(200);
    const refused = await create();
    expect(refused.status).toBe(403);
    expect(refused.body.detail).toContain('viewer');
    expect(await ctx.db.models.Room.count({ where: { ownerId: dev } })).toBe(1);
  });
});
