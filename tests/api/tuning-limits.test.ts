import request from 'supertest';
import {
  STAGE3_PROFILE,
  STAGE3_REFERENCE_DB,
  STAGE3_ROOM,
  STAGE3_SPL_DB,
} from '../../seeds/demo-stage3-room';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

/**
 * The room's limits and its processor profile hold on every tuning write (create, edit, restore,
 * duplicate, store from a plan), and a tuning made before the room changed says it is stale.
 * Limits are those of the demo room Stage 3: ±12 dB trim, 75 ms delay, 8 bands, +3 dB boost, 12 dB cut.
 */
let ctx: TestContext;

const dev = () => {
  const key = ctx.keys.tuning;
  return {
    get: (path: string) => request(ctx.app).get(path).set('Authorization', `Bearer ${key}`),
    post: (path: string, body?: object) =>
      request(ctx.app)
        .post(path)
        .set('Authorization', `Bearer ${key}`)
        .send(body ?? {}),
    patch: (path: string, body: object) =>
      request(ctx.app).patch(path).set('Authorization', `Bearer ${key}`).send(body),
    put: (path: string, body: object) =>
      request(ctx.app).put(path).set('Authorization', `Bearer ${key}`).send(body),
  };
};

interface FieldError {
  pointer: string;
  setting: string;
  limit: { name: string; value: unknown; source: string };
}

async function newRoom(extra: object = {}): Promise<string> {
  const res = await dev().post('/v1/rooms', { ...STAGE3_ROOM, ...extra });
  expect(res.status).toBe(201);
  return res.body.id;
}

async function newTuning(roomId: string, channels: object[] = [{ id: 'M+030', delayMs: 1, trimDb: -2 }]) {
  const res = await dev().post(`/v1/rooms/${roomId}/tunings`, { name: 'Within limits', channels });
  expect(res.status).toBe(201);
  return res.body as { id: string; stale: unknown };
}

const versionsOf = async (tuningId: string) =>
  (await dev().get(`/v1/tunings/${tuningId}/versions`)).body.data.length as number;

beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

describe('a tuning outside the room’s limits is refused, never clamped', () => {
  it('create: +15 dB trim, 200 ms delay and +8 dB at 30 Hz on a ±12 dB / 75 ms / +3 dB room → 422 naming each', async () => {
    const roomId = await newRoom();
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'Too much',
      channels: [
        { id: 'M+030', trimDb: -1 },
        { id: 'LFE1', delayMs: 200, trimDb: 15, eq: [{ type: 'peaking', frequencyHz: 30, gainDb: 8, q: 2 }] },
      ],
    });
    expect(res.status).toBe(422);
    expectToMatchContract('createRoomTuning', 422, res.body);
    expect(res.body.type).toBe('https://isochron.dev/problems/limit-exceeded');
    const errors = res.body.errors as FieldError[];
    expect(errors.map((e) => [e.pointer, e.limit.name, e.limit.value, e.limit.source])).toEqual([
      ['/body/channels/1/delayMs', 'delayMaxMs', 75, 'room'],
      ['/body/channels/1/trimDb', 'trimMaxDb', 12, 'room'],
      ['/body/channels/1/eq/0/gainDb', 'eqMaxBoostDb', 3, 'room'],
    ]);
    expect(errors[1].setting).toBe('/channels/1/trimDb');
    expect((await dev().get(`/v1/rooms/${roomId}/tunings`)).body.data).toEqual([]);
  });

  it('create: two +2.5 dB bands at 40 Hz each fit +3 dB but boost 5 dB together → refused on the channel EQ', async () => {
    const roomId = await newRoom();
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'Stacked',
      channels: [
        {
          id: 'LFE1',
          eq: [
            { type: 'peaking', frequencyHz: 40, gainDb: 2.5, q: 2 },
            { type: 'peaking', frequencyHz: 40, gainDb: 2.5, q: 2 },
          ],
        },
      ],
    });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([
      expect.objectContaining({
        pointer: '/body/channels/0/eq',
        limit: { name: 'eqMaxBoostDb', value: 3, source: 'room' },
      }),
    ]);
    // Cookbook peaking gain at f0 is the band's gain, so two bands at one frequency add: 2.5 + 2.5 dB.
    expect(res.body.errors[0].message).toMatch(/together boost 5 dB at 40 Hz/);
  });

  it('a room with a frequency range refuses a band below it and a crossover above it', async () => {
    const roomId = await newRoom({
      limits: { ...STAGE3_ROOM.limits, frequencyMinHz: 20, frequencyMaxHz: 200 },
    });
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'Range',
      channels: [
        {
          id: 'M+030',
          eq: [{ type: 'peaking', frequencyHz: 15, gainDb: -3, q: 2 }],
          highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 250 },
        },
      ],
    });
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: FieldError) => [e.pointer, e.limit.name])).toEqual([
      ['/body/channels/0/eq/0/frequencyHz', 'frequencyMinHz'],
      ['/body/channels/0/highPass/frequencyHz', 'frequencyMaxHz'],
    ]);
  });

  it('edit: a trim beyond the limit names the PATCH entry and makes no version; inside it is stored as given', async () => {
    const roomId = await newRoom();
    const tuning = await newTuning(roomId, [{ id: 'M+030' }, { id: 'M-030' }]);
    const refused = await dev().patch(`/v1/tunings/${tuning.id}`, {
      channels: [{ id: 'M-030', trimDb: -12.01 }],
    });
    expect(refused.status).toBe(422);
    expectToMatchContract('updateTuning', 422, refused.body);
    expect(refused.body.errors).toEqual([
      expect.objectContaining({ pointer: '/body/channels/0/trimDb', setting: '/channels/1/trimDb' }),
    ]);
    expect(await versionsOf(tuning.id)).toBe(1);
    const stored = await dev().patch(`/v1/tunings/${tuning.id}`, {
      channels: [{ id: 'M-030', trimDb: -12 }],
    });
    expect(stored.status).toBe(200);
    expect(stored.body.channels[1].trimDb).toBe(-12);
  });

  it('restore and duplicate of a version the room’s narrower limits no longer allow → 422', async () => {
    const roomId = await newRoom();
    const tuning = await newTuning(roomId, [{ id: 'M+030', trimDb: 10 }]);
    await dev().patch(`/v1/tunings/${tuning.id}`, { channels: [{ id: 'M+030', trimDb: 4 }] });
    const narrowed = await dev().patch(`/v1/rooms/${roomId}`, {
      limits: { ...STAGE3_ROOM.limits, trimMaxDb: 6 },
    });
    expect(narrowed.status).toBe(200);

    const restore = await dev().post(`/v1/tunings/${tuning.id}/versions/1/restore`);
    expect(restore.status).toBe(422);
    expect(restore.body.errors).toEqual([
      expect.objectContaining({
        pointer: '/path/version',
        setting: '/channels/0/trimDb',
        limit: { name: 'trimMaxDb', value: 6, source: 'room' },
      }),
    ]);
    expect(await versionsOf(tuning.id)).toBe(2);

    const copyOld = await dev().post(`/v1/tunings/${tuning.id}/duplicate`, { version: 1 });
    expect(copyOld.status).toBe(422);
    expect(copyOld.body.errors[0].pointer).toBe('/body/version');
    const copyNew = await dev().post(`/v1/tunings/${tuning.id}/duplicate`, {});
    expect(copyNew.status).toBe(201);
  });

  it('a tuning from a plan of the room stays within its limits and is stored', async () => {
    const roomId = await newRoom();
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'Planned',
      plan: {
        targets: { referenceDb: STAGE3_REFERENCE_DB, crossoverHz: 80 },
        channels: STAGE3_ROOM.loudspeakers.map(({ id }) => ({ id, measuredDb: STAGE3_SPL_DB[id] })),
      },
    });
    expect(res.status).toBe(201);
  });
});

describe('the processor profile’s limits hold when the room has one', () => {
  let profileId: string;
  let roomId: string;

  beforeAll(async () => {
    const profile = await dev().post('/v1/processor-profiles', STAGE3_PROFILE);
    expect(profile.status).toBe(201);
    expectToMatchContract('createProcessorProfile', 201, profile.body);
    profileId = profile.body.id;
    roomId = await newRoom({ profileId });
  });

  it('a notch (not one of its filter types), a +7 dB trim beyond 75 ms... each named with the profile limit', async () => {
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'Profile',
      channels: [
        {
          id: 'M+030',
          delayMs: 75.5,
          eq: [
            { type: 'notch', frequencyHz: 100, q: 5 },
            { type: 'peaking', frequencyHz: 1000, gainDb: -2, q: 12 },
          ],
        },
      ],
    });
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: FieldError) => [e.pointer, e.limit.name, e.limit.source])).toEqual([
      ['/body/channels/0/delayMs', 'delayMaxMs', 'room'],
      ['/body/channels/0/delayMs', 'delay.max', 'profile'],
      ['/body/channels/0/eq/0/type', 'eq.filterTypes', 'profile'],
      ['/body/channels/0/eq/1/q', 'eq.q.max', 'profile'],
    ]);
  });

  it('values inside the ranges but off the steps are stored as given and listed with what the export gives', async () => {
    // The demo profile's steps: 0.01 ms delay, 0.1 dB trim and gain, 1 Hz, Q 0.01 (seeds/demo-stage3-room.ts).
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'Off the steps',
      channels: [
        {
          id: 'M+030',
          delayMs: 1.5636,
          trimDb: -1.63,
          eq: [{ type: 'peaking', frequencyHz: 209.7, gainDb: -3.54, q: 2.304 }],
        },
      ],
    });
    expect(res.status).toBe(201);
    expectToMatchContract('createRoomTuning', 201, res.body);
    expect(res.body.channels[0]).toMatchObject({ delayMs: 1.5636, trimDb: -1.63 });
    const steps = res.body.profileSteps.map((r: { setting: string; unit: string; rounded: number }) => [
      r.setting,
      r.unit,
      r.rounded,
    ]);
    // 1.5636 → 1.56 ms, which is 74.88 samples at 48 kHz (a whole-sample processor gives 75); −1.63 → −1.6 dB;
    // 209.7 → 210 Hz; −3.54 → −3.5 dB; Q 2.304 → 2.3.
    expect(steps).toEqual([
      ['/channels/0/delayMs', 'ms', 1.56],
      ['/channels/0/delayMs', 'samples', 75],
      ['/channels/0/trimDb', 'dB', -1.6],
      ['/channels/0/eq/0/frequencyHz', 'Hz', 210],
      ['/channels/0/eq/0/gainDb', 'dB', -3.5],
      ['/channels/0/eq/0/q', '', 2.3],
    ]);
    const exported = await dev().get(`/v1/tunings/${res.body.id}/export`);
    expect(exported.status).toBe(200);
    const caution = exported.body.header.cautions.find((c: { code: string }) => c.code === 'profileSteps');
    expect(caution.message).toMatch(/^6 settings are not on the processor's steps/);
    expect(exported.body.channels[0]).toMatchObject({ delayMs: 1.56, trimDb: -1.6 });
  });

  it('a sample rate the profile does not run at is refused', async () => {
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'At 44.1 kHz',
      sampleRateHz: 44100,
      channels: [{ id: 'M+030' }],
    });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([
      expect.objectContaining({
        pointer: '/body/sampleRateHz',
        limit: { name: 'sampleRatesHz', value: [48000, 96000], source: 'profile' },
      }),
    ]);
  });

  it('a room may not use another owner’s profile; a profile in use cannot be deleted', async () => {
    const other = await request(ctx.app)
      .post('/v1/rooms')
      .set('Authorization', `Bearer ${ctx.keys.otherTuning}`)
      .send({ ...STAGE3_ROOM, profileId });
    expect(other.status).toBe(422);
    expect(other.body.errors[0].pointer).toBe('/body/profileId');
    const del = await request(ctx.app)
      .delete(`/v1/processor-profiles/${profileId}`)
      .set('Authorization', `Bearer ${ctx.keys.tuning}`);
    expect(del.status).toBe(409);
  });

  it('a profile whose range is upside down is refused naming the field', async () => {
    const res = await dev().post('/v1/processor-profiles', {
      ...STAGE3_PROFILE,
      eq: { ...STAGE3_PROFILE.eq, gainDb: { min: -1, max: 0, step: 0.1 }, q: { min: 5, max: 1, step: 0 } },
    });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe('/body/eq/q/min');
  });
});

describe('a tuning made before the room changed is stale', () => {
  const staleAfter = async (change: (roomId: string) => Promise<void>) => {
    const roomId = await newRoom();
    const tuning = await newTuning(roomId);
    expect(tuning.stale).toBeNull();
    const before = Date.now();
    await change(roomId);
    const res = await dev().get(`/v1/tunings/${tuning.id}`);
    expect(res.status).toBe(200);
    expectToMatchContract('getTuning', 200, res.body);
    if (res.body.stale) {
      expect(Date.parse(res.body.stale.since)).toBeGreaterThanOrEqual(before - 1000);
    }
    return {
      stale: res.body.stale as { since: string; reasons: string[] } | null,
      roomId,
      tuningId: tuning.id,
    };
  };
  const patchRoom = (body: object) => async (roomId: string) => {
    const res = await dev().patch(`/v1/rooms/${roomId}`, body);
    expect(res.status).toBe(200);
  };

  it('listener moved 0.80 m', async () => {
    const { stale } = await staleAfter(patchRoom({ listener: { x: 3.05, y: 4.1, z: 1.2 } }));
    expect(stale?.reasons).toEqual(['listener moved 0.80 m']);
  });

  it('a loudspeaker moved (3-4-5 triangle: 0.30 m and 0.40 m is 0.50 m)', async () => {
    const loudspeakers = STAGE3_ROOM.loudspeakers.map((s) =>
      s.id === 'U-135' ? { ...s, x: s.x - 0.3, y: s.y + 0.4 } : s,
    );
    const { stale } = await staleAfter(patchRoom({ loudspeakers }));
    expect(stale?.reasons).toEqual(['U-135 moved 0.50 m']);
  });

  it('a loudspeaker removed', async () => {
    const loudspeakers = STAGE3_ROOM.loudspeakers.filter((s) => s.id !== 'U-135');
    const { stale } = await staleAfter(patchRoom({ loudspeakers }));
    expect(stale?.reasons).toEqual(['loudspeaker U-135 removed']);
  });

  it('limits changed', async () => {
    const { stale } = await staleAfter(patchRoom({ limits: { ...STAGE3_ROOM.limits, trimMaxDb: 6 } }));
    expect(stale?.reasons).toEqual(['limits changed: trimMaxDb 12 → 6']);
  });

  it('sample rate changed', async () => {
    const { stale } = await staleAfter(patchRoom({ sampleRateHz: 96000 }));
    expect(stale?.reasons).toEqual(['sample rate changed from 48000 Hz to 96000 Hz']);
  });

  it('processor profile chosen, then edited', async () => {
    const profile = await dev().post('/v1/processor-profiles', { ...STAGE3_PROFILE, name: 'Chosen later' });
    const { stale, roomId } = await staleAfter(patchRoom({ profileId: profile.body.id }));
    expect(stale?.reasons).toEqual(['processor profile changed from none to "Chosen later"']);

    const fresh = await newTuning(roomId);
    expect(fresh.stale).toBeNull();
    const edited = await dev().put(`/v1/processor-profiles/${profile.body.id}`, {
      ...STAGE3_PROFILE,
      name: 'Chosen later',
      trimDb: { min: -10, max: 10, step: 0.5 },
    });
    expect(edited.status).toBe(200);
    const after = await dev().get(`/v1/tunings/${fresh.id}`);
    expect(after.body.stale.reasons).toEqual(['processor profile "Chosen later" was edited']);
  });

  it('a name, notes or dimensions change does not make it stale; an edit keeps it stale; moving back clears it', async () => {
    const { stale, roomId, tuningId } = await staleAfter(
      patchRoom({
        name: 'Stage 3b',
        notes: 'renamed',
        dimensions: { widthM: 6.2, lengthM: 7.4, heightM: 3.05 },
      }),
    );
    expect(stale).toBeNull();

    await patchRoom({ listener: { x: 3.05, y: 4.1, z: 1.2 } })(roomId);
    const edited = await dev().patch(`/v1/tunings/${tuningId}`, { notes: 'trim checked' });
    expect(edited.body.stale.reasons).toEqual(['listener moved 0.80 m']);
    await patchRoom({ listener: STAGE3_ROOM.listener })(roomId);
    expect((await dev().get(`/v1/tunings/${tuningId}`)).body.stale).toBeNull();
  });

  it('a stale tuning’s export and report say so first', async () => {
    const { roomId, tuningId } = await staleAfter(patchRoom({ listener: { x: 3.05, y: 4.1, z: 1.2 } }));
    const json = await dev().get(`/v1/tunings/${tuningId}/export`);
    expect(json.status).toBe(200);
    expectToMatchContract('exportTuning', 200, json.body);
    expect(Object.keys(json.body)[0]).toBe('stale');
    expect(json.body.stale.reasons).toEqual(['listener moved 0.80 m']);
    const csv = await dev().get(`/v1/tunings/${tuningId}/export?format=csv`);
    expect(csv.text.split('\r\n')[1]).toMatch(/^stale,since \S+: listener moved 0\.80 m$/);
    const report = await dev().get(`/v1/rooms/${roomId}/report?tuningId=${tuningId}`);
    const body = report.text.slice(report.text.indexOf('<body>'));
    expect(body.indexOf('These settings are stale')).toBeGreaterThan(0);
    expect(body.indexOf('These settings are stale')).toBeLessThan(body.indexOf('<header>'));
    expect(body).toContain('listener moved 0.80 m');
  });
});

describe('the export is refused when the chosen profile cannot take the tuning', () => {
  it('a rate the profile does not run at names /query/sampleRateHz; a delay beyond it names /query/profile', async () => {
    const roomId = await newRoom();
    const tuning = await newTuning(roomId, [{ id: 'M+030', delayMs: 40 }]);
    const short = await dev().post('/v1/processor-profiles', {
      ...STAGE3_PROFILE,
      name: 'Short delay',
      delay: { unit: 'samples', min: 0, max: 960, step: 1 },
    });
    const atRate = await dev().get(
      `/v1/tunings/${tuning.id}/export?profile=${short.body.id}&sampleRateHz=44100`,
    );
    expect(atRate.status).toBe(422);
    expectToMatchContract('exportTuning', 422, atRate.body);
    // 40 ms at 44.1 kHz is 1764 samples, beyond 960; the rate is not the profile's either.
    expect(atRate.body.errors.map((e: FieldError) => [e.pointer, e.limit.name])).toEqual([
      ['/query/sampleRateHz', 'sampleRatesHz'],
      ['/query/profile', 'delay.max'],
    ]);
    const ok = await dev().get(`/v1/tunings/${tuning.id}/export?profile=none`);
    expect(ok.status).toBe(200);
    expect(ok.body.channels[0]).toMatchObject({ delaySamples: 1920, delayMs: 40 });
    const foreign = await request(ctx.app)
      .get(`/v1/tunings/${tuning.id}/export?profile=prof_0doesnotexist`)
      .set('Authorization', `Bearer ${ctx.keys.tuning}`);
    expect(foreign.status).toBe(404);
  });
});
