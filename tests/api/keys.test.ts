import request from 'supertest';
import { KEY_PATTERN } from '../../api/auth/key-secret';
import { newId } from '../../api/db/ids';
import { givePasswords, CONSOLE_HEADERS, signedInAgent } from '../support/console-session';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
const asAdmin = () => ({ Authorization: `Bearer ${ctx.keys.admin}` });
const bearer = (secret: string) => ({ Authorization: `Bearer ${secret}` });

beforeAll(async () => {
  ctx = await createTestContext();
  await givePasswords(ctx);
});

afterAll(async () => {
  await ctx.close();
});

async function createKey(body: object, headers = asAdmin()) {
  const res = await request(ctx.app).post('/v1/keys').set(headers).send(body);
  if (res.status !== 201) throw new Error(`create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: string; secret: string; prefix: string; lastFour: string; ownerId: string };
}

async function auditActions(targetId: string): Promise<string[]> {
  const events = await ctx.db.models.AuditEvent.findAll({
    where: { targetId },
    order: [['createdAt', 'ASC']],
  });
  return events.map((e) => e.action);
}

describe('POST /v1/keys', () => {
  it('answers the clear key once, and the key works at once', async () => {
    const res = await request(ctx.app)
      .post('/v1/keys')
      .set(asAdmin())
      .send({ name: 'Render farm checks', role: 'calculate', ownerId: ctx.users.developer });
    expect(res.status).toBe(201);
    expectToMatchContract('createKey', 201, res.body);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers.location).toBe(`/v1/keys/${res.body.id}`);
    expect(res.body.secret).toMatch(KEY_PATTERN);
    expect(res.body.secret.startsWith(res.body.prefix)).toBe(true);
    expect(res.body.secret.endsWith(res.body.lastFour)).toBe(true);
    expect(res.body).toMatchObject({
      role: 'calculate',
      kind: 'live',
      ownerId: ctx.users.developer,
      status: 'active',
    });
    expect(res.body).not.toHaveProperty('secretHash');

    const used = await request(ctx.app).get('/v1/layouts').set(bearer(res.body.secret));
    expect(used.status).toBe(200);

    const shown = await request(ctx.app).get(`/v1/keys/${res.body.id}`).set(asAdmin());
    expect(shown.status).toBe(200);
    expectToMatchContract('getKey', 200, shown.body);
    expect(shown.body).not.toHaveProperty('secret');
    expect(shown.body).not.toHaveProperty('secretHash');
    expect(JSON.stringify(shown.body)).not.toContain(res.body.secret);
    expect(await auditActions(res.body.id)).toEqual(['key.created']);
  });

  it('mails the owner a notice naming the key (never the key itself) when someone else created it', async () => {
    const key = await createKey({ name: 'Stage 3 notice check', role: 'tuning', ownerId: ctx.users.other });
    const outbox = await request(ctx.app).get('/v1/outbox?limit=100').set(asAdmin());
    const notice = outbox.body.data.find(
      (m: { to: string; text: string }) =>
        m.to === 'other@test.example' && m.text.includes('Stage 3 notice check'),
    );
    expect(notice).toBeDefined();
    expect(notice.text).toContain(`${key.prefix}…${key.lastFour}`);
    expect(notice.text).toContain('admin@test.example');
    expect(notice.text).not.toContain(key.secret);

    const own = await createKey({ name: 'Admin own key', role: 'calculate' });
    const after = await request(ctx.app).get('/v1/outbox?limit=100').set(asAdmin());
    expect(JSON.stringify(after.body.data)).not.toContain(own.prefix);
  });

  it('makes iso_test_ keys on request', async () => {
    const key = await createKey({ name: 'Bench rig', role: 'tuning', kind: 'test' });
    expect(key.secret).toMatch(/^iso_test_/);
  });

  it('names each bad field', async () => {
    const res = await request(ctx.app)
      .post('/v1/keys')
      .set(asAdmin())
      .send({ name: '', role: 'root', rateLimitPerMinute: 0, colour: 'red' });
    expect(res.status).toBe(400);
    const pointers = (res.body.errors as Array<{ pointer: string }>).map((e) => e.pointer);
    expect(pointers).toEqual(
      expect.arrayContaining(['/body/name', '/body/role', '/body/rateLimitPerMinute', '/body/colour']),
    );
  });

  it('refuses control characters in a name', async () => {
    const res = await request(ctx.app)
      .post('/v1/keys')
      .set(asAdmin())
      .send({ name: 'tab\there', role: 'calculate' });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].pointer).toBe('/body/name');
  });

  it('refuses an expiry in the past', async () => {
    const res = await request(ctx.app)
      .post('/v1/keys')
      .set(asAdmin())
      .send({ name: 'Late', role: 'calculate', expiresAt: '2001-01-01T00:00:00Z' });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe('/body/expiresAt');
  });

  it('never gives a key more than its owner may do', async () => {
    const forViewer = await request(ctx.app)
      .post('/v1/keys')
      .set(asAdmin())
      .send({ name: 'Viewer key', role: 'calculate', ownerId: ctx.users.viewer });
    expect(forViewer.status).toBe(422);
    expect(forViewer.body.errors[0].pointer).toBe('/body/role');
    const adminForDeveloper = await request(ctx.app)
      .post('/v1/keys')
      .set(asAdmin())
      .send({ name: 'Too strong', role: 'admin', ownerId: ctx.users.developer });
    expect(adminForDeveloper.status).toBe(422);
    const nobody = await request(ctx.app)
      .post('/v1/keys')
      .set(asAdmin())
      .send({ name: 'Nobody', role: 'calculate', ownerId: 'usr_0000000000nobody' });
    expect(nobody.status).toBe(422);
    expect(nobody.body.errors[0].pointer).toBe('/body/ownerId');
  });
});

describe('a developer signed in to the console', () => {
  it('creates calculate and tuning keys for itself, never admin keys, for others or with a limit', async () => {
    const dev = await signedInAgent(ctx, 'developer');
    const own = await dev.post('/v1/keys').set(CONSOLE_HEADERS).send({ name: 'My laptop', role: 'tuning' });
    expect(own.status).toBe(201);
    expect(own.body.ownerId).toBe(ctx.users.developer);
    expect(own.body.createdById).toBe(ctx.users.developer);

    const admin = await dev.post('/v1/keys').set(CONSOLE_HEADERS).send({ name: 'Escalate', role: 'admin' });
    expect(admin.status).toBe(403);
    const forOther = await dev
      .post('/v1/keys')
      .set(CONSOLE_HEADERS)
      .send({ name: 'For other', role: 'calculate', ownerId: ctx.users.other });
    expect(forOther.status).toBe(403);
    const limited = await dev
      .post('/v1/keys')
      .set(CONSOLE_HEADERS)
      .send({ name: 'Fast', role: 'calculate', rateLimitPerMinute: 100000 });
    expect(limited.status).toBe(403);
  });

  it("sees only its own keys and cannot read, change or revoke anyone else's", async () => {
    const dev = await signedInAgent(ctx, 'developer');
    const list = await dev.get('/v1/keys?limit=100');
    expect(list.status).toBe(200);
    expect(list.body.data.length).toBeGreaterThanOrEqual(2);
    expect(new Set(list.body.data.map((k: { ownerId: string }) => k.ownerId))).toEqual(
      new Set([ctx.users.developer]),
    );

    const others = await dev.get(`/v1/keys?ownerId=${ctx.users.other}`);
    expect(others.status).toBe(403);

    const otherKey = await ctx.db.models.ApiKey.findOne({ where: { ownerId: ctx.users.other } });
    expect((await dev.get(`/v1/keys/${otherKey!.id}`)).status).toBe(404);
    expect(
      (await dev.patch(`/v1/keys/${otherKey!.id}`).set(CONSOLE_HEADERS).send({ name: 'mine now' })).status,
    ).toBe(404);
    expect((await dev.delete(`/v1/keys/${otherKey!.id}`).set(CONSOLE_HEADERS)).status).toBe(404);
    const stillWorks = await request(ctx.app).get('/v1/layouts').set(bearer(ctx.keys.otherTuning));
    expect(stillWorks.status).toBe(200);
  });

  it('a viewer may not manage keys at all', async () => {
    const viewer = await signedInAgent(ctx, 'viewer');
    expect((await viewer.get('/v1/keys')).status).toBe(403);
    expect(
      (await viewer.post('/v1/keys').set(CONSOLE_HEADERS).send({ name: 'x', role: 'calculate' })).status,
    ).toBe(403);
  });
});

describe('GET /v1/keys', () => {
  it('pages through every key with limit and startingAfter, each exactly once, oldest first', async () => {
    const ownerId = newId('usr');
    await ctx.db.write((transaction) =>
      ctx.db.models.User.create(
        {
          id: ownerId,
          email: 'pager@test.example',
          name: null,
          role: 'developer',
          passwordHash: null,
          lastSignInAt: null,
        },
        { transaction },
      ),
    );
    const made = [];
    for (let i = 0; i < 5; i += 1) {
      made.push((await createKey({ name: `Page ${i}`, role: 'calculate', ownerId })).id);
    }
    const seen: string[] = [];
    let cursor: string | undefined;
    let pages = 0;
    for (;;) {
      const res = await request(ctx.app)
        .get('/v1/keys')
        .query({ ownerId, limit: 2, ...(cursor && { startingAfter: cursor }) })
        .set(asAdmin());
      expect(res.status).toBe(200);
      expectToMatchContract('listKeys', 200, res.body);
      expect(res.body.data.length).toBeLessThanOrEqual(2);
      pages += 1;
      seen.push(...res.body.data.map((k: { id: string }) => k.id));
      if (!res.body.hasMore) break;
      cursor = res.body.data.at(-1).id;
    }
    expect(pages).toBe(3);
    expect(seen).toEqual(made);
    expect([...made].sort()).toEqual(made);
  });

  it('leaves revoked keys out unless asked', async () => {
    const key = await createKey({ name: 'Short-lived', role: 'calculate', ownerId: ctx.users.other });
    await request(ctx.app).delete(`/v1/keys/${key.id}`).set(asAdmin()).expect(200);
    const plain = await request(ctx.app).get(`/v1/keys?ownerId=${ctx.users.other}&limit=100`).set(asAdmin());
    expect(plain.body.data.map((k: { id: string }) => k.id)).not.toContain(key.id);
    const all = await request(ctx.app)
      .get(`/v1/keys?ownerId=${ctx.users.other}&limit=100&includeRevoked=true`)
      .set(asAdmin());
    const revoked = all.body.data.find((k: { id: string }) => k.id === key.id);
    expect(revoked.status).toBe('revoked');
  });

  it('is refused to keys without a keys permission', async () => {
    for (const secret of [ctx.keys.calculate, ctx.keys.tuning]) {
      const res = await request(ctx.app).get('/v1/keys').set(bearer(secret));
      expect(res.status).toBe(403);
    }
  });
});

describe('PATCH /v1/keys/{keyId}', () => {
  it('renames, sets the limit and the expiry, and records it', async () => {
    const key = await createKey({
      name: 'Sweep rig — Stage 3',
      role: 'tuning',
      ownerId: ctx.users.developer,
    });
    const res = await request(ctx.app)
      .patch(`/v1/keys/${key.id}`)
      .set(asAdmin())
      .send({ name: 'Sweep rig — night shift', rateLimitPerMinute: 60, expiresAt: '2031-01-01T00:00:00Z' });
    expect(res.status).toBe(200);
    expectToMatchContract('updateKey', 200, res.body);
    expect(res.body).toMatchObject({
      name: 'Sweep rig — night shift',
      rateLimitPerMinute: 60,
      expiresAt: '2031-01-01T00:00:00.000Z',
    });
    const cleared = await request(ctx.app)
      .patch(`/v1/keys/${key.id}`)
      .set(asAdmin())
      .send({ rateLimitPerMinute: null, expiresAt: null });
    expect(cleared.body).toMatchObject({ rateLimitPerMinute: null, expiresAt: null });
    expect(await auditActions(key.id)).toEqual(['key.created', 'key.updated', 'key.updated']);
  });

  it('refuses an empty change and a revoked key', async () => {
    const key = await createKey({ name: 'To revoke', role: 'calculate' });
    expect((await request(ctx.app).patch(`/v1/keys/${key.id}`).set(asAdmin()).send({})).status).toBe(400);
    await request(ctx.app).delete(`/v1/keys/${key.id}`).set(asAdmin()).expect(200);
    const res = await request(ctx.app)
      .patch(`/v1/keys/${key.id}`)
      .set(asAdmin())
      .send({ name: 'Back again' });
    expect(res.status).toBe(409);
  });

  it('a key past its expiry is refused and listed as expired', async () => {
    const key = await createKey({ name: 'Temp', role: 'calculate', expiresAt: '2035-01-01T00:00:00Z' });
    expect((await request(ctx.app).get('/v1/layouts').set(bearer(key.secret))).status).toBe(200);
    // Time passing, simulated: the expiry moves into the past behind the service's back.
    await ctx.db.write((transaction) =>
      ctx.db.models.ApiKey.update(
        { expiresAt: new Date(Date.now() - 1000) },
        { where: { id: key.id }, transaction },
      ),
    );
    ctx.services.keys.invalidate();
    const refused = await request(ctx.app).get('/v1/layouts').set(bearer(key.secret));
    expect(refused.status).toBe(401);
    expect(refused.headers['www-authenticate']).toContain('invalid_token');
    const shown = await request(ctx.app).get(`/v1/keys/${key.id}`).set(asAdmin());
    expect(shown.body.status).toBe('expired');
  });
});

describe('DELETE /v1/keys/{keyId}', () => {
  it('revokes with 200 and the revoked key; again changes nothing', async () => {
    const key = await createKey({ name: 'Old rig', role: 'calculate' });
    const first = await request(ctx.app).delete(`/v1/keys/${key.id}`).set(asAdmin());
    expect(first.status).toBe(200);
    expectToMatchContract('revokeKey', 200, first.body);
    expect(first.body.status).toBe('revoked');
    expect(Date.parse(first.body.revokedAt)).toBeGreaterThan(0);
    const second = await request(ctx.app).delete(`/v1/keys/${key.id}`).set(asAdmin());
    expect(second.status).toBe(200);
    expect(second.body.revokedAt).toBe(first.body.revokedAt);
    expect(await auditActions(key.id)).toEqual(['key.created', 'key.revoked']);
  });

  it('answers 404 for an unknown key and 400 for a malformed id', async () => {
    expect((await request(ctx.app).delete('/v1/keys/key_0000000000000000000zz').set(asAdmin())).status).toBe(
      404,
    );
    const bad = await request(ctx.app).delete('/v1/keys/not-a-key').set(asAdmin());
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].pointer).toBe('/params/keyId');
  });
});
