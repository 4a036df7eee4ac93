import request from 'supertest';
import { stage3MeasuredResponses } from '../../seeds/demo-stage3-measurements';
import { STAGE3_PROFILE, STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { createTestContext, type TestContext } from '../support/test-context';

/**
 * A tuning stored from a plan of a stored room: the EQ fit keeps to the room's processor profile (so the
 * limit check after it has nothing to refuse) and may name a stored target curve.
 */
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const post = (path: string, body: object) =>
  request(ctx.app).post(path).set('Authorization', `Bearer ${ctx.keys.tuning}`).send(body);

it('fits within a tight profile (3 bands, Q ≤ 2, cuts to −6 dB in 0.5 dB steps) and stores the tuning', async () => {
  const profile = await post('/v1/processor-profiles', {
    ...STAGE3_PROFILE,
    name: 'Tight 3-band (test)',
    eq: {
      ...STAGE3_PROFILE.eq,
      bandsPerChannel: 3,
      gainDb: { min: -6, max: 3, step: 0.5 },
      q: { min: 0.5, max: 2, step: 0.01 },
    },
  });
  expect(profile.status).toBe(201);
  const room = await post('/v1/rooms', { ...STAGE3_ROOM, profileId: profile.body.id });
  expect(room.status).toBe(201);
  await post('/v1/target-curves', {
    name: 'Gentle lift',
    points: [
      { frequencyHz: 20, gainDb: 3 },
      { frequencyHz: 120, gainDb: 0 },
      { frequencyHz: 20000, gainDb: 0 },
    ],
  });
  const responses = stage3MeasuredResponses();
  const res = await post(`/v1/rooms/${room.body.id}/tunings`, {
    name: 'From the plan',
    plan: {
      channels: STAGE3_ROOM.loudspeakers.map(({ id }) => ({
        id,
        bassManaged: false,
        ...(responses[id] && { measuredResponse: responses[id] }),
      })),
      targets: { curve: { kind: 'stored', name: 'Gentle lift' }, reverberationTimeS: 0.5 },
    },
  });
  expect(res.status).toBe(201);
  const bands = res.body.channels.flatMap((c: { eq: Array<{ gainDb: number; q: number }> }) => c.eq);
  expect(bands.length).toBeGreaterThan(0);
  for (const channel of res.body.channels) expect(channel.eq.length).toBeLessThanOrEqual(3);
  for (const b of bands) {
    expect(b.q).toBeLessThanOrEqual(2);
    expect(b.gainDb).toBeGreaterThanOrEqual(-6);
    expect(Math.abs(b.gainDb * 2 - Math.round(b.gainDb * 2))).toBeLessThan(1e-9);
  }
});

it('names an unknown stored curve in the plan with a 422 at its field', async () => {
  const room = await post('/v1/rooms', STAGE3_ROOM);
  const res = await post(`/v1/rooms/${room.body.id}/tunings`, {
    name: 'x',
    plan: { targets: { curve: { kind: 'stored', name: 'Nope' } } },
  });
  expect(res.status).toBe(422);
  expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(
    '/body/plan/targets/curve/name',
  );
});
