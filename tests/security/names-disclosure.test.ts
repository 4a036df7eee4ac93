import request from 'supertest';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
let roomId: string;
let tuningId: string;
beforeAll(async () => {
  ctx = await createTestContext();
  await ctx.db.write((transaction) =>
    ctx.db.models.User.update({ name: 'Head of audio' }, { where: { id: ctx.users.admin }, transaction }),
  );
  const room = await request(ctx.app)
    .post('/v1/rooms')
    .set('Authorization', `Bearer ${ctx.keys.tuning}`)
    .send(structuredClone(STAGE3_ROOM));
  roomId = room.body.id;
  const tuning = await request(ctx.app)
    .post(`/v1/rooms/${roomId}/tunings`)
    .set('Authorization', `Bearer ${ctx.keys.tuning}`)
    .send({ name: 'Flat', channels: [{ id: 'M+030', trimDb: -1 }] });
  tuningId = tuning.body.id;
  // An admin edits the developer's tuning (version 2) and restores version 1 (version 3).
  await request(ctx.app)
    .patch(`/v1/tunings/${tuningId}`)
    .set('Authorization', `Bearer ${ctx.keys.admin}`)
    .send({ notes: 'checked by the head of audio' })
    .expect(200);
  await request(ctx.app)
    .post(`/v1/tunings/${tuningId}/versions/1/restore`)
    .set('Authorization', `Bearer ${ctx.keys.admin}`)
    .expect(200);
});
afterAll(async () => {
  await ctx.close();
});

const get = (key: string, path: string) => request(ctx.app).get(path).set('Authorization', `Bearer ${key}`);
const adminKeyId = async () =>
  (await ctx.db.models.ApiKey.findOne({ where: { ownerId: ctx.users.admin } }))!.id;

describe('tuning versions made by someone else', () => {
  it('show the owner neither the user nor the key that made them; the author and admins see both', async () => {
    const mine = await get(ctx.keys.tuning, `/v1/tunings/${tuningId}/versions`);
    expect(mine.status).toBe(200);
    expectToMatchContract('listTuningVersions', 200, mine.body);
    const authors = mine.body.data.map((v: { createdBy: object }) => v.createdBy);
    expect(authors[0]).toMatchObject({ userId: ctx.users.developer });
    expect(authors[0].keyId).toMatch(/^key_/);
    expect(authors.slice(1)).toEqual([
      { userId: null, keyId: null },
      { userId: null, keyId: null },
    ]);
    const one = await get(ctx.keys.tuning, `/v1/tunings/${tuningId}/versions/2`);
    expect(one.body.createdBy).toEqual({ userId: null, keyId: null });
    expect(JSON.stringify(mine.body) + JSON.stringify(one.body)).not.toContain(await adminKeyId());

    const admins = await get(ctx.keys.admin, `/v1/tunings/${tuningId}/versions`);
    expect(admins.body.data[1].createdBy).toEqual({ userId: ctx.users.admin, keyId: await adminKeyId() });
    expect(admins.body.data[0].createdBy.userId).toBe(ctx.users.developer);
  });
});

describe("the room report's 'Tuned by'", () => {
  it("names an admin author only to admins; the owner's report says another user tuned it", async () => {
    const owners = await get(ctx.keys.tuning, `/v1/rooms/${roomId}/report?tuningId=${tuningId}`);
    expect(owners.status).toBe(200);
    expect(owners.text).toContain('Tuned by another Isochron user');
    expect(owners.text).not.toContain('Head of audio');
    expect(owners.text).not.toContain('admin@test.example');

    const admins = await get(ctx.keys.admin, `/v1/rooms/${roomId}/report?tuningId=${tuningId}`);
    expect(admins.text).toContain('Tuned by Head of audio');

    // The owner's own version carries the owner's address (the developer has no name).
    const first = await get(ctx.keys.tuning, `/v1/rooms/${roomId}/report?tuningId=${tuningId}&version=1`);
    expect(first.text).toContain('Tuned by dev@test.example');
  });
});
