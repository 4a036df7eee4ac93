import request from 'supertest';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const as = (key: string) => ({ Authorization: `Bearer ${key}` });

/**
 * Resources stored per owner, each created by one user (`tuning` key) and then asked for by another
 * (`otherTuning` key): reading, listing, changing and deleting must all fail as if it did not exist.
 */
const resources: Array<{
  name: string;
  create: () => Promise<string>;
  path: (id: string) => string;
  list: string;
  patch?: object;
}> = [
  {
    name: 'room',
    create: async () =>
      (
        await request(ctx.app)
          .post('/v1/rooms')
          .set(as(ctx.keys.tuning))
          .send(structuredClone({ ...STAGE3_ROOM }))
      ).body.id,
    path: (id) => `/v1/rooms/${id}`,
    list: '/v1/rooms',
    patch: { name: 'Taken over' },
  },
  {
    name: 'target curve',
    create: async () =>
      (
        await request(ctx.app)
          .post('/v1/target-curves')
          .set(as(ctx.keys.tuning))
          .send({
            name: `Curve ${Date.now()}`,
            points: [
              { frequencyHz: 20, gainDb: 0 },
              { frequencyHz: 20000, gainDb: 0 },
            ],
          })
      ).body.id,
    path: (id) => `/v1/target-curves/${id}`,
    list: '/v1/target-curves',
    patch: { name: 'Taken over' },
  },
  {
    name: 'microphone',
    create: async () =>
      (
        await request(ctx.app)
          .post('/v1/microphones')
          .set(as(ctx.keys.tuning))
          .send({ name: 'Private mic', serial: 'P-1', calibrationText: '100 0\n1000 0\n' })
      ).body.id,
    path: (id) => `/v1/microphones/${id}`,
    list: '/v1/microphones',
    patch: { name: 'Taken over' },
  },
];

describe.each(resources)("another owner's $name", ({ create, path, list, patch }) => {
  let id: string;
  beforeAll(async () => {
    id = await create();
    expect(id).toEqual(expect.any(String));
  });

  it('is not read, listed, changed or deleted by another owner', async () => {
    const other = as(ctx.keys.otherTuning);
    expect((await request(ctx.app).get(path(id)).set(other)).status).toBe(404);
    const listed = await request(ctx.app).get(`${list}?limit=100`).set(other);
    expect(listed.status).toBe(200);
    expect(JSON.stringify(listed.body)).not.toContain(id);
    if (patch) expect((await request(ctx.app).patch(path(id)).set(other).send(patch)).status).toBe(404);
    expect((await request(ctx.app).delete(path(id)).set(other)).status).toBe(404);
    // Still there for its owner, unchanged.
    const own = await request(ctx.app).get(path(id)).set(as(ctx.keys.tuning));
    expect(own.status).toBe(200);
    expect(own.body.name).not.toBe('Taken over');
  });
});

describe("another owner's microphone named in an analysis", () => {
  it('is answered as unknown (422 naming microphoneId), the same as an id that does not exist', async () => {
    const mine = await request(ctx.app)
      .post('/v1/microphones')
      .set(as(ctx.keys.tuning))
      .send({ name: 'Mine', calibrationText: '100 0\n1000 0\n' });
    const ask = (id: string) =>
      request(ctx.app)
        .post('/v1/analysis/impulse-response')
        .set(as(ctx.keys.otherTuning))
        .field('microphoneId', id)
        .attach('file', Buffer.from('RIFF'), 'ir.wav');
    const theirs = await ask(mine.body.id);
    const nobodys = await ask('mic_0000000000000000000');
    expect(theirs.status).toBe(422);
    expect(theirs.body.errors).toEqual([{ pointer: '/body/microphoneId', message: expect.any(String) }]);
    expect(theirs.body.errors[0].message.replace(mine.body.id, 'ID')).toBe(
      nobodys.body.errors[0].message.replace('mic_0000000000000000000', 'ID'),
    );
  });
});
