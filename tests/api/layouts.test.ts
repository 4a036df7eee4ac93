import request from 'supertest';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const get = (path: string, key = ctx.keys.calculate) =>
  request(ctx.app).get(path).set('Authorization', `Bearer ${key}`);

describe('GET /v1/layouts', () => {
  it('lists systems A–J and 9.1.6 with names and aliases', async () => {
    const res = await get('/v1/layouts');
    expect(res.status).toBe(200);
    expectToMatchContract('listLayouts', 200, res.body);
    expect(res.body.hasMore).toBe(false);
    const byName = Object.fromEntries(
      res.body.data.map((l: { name: string; system: string | null }) => [l.name, l.system]),
    );
    // Source: ITU-R BS.2051-3 — the BS.2051-3 system names A 0+2+0 … J 4+7+0.
    expect(byName).toMatchObject({
      '0+2+0': 'A',
      '0+5+0': 'B',
      '2+5+0': 'C',
      '4+5+0': 'D',
      '4+5+1': 'E',
      '3+7+0': 'F',
      '4+9+0': 'G',
      '9+10+3': 'H',
      '0+7+0': 'I',
      '4+7+0': 'J',
    });
    expect(
      res.body.data.find((l: { aliases: string[] }) => l.aliases.includes('9.1.6')).channels,
    ).toHaveLength(16);
  });
});

describe('GET /v1/layouts/{layoutId}', () => {
  // Source: ITU-R BS.2051-3, system J (Table 11, number from memory): U±045 30..45° / 30..55°.
  it.each(['7.1.4', '4%2B7%2B0', '4+7+0', 'bs2051-j', 'J'])(
    '%s → system J with the U+045 row of the standard',
    async (key) => {
      const res = await get(`/v1/layouts/${key}`);
      expect(res.status).toBe(200);
      expectToMatchContract('getLayout', 200, res.body);
      expect(res.body.id).toBe('bs2051-j');
      const u045 = res.body.channels.find((c: { label: string }) => c.label === 'U+045');
      expect(u045).toMatchObject({
        azimuthDeg: 45,
        elevationDeg: 30,
        azimuthRangesDeg: [[30, 45]],
        elevationRangeDeg: [30, 55],
      });
    },
  );

  it('an unknown layout is a 404 problem document', async () => {
    const res = await get('/v1/layouts/13.1');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(res.body.detail).toMatch(/13\.1/);
  });

  it('needs credentials', async () => {
    const res = await request(ctx.app).get('/v1/layouts');
    expect(res.status).toBe(401);
  });
});
