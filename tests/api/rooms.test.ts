import request from 'supertest';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const as = (key: string) => ({
  get: (path: string) => request(ctx.app).get(path).set('Authorization', `Bearer ${key}`),
  post: (path: string, body: unknown) =>
    request(ctx.app)
      .post(path)
      .set('Authorization', `Bearer ${key}`)
      .send(body as object),
  patch: (path: string, body: unknown) =>
    request(ctx.app)
      .patch(path)
      .set('Authorization', `Bearer ${key}`)
      .send(body as object),
  delete: (path: string) => request(ctx.app).delete(path).set('Authorization', `Bearer ${key}`),
});

const stage3 = () => structuredClone({ ...STAGE3_ROOM });

describe('rooms', () => {
  let roomId: string;

  it('POST /v1/rooms stores the demo room and answers 201 with its geometry', async () => {
    const res = await as(ctx.keys.tuning).post('/v1/rooms', stage3());
    expect(res.status).toBe(201);
    expectToMatchContract('createRoom', 201, res.body);
    roomId = res.body.id;
    expect(res.headers.location).toBe(`/v1/rooms/${roomId}`);
    expect(res.body).toMatchObject({
      name: 'Stage 3',
      layout: 'bs2051-j',
      layoutName: '4+7+0',
      ownerId: ctx.users.developer,
    });
    const u135 = res.body.geometry.speakers.find((s: { id: string }) => s.id === 'U-135');
    // Hand computation: atan2(−(4.33 − 3.05), −(4.34 − 3.30)) = −129.09°, 5.91° off the nominal −135°.
    expect(u135.deviation.azimuthDeg).toBeCloseTo(5.91, 2);
  });

  it('GET /v1/rooms/{roomId} returns it to its owner and to an admin', async () => {
    const own = await as(ctx.keys.tuning).get(`/v1/rooms/${roomId}`);
    expect(own.status).toBe(200);
    expectToMatchContract('getRoom', 200, own.body);
    expect(own.body.loudspeakers).toHaveLength(12);
    expect((await as(ctx.keys.admin).get(`/v1/rooms/${roomId}`)).status).toBe(200);
  });

  it('another owner gets 404, a calculate key 403', async () => {
    const other = await as(ctx.keys.otherTuning).get(`/v1/rooms/${roomId}`);
    expect(other.status).toBe(404);
    expect(other.headers['content-type']).toMatch(/application\/problem\+json/);
    expect((await as(ctx.keys.otherTuning).patch(`/v1/rooms/${roomId}`, { name: 'mine now' })).status).toBe(
      404,
    );
    expect((await as(ctx.keys.otherTuning).delete(`/v1/rooms/${roomId}`)).status).toBe(404);
    const calc = await as(ctx.keys.calculate).get(`/v1/rooms/${roomId}`);
    expect(calc.status).toBe(403);
    expect((await as(ctx.keys.calculate).post('/v1/rooms', stage3())).status).toBe(403);
  });

  it('lists are per owner and paginate with a cursor', async () => {
    for (const name of ['Stage 4', 'Stage 5']) {
      expect((await as(ctx.keys.tuning).post('/v1/rooms', { ...stage3(), name })).status).toBe(201);
    }
    await as(ctx.keys.otherTuning).post('/v1/rooms', { ...stage3(), name: 'Elsewhere' });
    const first = await as(ctx.keys.tuning).get('/v1/rooms?limit=2');
    expect(first.status).toBe(200);
    expectToMatchContract('listRooms', 200, first.body);
    expect(first.body.data.map((r: { name: string }) => r.name)).toEqual(['Stage 3', 'Stage 4']);
    expect(first.body.hasMore).toBe(true);
    const next = await as(ctx.keys.tuning).get(`/v1/rooms?limit=2&startingAfter=${first.body.data[1].id}`);
    expect(next.body.data.map((r: { name: string }) => r.name)).toEqual(['Stage 5']);
    expect(next.body.hasMore).toBe(false);
    const all = await as(ctx.keys.admin).get('/v1/rooms?limit=100');
    expect(all.body.data.map((r: { name: string }) => r.name)).toEqual(
      expect.arrayContaining(['Stage 3', 'Elsewhere']),
    );
  });

  it('PATCH changes the given fields and re-checks the geometry', async () => {
    const loudspeakers = stage3().loudspeakers.map((s) =>
      s.id === 'U-135' ? { ...s, x: 4.22, y: 4.47 } : s,
    );
    const res = await as(ctx.keys.tuning).patch(`/v1/rooms/${roomId}`, {
      loudspeakers,
      notes: 'U-135 remounted',
    });
    expect(res.status).toBe(200);
    expectToMatchContract('updateRoom', 200, res.body);
    expect(res.body.notes).toBe('U-135 remounted');
    expect(res.body.name).toBe('Stage 3');
    const u135 = res.body.geometry.speakers.find((s: { id: string }) => s.id === 'U-135');
    expect(u135.azimuthDeg).toBeCloseTo(-135, 6);
  });

  describe('bad input names the field', () => {
    it('a loudspeaker outside the room → 422 /body/loudspeakers/6/y', async () => {
      const body = stage3();
      body.loudspeakers[6] = { ...body.loudspeakers[6], y: 7.45 };
      const res = await as(ctx.keys.tuning).post('/v1/rooms', body);
      expect(res.status).toBe(422);
      expect(res.body.errors).toEqual([expect.objectContaining({ pointer: '/body/loudspeakers/6/y' })]);
    });

    it('duplicate channel ids → 422 naming the second', async () => {
      const body = stage3();
      body.loudspeakers[9] = { ...body.loudspeakers[9], id: 'U+045' };
      const res = await as(ctx.keys.tuning).post('/v1/rooms', body);
      expect(res.status).toBe(422);
      expect(res.body.errors[0].pointer).toBe('/body/loudspeakers/9/id');
    });

    it('an unknown layout → 422 /body/layout; in PATCH too', async () => {
      const res = await as(ctx.keys.tuning).post('/v1/rooms', { ...stage3(), layout: '7.1.6' });
      expect(res.status).toBe(422);
      expect(res.body.errors[0].pointer).toBe('/body/layout');
      const patch = await as(ctx.keys.tuning).patch(`/v1/rooms/${roomId}`, { layout: 'quad' });
      expect(patch.status).toBe(422);
    });

    it('a listener outside shrunk dimensions is refused and nothing is changed', async () => {
      const res = await as(ctx.keys.tuning).patch(`/v1/rooms/${roomId}`, {
        dimensions: { widthM: 6.1, lengthM: 3, heightM: 3.05 },
      });
      expect(res.status).toBe(422);
      expect(res.body.errors[0].pointer).toBe('/body/listener/y');
      expect((await as(ctx.keys.tuning).get(`/v1/rooms/${roomId}`)).body.dimensions.lengthM).toBe(7.4);
    });

    it('missing fields and wrong types → 400 naming each', async () => {
      const res = await as(ctx.keys.tuning).post('/v1/rooms', {
        name: 'x',
        layout: '5.1',
        dimensions: { widthM: 'wide' },
      });
      expect(res.status).toBe(400);
      const pointers = res.body.errors.map((e: { pointer: string }) => e.pointer);
      expect(pointers).toEqual(
        expect.arrayContaining(['/body/listener', '/body/loudspeakers', '/body/dimensions/widthM']),
      );
    });
  });

  it('DELETE removes the room; then 404', async () => {
    const created = await as(ctx.keys.tuning).post('/v1/rooms', { ...stage3(), name: 'Temporary' });
    expect((await as(ctx.keys.tuning).delete(`/v1/rooms/${created.body.id}`)).status).toBe(204);
    expect((await as(ctx.keys.tuning).get(`/v1/rooms/${created.body.id}`)).status).toBe(404);
  });
});

describe('GET /v1/rooms/{roomId}/report', () => {
  let reportRoomId: string;

  beforeAll(async () => {
    const created = await as(ctx.keys.tuning).post('/v1/rooms', {
      ...stage3(),
      name: 'Stage 3 <script>alert(1)</script>',
      notes: 'Demo & test "notes"',
    });
    reportRoomId = created.body.id;
  });

  it('without a tuning: the room, its top view and positions, no settings', async () => {
    const res = await as(ctx.keys.tuning).get(`/v1/rooms/${reportRoomId}/report`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    // A document's policy: its own inline styles apply, no script runs, nothing loads, nobody frames it.
    expect(res.headers['content-security-policy']).toMatch(/style-src 'unsafe-inline'/);
    expect(res.headers['content-security-policy']).toMatch(/default-src 'none'.*frame-ancestors 'none'/);
    expect(res.headers['content-security-policy']).not.toMatch(/script-src/);
    expect(res.text).toContain('<svg');
    expect(res.text).toContain('No tuning is stored for this room yet.');
    // Every stored string is escaped: no markup from a room name reaches the page.
    expect(res.text).not.toContain('<script>');
    expect(res.text).toContain('Stage 3 &lt;script&gt;alert(1)&lt;/script&gt;');
    expect(res.text).toContain('Demo &amp; test &quot;notes&quot;');
    // Self-contained: no external scripts, stylesheets, images or fonts.
    expect(res.text).not.toMatch(/<script|<link|src=|url\(/i);
    expect(res.text).toContain('qualified installers under local codes');
  });

  it('with a tuning: settings, correction plots, cautions, who tuned it and when', async () => {
    const tuning = await as(ctx.keys.tuning).post(`/v1/rooms/${reportRoomId}/tunings`, {
      name: 'Report check',
      channels: [
        {
          id: 'M+030',
          delayMs: 1.5636,
          trimDb: -1.6,
          eq: [{ type: 'peaking', frequencyHz: 209.7, gainDb: -3.5, q: 2.3 }],
          highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
        },
        { id: 'LFE1', trimDb: 1.5 },
      ],
      subwoofer: {
        channel: 'LFE1',
        lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
        lfeGainDb: 10,
      },
    });
    expect(tuning.status).toBe(201);
    const res = await as(ctx.keys.tuning).get(`/v1/rooms/${reportRoomId}/report?tuningId=${tuning.body.id}`);
    expect(res.status).toBe(200);
    expect(res.text).toContain('Report check (version 1)');
    expect(res.text).toContain('dev@test.example');
    expect(res.text).toContain('LR4 80 Hz');
    expect(res.text).toContain('peaking 209.7 Hz −3.5 dB Q 2.30');
    expect(res.text).toContain('low-pass LR4 80 Hz');
    expect((res.text.match(/<svg/g) ?? []).length).toBe(1 + 2);
    expect(res.text).toContain('Boosts: LFE1 (trim +1.5 dB)');
    expect(res.text).toContain('Correction responses');
  });

  it('owner isolation: 404 for another owner, 403 for a calculate key; a tuning of another room is refused', async () => {
    expect((await as(ctx.keys.otherTuning).get(`/v1/rooms/${reportRoomId}/report`)).status).toBe(404);
    expect((await as(ctx.keys.calculate).get(`/v1/rooms/${reportRoomId}/report`)).status).toBe(403);
    const other = await as(ctx.keys.tuning).post('/v1/rooms', { ...stage3(), name: 'Another' });
    const foreign = await as(ctx.keys.tuning).post(`/v1/rooms/${other.body.id}/tunings`, {
      name: 'x',
      channels: [{ id: 'M+030' }],
    });
    expect(
      (await as(ctx.keys.tuning).get(`/v1/rooms/${reportRoomId}/report?tuningId=${foreign.body.id}`)).status,
    ).toBe(404);
  });
});
