import request from 'supertest';
import { STAGE3_REFERENCE_DB, STAGE3_ROOM, STAGE3_SPL_DB } from '../../seeds/demo-stage3-room';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectAnswered } from '../support/presentation';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const post = (body: unknown, key = ctx.keys.calculate) =>
  request(ctx.app)
    .post('/v1/plans')
    .set('Authorization', `Bearer ${key}`)
    .send(body as object);

const stage3 = () => ({
  layout: '7.1.4',
  room: STAGE3_ROOM.dimensions,
  listener: STAGE3_ROOM.listener,
  temperatureC: 21,
  sampleRateHz: 48000,
  targets: { referenceDb: STAGE3_REFERENCE_DB, crossoverHz: 80 },
  limits: { delayMaxMs: 75, trimMinDb: -12, trimMaxDb: 12, eqBandsPerChannel: 8 },
  channels: STAGE3_ROOM.loudspeakers.map(({ id, x, y, z }) => ({
    id,
    position: { x, y, z },
    measuredDb: STAGE3_SPL_DB[id],
    ...(id.startsWith('LFE') ? {} : { bassManaged: true }),
  })),
});

describe('POST /v1/plans', () => {
  it('plans the demo room Stage 3 end to end', async () => {
    const res = await post(stage3());
    expect(res.status).toBe(200);
    expectToMatchContract('createPlan', 200, res.body);
    expect(res.body.layout.id).toBe('bs2051-j');
    expect(res.body.channels).toHaveLength(12);
    const c = 343.2 * Math.sqrt(294.15 / 293.15); // ISO 9613-1 form, as in the pyfar library at 21 °C
    // Hand computation from the demo coordinates: rear surround M-135 at √(1.8² + 1.8²) = 2.54558 m,
    // the subwoofer at 3.65582 m → (3.65582 − 2.54558)/c = 3.2295 ms, 155 samples at 48 kHz.
    const rear = res.body.channels.find((ch: { id: string }) => ch.id === 'M-135');
    const expectedMs = ((Math.sqrt(2.15 ** 2 + 2.8 ** 2 + 0.95 ** 2) - Math.sqrt(2 * 1.8 ** 2)) / c) * 1000;
    expectAnswered(rear.delayMs, expectedMs, 'ms');
    expect(rear.delaySamples).toBe(Math.round(expectedMs * 48));
    expect(rear.trimDb).toBeCloseTo(79 - 82.7, 9);
    expect(res.body.subwoofer).toMatchObject({ channel: 'LFE1', lfeGainDb: 10, suggestedPolarity: 'normal' });
    expect(res.body.cautions.map((x: { code: string }) => x.code)).toEqual(
      expect.arrayContaining(['testSignalLevel', 'bassSumming', 'overheadMounting']),
    );
  });

  it('full range (nothing bass-managed): no high-pass anywhere, the LFE still feeds the subwoofer', async () => {
    const body = stage3();
    body.channels = body.channels.map(
      ({ bassManaged: _b, ...rest }: { bassManaged?: boolean }) => rest,
    ) as typeof body.channels;
    const res = await post(body);
    expect(res.status).toBe(200);
    expect(res.body.channels.every((ch: { highPass: unknown }) => ch.highPass === null)).toBe(true);
    // Only the LFE at +10 dB feeds the subwoofer: headroom 20·log10(10^(10/20)) = 10 dB.
    expect(res.body.subwoofer.headroomDb).toBeCloseTo(10, 9);
  });

  describe('bad input names the field', () => {
    it('a loudspeaker outside the room → 422 /body/channels/6/position/y', async () => {
      const body = stage3();
      body.channels[6] = { ...body.channels[6], position: { x: 1.25, y: 7.5, z: 1.2 } };
      const res = await post(body);
      expect(res.status).toBe(422);
      expect(res.body.errors).toEqual([expect.objectContaining({ pointer: '/body/channels/6/position/y' })]);
    });

    it('duplicate channel ids → 422 /body/channels/1/id', async () => {
      const body = stage3();
      body.channels[1] = { ...body.channels[1], id: 'M+030' };
      const res = await post(body);
      expect(res.status).toBe(422);
      expect(res.body.errors[0].pointer).toBe('/body/channels/1/id');
    });

    it('an unknown layout → 422 /body/layout', async () => {
      const res = await post({ ...stage3(), layout: '11.1' });
      expect(res.status).toBe(422);
      expect(res.body.errors[0].pointer).toBe('/body/layout');
    });

    it('a crossover above Nyquist → 422 /body/targets/crossoverHz', async () => {
      const res = await post({ ...stage3(), sampleRateHz: 44100, targets: { crossoverHz: 30000 } });
      expect(res.status).toBe(422);
      expect(res.body.errors[0].pointer).toBe('/body/targets/crossoverHz');
    });

    it('no credentials → 401', async () => {
      expect((await request(ctx.app).post('/v1/plans').send(stage3())).status).toBe(401);
    });

    it('wrong types → 400 naming each', async () => {
      const res = await post({ layout: 7, channels: [{ id: 'M+030', measuredDb: 'loud' }] });
      expect(res.status).toBe(400);
      const pointers = res.body.errors.map((e: { pointer: string }) => e.pointer);
      expect(pointers).toEqual(expect.arrayContaining(['/body/layout', '/body/channels/0/measuredDb']));
    });
  });
});
