import request from 'supertest';
import { cookbookPeakingDb } from '../../shared/filters/test-helpers';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectProblem } from './calculation-helpers';

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

const house = {
  name: 'House curve',
  notes: 'Demo data: invented.',
  points: [
    { frequencyHz: 20, gainDb: 4 },
    { frequencyHz: 200, gainDb: 0 },
    { frequencyHz: 20000, gainDb: 0 },
  ],
};

describe('target curves', () => {
  let id: string;

  it('stores a curve (201, Location), lists and reads it; owner-scoped like rooms', async () => {
    const res = await as(ctx.keys.tuning).post('/v1/target-curves', house);
    expect(res.status).toBe(201);
    expectToMatchContract('createTargetCurve', 201, res.body);
    id = res.body.id;
    expect(id).toMatch(/^tgc_/);
    expect(res.headers.location).toBe(`/v1/target-curves/${id}`);
    expect(res.body).toMatchObject({ name: 'House curve', points: house.points });

    const list = await as(ctx.keys.tuning).get('/v1/target-curves');
    expect(list.status).toBe(200);
    expectToMatchContract('listTargetCurves', 200, list.body);
    expect(list.body.data.map((c: { id: string }) => c.id)).toEqual([id]);
    expect((await as(ctx.keys.tuning).get(`/v1/target-curves/${id}`)).body.id).toBe(id);
    expect((await as(ctx.keys.admin).get(`/v1/target-curves/${id}`)).status).toBe(200);
    expect((await as(ctx.keys.otherTuning).get(`/v1/target-curves/${id}`)).status).toBe(404);
    expect((await as(ctx.keys.otherTuning).get('/v1/target-curves')).body.data).toEqual([]);
    expect((await as(ctx.keys.otherTuning).delete(`/v1/target-curves/${id}`)).status).toBe(404);
    expect((await as(ctx.keys.calculate).get('/v1/target-curves')).status).toBe(403);
  });

  it('refuses a second curve of the same name for one owner (409), not for another owner', async () => {
    expectProblem(await as(ctx.keys.tuning).post('/v1/target-curves', house), 409, '/body/name');
    expect((await as(ctx.keys.otherTuning).post('/v1/target-curves', house)).status).toBe(201);
  });

  it.each([
    ['one point', { name: 'x', points: [{ frequencyHz: 100, gainDb: 0 }] }, 400, '/body/points'],
    [
      'a level out of range',
      {
        name: 'x',
        points: [
          { frequencyHz: 100, gainDb: 0 },
          { frequencyHz: 200, gainDb: 41 },
        ],
      },
      400,
      '/body/points/1/gainDb',
    ],
    [
      'frequencies not ascending',
      {
        name: 'x',
        points: [
          { frequencyHz: 200, gainDb: 0 },
          { frequencyHz: 100, gainDb: 1 },
        ],
      },
      422,
      '/body/points/1/frequencyHz',
    ],
    ['an empty name', { name: '', points: house.points }, 400, '/body/name'],
  ])('refuses %s', async (_what, body, status, pointer) => {
    expectProblem(await as(ctx.keys.tuning).post('/v1/target-curves', body), status, pointer);
  });

  it('PATCH renames and changes points; DELETE removes', async () => {
    const made = await as(ctx.keys.tuning).post('/v1/target-curves', { ...house, name: 'Temporary' });
    const changed = await as(ctx.keys.tuning).patch(`/v1/target-curves/${made.body.id}`, {
      name: 'Temporary 2',
      points: [
        { frequencyHz: 30, gainDb: 2 },
        { frequencyHz: 300, gainDb: 0 },
      ],
    });
    expect(changed.status).toBe(200);
    expectToMatchContract('updateTargetCurve', 200, changed.body);
    expect(changed.body).toMatchObject({
      name: 'Temporary 2',
      points: [{ frequencyHz: 30 }, { frequencyHz: 300 }],
    });
    expectProblem(
      await as(ctx.keys.tuning).patch(`/v1/target-curves/${made.body.id}`, { name: 'House curve' }),
      409,
    );
    expect((await as(ctx.keys.tuning).delete(`/v1/target-curves/${made.body.id}`)).status).toBe(204);
    expect((await as(ctx.keys.tuning).get(`/v1/target-curves/${made.body.id}`)).status).toBe(404);
  });

  describe('used by name in POST /v1/eq/fit', () => {
    const fs = 48000;
    const freqs = Array.from({ length: 241 }, (_, k) => 20 * Math.pow(1000, k / 240));
    const house20to200 = (f: number) => (f >= 200 ? 0 : 4 - 4 * Math.log10(f / 20));
    const body = (target: unknown) => ({
      sampleRateHz: fs,
      maxBands: 4,
      toHz: 200,
      target,
      measured: {
        frequenciesHz: freqs,
        magnitudeDb: freqs.map((f) => 80 + house20to200(f) + cookbookPeakingDb(55, 7, 5, f, fs)),
      },
    });

    it('fits toward the stored points exactly as toward the same points given inline', async () => {
      const stored = await as(ctx.keys.tuning).post(
        '/v1/eq/fit',
        body({ kind: 'stored', name: 'House curve' }),
      );
      expect(stored.status).toBe(200);
      expectToMatchContract('fitEq', 200, stored.body);
      const inline = await as(ctx.keys.tuning).post(
        '/v1/eq/fit',
        body({ kind: 'points', points: house.points }),
      );
      expect(stored.body.bands).toEqual(inline.body.bands);
      expect(stored.body.bands).toHaveLength(1);
      expect(stored.body.residualRmsDb.after).toBeLessThan(0.3);
    });

    it('refuses a name the caller has not stored (422) and a key that may not read stored curves (403)', async () => {
      expectProblem(
        await as(ctx.keys.tuning).post('/v1/eq/fit', body({ kind: 'stored', name: 'Nope' })),
        422,
        '/body/target/name',
      );
      expectProblem(
        await as(ctx.keys.calculate).post('/v1/eq/fit', body({ kind: 'stored', name: 'House curve' })),
        403,
      );
    });
  });
});
