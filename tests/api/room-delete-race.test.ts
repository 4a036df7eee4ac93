import request from 'supertest';
import type { Transaction } from 'sequelize';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const as = (req: request.Test) => req.set('Authorization', `Bearer ${ctx.keys.tuning}`);

/** A fresh Stage 3 room with one tuning (two versions). */
async function roomWithTuning(): Promise<{ roomId: string; tuningId: string }> {
  const room = await as(request(ctx.app).post('/v1/rooms')).send(structuredClone({ ...STAGE3_ROOM }));
  expect(room.status).toBe(201);
  const tuning = await as(request(ctx.app).post(`/v1/rooms/${room.body.id}/tunings`)).send({
    name: 'Flat',
    channels: [{ id: 'M+030', delayMs: 0.5, trimDb: -1 }],
  });
  expect(tuning.status).toBe(201);
  const edit = await as(request(ctx.app).patch(`/v1/tunings/${tuning.body.id}`)).send({ notes: 'second' });
  expect(edit.status).toBe(200);
  return { roomId: room.body.id, tuningId: tuning.body.id };
}

/**
 * What `DELETE /v1/rooms/{id}` does, inside a transaction the test controls: lock the room (PostgreSQL;
 * SQLite's one writer needs no lock), then remove it and what hangs on it. `locked` is called once the
 * room is locked.
 */
async function deleteRoomRows(roomId: string, transaction: Transaction, locked: () => void): Promise<void> {
  const { Room, RoomState, Tuning, TuningVersion, Measurement } = ctx.db.models;
  await Room.findByPk(roomId, { transaction, lock: transaction.LOCK.UPDATE });
  locked();
  const tunings = await Tuning.findAll({ where: { roomId }, transaction });
  await TuningVersion.destroy({ where: { tuningId: tunings.map((t) => t.id) }, transaction });
  await Tuning.destroy({ where: { roomId }, transaction });
  await Measurement.destroy({ where: { roomId }, transaction });
  await RoomState.destroy({ where: { roomId }, transaction });
  await Room.destroy({ where: { id: roomId }, transaction });
}

/**
 * Sends a request that finds its room, then deletes the room in the write that runs just before the
 * request's own write: the order in which a racing DELETE wins.
 */
async function whileRoomIsDeleted(roomId: string, send: () => request.Test): Promise<request.Response> {
  const realWrite = ctx.db.write;
  let queued!: () => void;
  const requestReachedWrite = new Promise<void>((resolve) => (queued = resolve));
  let locked!: () => void;
  const deletionHoldsRoom = new Promise<void>((resolve) => (locked = resolve));
  // SQLite queues the request's write behind the deletion; PostgreSQL runs writes side by side, so the
  // request's write starts once the deletion holds the room's lock, and then waits for it.
  const spy = jest.spyOn(ctx.db, 'write').mockImplementation(async (work) => {
    queued();
    if (ctx.db.dialect === 'postgres') await deletionHoldsRoom;
    return realWrite(work);
  });
  try {
    const deletion = realWrite(async (transaction) => {
      await requestReachedWrite;
      await deleteRoomRows(roomId, transaction, locked);
    });
    const res = await send();
    await deletion;
    return res;
  } finally {
    spy.mockRestore();
  }
}

const OPERATIONS: Array<[string, (ids: { roomId: string; tuningId: string }) => request.Test]> = [
  [
    'a JSON measurement',
    ({ roomId }) =>
      as(request(ctx.app).post(`/v1/rooms/${roomId}/measurements`)).send({
        kind: 'spl',
        channel: 'M+000',
        splDb: 84.6,
      }),
  ],
  [
    'an uploaded measurement',
    ({ roomId }) =>
      as(request(ctx.app).post(`/v1/rooms/${roomId}/measurements`))
        .field('channel', 'M+030')
        .attach('file', Buffer.from('20 74.5\n40 76\n80 73.25\n'), 'left.txt'),
  ],
  [
    'a tuning from settings',
    ({ roomId }) =>
      as(request(ctx.app).post(`/v1/rooms/${roomId}/tunings`)).send({
        name: 'Try',
        channels: [{ id: 'M+030' }],
      }),
  ],
  [
    'a tuning from a plan',
    ({ roomId }) =>
      as(request(ctx.app).post(`/v1/rooms/${roomId}/tunings`)).send({ name: 'Planned', plan: {} }),
  ],
  ['a duplicate', ({ tuningId }) => as(request(ctx.app).post(`/v1/tunings/${tuningId}/duplicate`)).send({})],
  [
    'a tuning edit',
    ({ tuningId }) => as(request(ctx.app).patch(`/v1/tunings/${tuningId}`)).send({ notes: 'x' }),
  ],
  [
    'a version restore',
    ({ tuningId }) => as(request(ctx.app).post(`/v1/tunings/${tuningId}/versions/1/restore`)),
  ],
  ['a room edit', ({ roomId }) => as(request(ctx.app).patch(`/v1/rooms/${roomId}`)).send({ notes: 'moved' })],
];

describe.each(OPERATIONS)('%s written while its room is being deleted', (_name, send) => {
  it('answers 404 and leaves nothing behind', async () => {
    const ids = await roomWithTuning();
    const res = await whileRoomIsDeleted(ids.roomId, () => send(ids));
    expect([res.status, res.body.type]).toEqual([404, 'https://isochron.dev/problems/not-found']);
    const { Room, RoomState, Tuning, TuningVersion, Measurement } = ctx.db.models;
    expect(await Room.count({ where: { id: ids.roomId } })).toBe(0);
    expect(await Tuning.count({ where: { roomId: ids.roomId } })).toBe(0);
    expect(await TuningVersion.count({ where: { tuningId: ids.tuningId } })).toBe(0);
    expect(await Measurement.count({ where: { roomId: ids.roomId } })).toBe(0);
    expect(await RoomState.count({ where: { roomId: ids.roomId } })).toBe(0);
  });
});

it('racing creates against a DELETE of their room answer 201 or 404, never 5xx, and leave no orphans', async () => {
  const statuses: number[] = [];
  for (let round = 0; round < 6; round += 1) {
    const ids = await roomWithTuning();
    const creates = Array.from({ length: 8 }, (_, i) => OPERATIONS[i % 5][1](ids));
    const all = await Promise.all([
      ...creates.slice(0, 4),
      as(request(ctx.app).delete(`/v1/rooms/${ids.roomId}`)),
      ...creates.slice(4),
    ]);
    statuses.push(...all.map((r) => r.status));
  }
  expect(statuses.filter((s) => s >= 500)).toEqual([]);
  expect(statuses.every((s) => [200, 201, 204, 404].includes(s))).toBe(true);
  const orphans = await ctx.db.sequelize.query(
    `SELECT (SELECT COUNT(*) FROM measurements WHERE "roomId" NOT IN (SELECT id FROM rooms))
          + (SELECT COUNT(*) FROM tunings WHERE "roomId" NOT IN (SELECT id FROM rooms)) AS n`,
    { plain: true },
  );
  expect(Number((orphans as { n: number }).n)).toBe(0);
});
