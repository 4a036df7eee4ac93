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

const post = (body: unknown) =>
  request(ctx.app)
    .post('/v1/geometry')
    .set('Authorization', `Bearer ${ctx.keys.calculate}`)
    .send(body as object);

const stage3 = () => ({
  room: STAGE3_ROOM.dimensions,
  listener: STAGE3_ROOM.listener,
  layout: '7.1.4',
  speakers: STAGE3_ROOM.loudspeakers.map(({ id, x, y, z }) => ({ id, x, y, z })),
});

describe('POST /v1/geometry', () => {
  // Hand computation: a loudspeaker 2 m ahead and 2 m to the left at ear height is at +45°, √8 = 2.828427 m.
  it('2 m ahead and 2 m left → +45°, 2.828 m', async () => {
    const res = await post({
      room: { widthM: 5, lengthM: 6, heightM: 3 },
      listener: { x: 2.5, y: 3, z: 1.2 },
      speakers: [{ id: 'M+045', x: 0.5, y: 1, z: 1.2 }],
    });
    expect(res.status).toBe(200);
    expectToMatchContract('computeGeometry', 200, res.body);
    expect(res.body.speakers[0].azimuthDeg).toBeCloseTo(45, 9);
    expect(res.body.speakers[0].distanceM).toBeCloseTo(2.8284271, 6);
    expect(res.body.speakers[0].elevationDeg).toBeCloseTo(0, 9);
  });

  // Demo room (invented): U-135 mounted at x 4.33, y 4.34 → hand computation atan2(−1.28, −1.04) = −129.09°,
  // 5.9° off nominal, inside system J's −150..−100°; the fronts at ±30.02° (atan(1.56/2.70)).
  it('the demo room Stage 3: the top-back loudspeaker is about 6° off nominal and within range', async () => {
    const res = await post(stage3());
    expect(res.status).toBe(200);
    expectToMatchContract('computeGeometry', 200, res.body);
    const byId = Object.fromEntries(res.body.speakers.map((s: { id: string }) => [s.id, s]));
    expect(byId['U-135'].azimuthDeg).toBeCloseTo((Math.atan2(-1.28, -1.04) * 180) / Math.PI, 6);
    expect(byId['U-135'].deviation.azimuthDeg).toBeCloseTo(5.91, 2);
    expect(byId['U-135'].withinTolerance).toBe(true);
    expect(byId['M+030'].azimuthDeg).toBeCloseTo((Math.atan(1.56 / 2.7) * 180) / Math.PI, 6);
    expect(byId['M+135'].distanceM).toBeLessThan(byId['M+030'].distanceM);
    expect(byId.LFE1.withinTolerance).toBeNull();
    expect(res.body.warnings).toEqual([]);
  });

  it('with no allowance the demo centre loudspeaker (1.04° below ear height) is out of range', async () => {
    const res = await post({ ...stage3(), angleToleranceDeg: 0 });
    expect(res.status).toBe(200);
    expect(res.body.warnings).toEqual([
      expect.objectContaining({ code: 'elevationOutOfRange', channel: 'M+000' }),
    ]);
  });

  describe('bad input names the field', () => {
    it('a loudspeaker outside the room → 422 at /body/speakers/6/y', async () => {
      const body = stage3();
      body.speakers[6] = { ...body.speakers[6], y: 7.9 };
      const res = await post(body);
      expect(res.status).toBe(422);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(res.body.errors).toEqual([expect.objectContaining({ pointer: '/body/speakers/6/y' })]);
    });

    it('a repeated channel id → 422 naming the second one', async () => {
      const body = stage3();
      body.speakers[5] = { ...body.speakers[5], id: 'M+090' };
      const res = await post(body);
      expect(res.status).toBe(422);
      expect(res.body.errors[0].pointer).toBe('/body/speakers/5/id');
    });

    it('an unknown layout → 422 at /body/layout', async () => {
      const res = await post({ ...stage3(), layout: '13.1' });
      expect(res.status).toBe(422);
      expect(res.body.errors[0].pointer).toBe('/body/layout');
    });

    it('a missing coordinate and an unknown property → 400 naming both', async () => {
      const body = stage3() as Record<string, unknown>;
      body.speakers = [{ id: 'M+030', x: 1, y: 1 }];
      body.colour = 'red';
      const res = await post(body);
      expect(res.status).toBe(400);
      const pointers = res.body.errors.map((e: { pointer: string }) => e.pointer);
      expect(pointers).toEqual(expect.arrayContaining(['/body/speakers/0/z', '/body/colour']));
    });

    it('129 loudspeakers → 400', async () => {
      const speakers = Array.from({ length: 129 }, (_, i) => ({ id: `S${i}`, x: 1, y: 1, z: 1 }));
      const res = await post({ ...stage3(), speakers });
      expect(res.status).toBe(400);
      expect(res.body.errors[0].pointer).toBe('/body/speakers');
    });
  });
});
