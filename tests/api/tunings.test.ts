import request from 'supertest';
import { STAGE3_REFERENCE_DB, STAGE3_ROOM, STAGE3_SPL_DB } from '../../seeds/demo-stage3-room';
import { designBiquad } from '../../shared/filters/biquad-design';
import { cascadeResponse } from '../../shared/dsp/response';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectAnswered } from '../support/presentation';

let ctx: TestContext;
let roomId: string;
let managedId: string;
let fullRangeId: string;

const as = (key: string) => ({
  get: (path: string) => request(ctx.app).get(path).set('Authorization', `Bearer ${key}`),
  post: (path: string, body?: unknown) => {
    const call = request(ctx.app).post(path).set('Authorization', `Bearer ${key}`);
    return body === undefined ? call : call.send(body as object);
  },
  patch: (path: string, body: unknown) =>
    request(ctx.app)
      .patch(path)
      .set('Authorization', `Bearer ${key}`)
      .send(body as object),
  delete: (path: string) => request(ctx.app).delete(path).set('Authorization', `Bearer ${key}`),
});
const dev = () => as(ctx.keys.tuning);

const planBody = () => ({
  name: 'Bass-managed 80 Hz',
  plan: {
    temperatureC: 21,
    targets: { referenceDb: STAGE3_REFERENCE_DB, crossoverHz: 80 },
    channels: STAGE3_ROOM.loudspeakers.map(({ id }) => ({
      id,
      measuredDb: STAGE3_SPL_DB[id],
      ...(id.startsWith('LFE') ? {} : { bassManaged: true }),
    })),
  },
});

beforeAll(async () => {
  ctx = await createTestContext();
  const room = await dev().post('/v1/rooms', STAGE3_ROOM);
  roomId = room.body.id;
});
afterAll(async () => {
  await ctx.close();
});

describe('creating tunings', () => {
  it('from a plan of the stored room: 201, version 1, positions taken from the room', async () => {
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, planBody());
    expect(res.status).toBe(201);
    expectToMatchContract('createRoomTuning', 201, res.body);
    managedId = res.body.id;
    expect(res.headers.location).toBe(`/v1/tunings/${managedId}`);
    expect(res.body).toMatchObject({ version: 1, latestVersion: 1, origin: 'plan', roomId });
    const left = res.body.channels.find((c: { id: string }) => c.id === 'M+030');
    // Hand computation (demo coordinates, c at 21 °C per ISO 9613-1 form, as in the pyfar library): (3.65582 − 3.11827) m / 343.785 m/s.
    const c = 343.2 * Math.sqrt(294.15 / 293.15);
    expectAnswered(
      left.delayMs,
      ((Math.sqrt(2.15 ** 2 + 2.8 ** 2 + 0.95 ** 2) - Math.sqrt(1.56 ** 2 + 2.7 ** 2)) / c) * 1000,
      'ms',
    );
    expect(left.trimDb).toBeCloseTo(79 - 80.6, 9);
    expect(left.highPass).toEqual({ family: 'linkwitzRiley', order: 4, frequencyHz: 80 });
    expect(res.body.subwoofer).toMatchObject({
      channel: 'LFE1',
      lfeGainDb: 10,
      lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
    });
    expect(res.body.cautions.map((x: { code: string }) => x.code)).toContain('overheadMounting');
  });

  it('from settings: defaults filled in, the subwoofer must name a channel', async () => {
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'Two channels',
      channels: [{ id: 'M+030', delayMs: 1, trimDb: -2 }, { id: 'LFE1' }],
    });
    expect(res.status).toBe(201);
    expect(res.body.channels[0]).toEqual({
      id: 'M+030',
      delayMs: 1,
      trimDb: -2,
      polarity: 'normal',
      eq: [],
      highPass: null,
      bassManaged: false,
    });
    const bad = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'Bad sub',
      channels: [{ id: 'M+030' }],
      subwoofer: { channel: 'LFE1', lowPass: null, lfeGainDb: 10 },
    });
    expect(bad.status).toBe(422);
    expect(bad.body.errors[0].pointer).toBe('/body/subwoofer/channel');
  });

  it('bad input is named: duplicate ids, both forms at once, a filter above Nyquist, an unknown room', async () => {
    const dup = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'x',
      channels: [{ id: 'M+030' }, { id: 'M+030' }],
    });
    expect(dup.status).toBe(422);
    expect(dup.body.errors[0].pointer).toBe('/body/channels/1/id');
    const both = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'x',
      channels: [{ id: 'M+030' }],
      plan: {},
    });
    expect(both.status).toBe(400);
    const nyquist = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'x',
      sampleRateHz: 44100,
      channels: [{ id: 'M+030', eq: [{ type: 'peaking', frequencyHz: 23000, gainDb: -3, q: 1 }] }],
    });
    expect(nyquist.status).toBe(422);
    expect(nyquist.body.errors[0].pointer).toBe('/body/channels/0/eq/0/frequencyHz');
    const planOutside = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'x',
      plan: { channels: [{ id: 'M+030', position: { x: 9, y: 1, z: 1 } }] },
    });
    expect(planOutside.status).toBe(422);
    expect(planOutside.body.errors[0].pointer).toBe('/body/plan/channels/0/position/x');
    expect((await dev().post('/v1/rooms/room_nope/tunings', planBody())).status).toBe(404);
  });
});

describe('versions, duplicate and compare', () => {
  it('duplicate → 201, then PATCH to full range creates version 2 of the copy', async () => {
    const copy = await dev().post(`/v1/tunings/${managedId}/duplicate`, { name: 'Full range' });
    expect(copy.status).toBe(201);
    expectToMatchContract('duplicateTuning', 201, copy.body);
    fullRangeId = copy.body.id;
    expect(copy.body).toMatchObject({
      version: 1,
      origin: 'duplicate',
      duplicatedFromId: managedId,
      name: 'Full range',
    });
    const channels = copy.body.channels.map((c: { id: string }) => ({
      id: c.id,
      highPass: null,
      bassManaged: false,
    }));
    const edited = await dev().patch(`/v1/tunings/${fullRangeId}`, {
      channels,
      subwoofer: { channel: 'LFE1', lowPass: null, lfeGainDb: 10 },
      notes: 'No bass management',
    });
    expect(edited.status).toBe(200);
    expectToMatchContract('updateTuning', 200, edited.body);
    expect(edited.body).toMatchObject({
      version: 2,
      latestVersion: 2,
      origin: 'edit',
      notes: 'No bass management',
    });
    expect(edited.body.channels.every((c: { highPass: unknown }) => c.highPass === null)).toBe(true);
    // Merge by id: the trims of version 1 are kept.
    expect(edited.body.channels.find((c: { id: string }) => c.id === 'M+135').trimDb).toBeCloseTo(
      79 - 83.1,
      9,
    );
  });

  it('every version stays readable; restoring version 1 makes version 3 equal to it', async () => {
    const list = await dev().get(`/v1/tunings/${fullRangeId}/versions`);
    expect(list.status).toBe(200);
    expectToMatchContract('listTuningVersions', 200, list.body);
    expect(list.body.data.map((v: { version: number }) => v.version)).toEqual([1, 2]);
    const v1 = await dev().get(`/v1/tunings/${fullRangeId}/versions/1`);
    expectToMatchContract('getTuningVersion', 200, v1.body);
    expect(v1.body.channels.find((c: { id: string }) => c.id === 'M+030').highPass).not.toBeNull();
    const restored = await dev().post(`/v1/tunings/${fullRangeId}/versions/1/restore`);
    expect(restored.status).toBe(200);
    expect(restored.body).toMatchObject({ version: 3, origin: 'restore' });
    expect(restored.body.channels).toEqual(v1.body.channels);
    const v3 = await dev().get(`/v1/tunings/${fullRangeId}/versions/3`);
    expect(v3.body.restoredFromVersion).toBe(1);
    const asOfV2 = await dev().get(`/v1/tunings/${fullRangeId}?version=2`);
    expect(asOfV2.body.version).toBe(2);
    expect(asOfV2.body.latestVersion).toBe(3);
    const page = await dev().get(`/v1/tunings/${fullRangeId}/versions?limit=2&startingAfter=1`);
    expect(page.body.data.map((v: { version: number }) => v.version)).toEqual([2, 3]);
    expect((await dev().get(`/v1/tunings/${fullRangeId}/versions/9`)).status).toBe(404);
  });

  it('a PATCH with a bad filter names the body entry and creates no version', async () => {
    const res = await dev().patch(`/v1/tunings/${fullRangeId}`, {
      channels: [{ id: 'M+000', eq: [{ type: 'peaking', frequencyHz: 100, q: 2 }] }],
    });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe('/body/channels/0/eq/0/gainDb');
    expect((await dev().get(`/v1/tunings/${fullRangeId}`)).body.latestVersion).toBe(3);
  });

  // Linkwitz-Riley LR4 high-pass = Butterworth-2 squared (S. H. Linkwitz, JAES 24(1), 1976; scipy.signal butter); analogue magnitude of BW2 at
  // f/fc = 1/4 is (1/4)^4/(1 + (1/4)^4) → 10·log10(1/257) = −24.10 dB, so LR4 is −48.20 dB at 20 Hz.
  it('compare: bass-managed against full range differs at 20 Hz by the LR4 attenuation', async () => {
    await dev().patch(`/v1/tunings/${fullRangeId}`, {
      channels: [{ id: 'M+030', highPass: null, bassManaged: false }],
    });
    const res = await dev().get(`/v1/tunings/compare?left=${managedId}&right=${fullRangeId}`);
    expect(res.status).toBe(200);
    expectToMatchContract('compareTunings', 200, res.body);
    expect(res.body.identical).toBe(false);
    const left = res.body.channels.find((c: { id: string }) => c.id === 'M+030');
    expect(left).toMatchObject({
      presentIn: 'both',
      highPassChanged: true,
      bassManagedChanged: true,
      delayMsDifference: 0,
      trimDbDifference: 0,
    });
    expect(left.maxResponseDifferenceDb).toBeCloseTo(20 * Math.log10(257), 1);
    const same = await dev().get(`/v1/tunings/compare?left=${managedId}&right=${fullRangeId}&rightVersion=1`);
    expect(same.body.identical).toBe(true);
    expect(
      same.body.channels.every((c: { maxResponseDifferenceDb: number }) => c.maxResponseDifferenceDb === 0),
    ).toBe(true);
  });
});

describe('concurrent edits', () => {
  // On SQLite the write queue runs them one by one; on PostgreSQL they run side by side and the row
  // lock orders them. Either way: versions n+1 … n+40, each once.
  it('40 edits of one tuning at once get 40 distinct consecutive versions', async () => {
    const created = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'Edited at once',
      sampleRateHz: 48000,
      channels: [{ id: 'M+030', delayMs: 1, trimDb: -1 }],
    });
    expect(created.status).toBe(201);
    const id = created.body.id as string;
    const edits = await Promise.all(
      Array.from({ length: 40 }, (_, i) => dev().patch(`/v1/tunings/${id}`, { notes: `edit ${i}` })),
    );
    expect(edits.map((e) => e.status)).toEqual(Array.from({ length: 40 }, () => 200));
    const versions = edits.map((e) => e.body.version as number).sort((a, b) => a - b);
    expect(versions).toEqual(Array.from({ length: 40 }, (_, i) => i + 2));
    // Each edit's note is in exactly the version that edit answered with.
    const stored = await ctx.db.models.TuningVersion.findAll({
      where: { tuningId: id },
      order: [['version', 'ASC']],
    });
    expect(stored.map((v) => v.version)).toEqual(Array.from({ length: 41 }, (_, i) => i + 1));
    for (const edit of edits) {
      expect(stored.find((v) => v.version === edit.body.version)?.notes).toBe(edit.body.notes);
    }
    expect((await dev().get(`/v1/tunings/${id}`)).body.latestVersion).toBe(41);
  });
});

describe('export', () => {
  let eqTuningId: string;
  const filters = [
    { type: 'peaking', frequencyHz: 47.5, gainDb: -6.5, q: 4.2 },
    { type: 'highShelf', frequencyHz: 8000, gainDb: -1.5 },
  ];

  beforeAll(async () => {
    const res = await dev().post(`/v1/rooms/${roomId}/tunings`, {
      name: 'EQ export check',
      channels: [
        {
          id: 'M+030',
          delayMs: 1.5636,
          trimDb: -1.6,
          eq: filters,
          highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
        },
        { id: 'LFE1', delayMs: 0, trimDb: -1.2 },
      ],
      subwoofer: {
        channel: 'LFE1',
        lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
        lfeGainDb: 10,
      },
    });
    eqTuningId = res.body.id;
  });

  // Without a processor profile the export re-designs from the stored parameters at each rate in the
  // API's own convention; the coefficients must equal what the calculation endpoints (POST /v1/biquads,
  // POST /v1/crossovers) and designBiquad give at that rate.
  it.each([44100, 48000, 96000])(
    'JSON at %i Hz (no profile) equals POST /v1/biquads, POST /v1/crossovers and designBiquad',
    async (rate) => {
      const res = await dev().get(`/v1/tunings/${eqTuningId}/export?format=json&sampleRateHz=${rate}`);
      expect(res.status).toBe(200);
      expectToMatchContract('exportTuning', 200, res.body);
      expect(res.body.header).toMatchObject({ sampleRateHz: rate, profile: null, version: 1, roomId });
      expect(res.body.coefficientLayout).toEqual({
        order: ['b0', 'b1', 'b2', 'a1', 'a2'],
        feedbackSign: 'plus',
        numberFormat: 'full',
      });
      const main = res.body.channels.find((c: { id: string }) => c.id === 'M+030');
      expect(main.delaySamples).toBe(Math.round((1.5636 * rate) / 1000));
      expectAnswered(main.delayMs, (main.delaySamples * 1000) / rate, 'ms');
      const biquads = await as(ctx.keys.calculate).post('/v1/biquads', { filters, sampleRateHz: rate });
      const crossover = await as(ctx.keys.calculate).post('/v1/crossovers', {
        family: 'linkwitzRiley',
        order: 4,
        frequencyHz: 80,
        sampleRateHz: rate,
      });
      const row = (s: Record<string, number>) => [s.b0, s.b1, s.b2, s.a1, s.a2];
      const eq = main.eq.map((b: { coefficients: number[] }) => b.coefficients);
      expect(eq).toEqual(biquads.body.sections.map(row));
      expect(eq).toEqual(
        filters.map((f) => row(designBiquad(f as Parameters<typeof designBiquad>[0], rate) as never)),
      );
      expect(main.highPass.sections).toEqual(crossover.body.highPass.sections.map(row));
      const sub = res.body.channels.find((c: { id: string }) => c.id === 'LFE1');
      expect(sub.lowPass.sections).toEqual(crossover.body.lowPass.sections.map(row));
      expect(main.eqRounding.maxDeviationDb).toBeLessThan(1e-9);
      // Audio EQ Cookbook property: a peaking section gives exactly its gain at f0, at every rate.
      const [b0, b1, b2, a1, a2] = eq[0];
      const [atF0] = cascadeResponse([{ b0, b1, b2, a1, a2 }], [47.5], rate).magnitudeDb;
      expect(atF0).toBeCloseTo(-6.5, 9);
    },
  );

  it('CSV: header block, parameters table, coefficients table that parses back to exactly the JSON', async () => {
    const json = await dev().get(`/v1/tunings/${eqTuningId}/export?sampleRateHz=96000`);
    const csv = await dev().get(`/v1/tunings/${eqTuningId}/export?format=csv&sampleRateHz=96000`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.headers['content-disposition']).toMatch(/attachment; filename="?tun_\w+-v1-96000\.csv"?/);
    const [head, , coefficients] = csv.text.split('\r\n\r\n');
    expect(head.split('\r\n').slice(0, 3)).toEqual(['field,value', `tuningId,${eqTuningId}`, 'version,1']);
    const lines = coefficients.trim().split('\r\n');
    expect(lines[0]).toBe('channel,stage,section,b0,b1,b2,a1,a2');
    const rows = lines.slice(1).map((l) => l.split(','));
    type Channel = {
      id: string;
      eq: Array<{ coefficients: number[] }>;
      highPass: { sections: number[][] } | null;
      lowPass: { sections: number[][] } | null;
    };
    const fromJson = json.body.channels.flatMap((c: Channel) => [
      ...c.eq.map((b) => [c.id, ...b.coefficients]),
      ...(c.highPass?.sections ?? []).map((s) => [c.id, ...s]),
      ...(c.lowPass?.sections ?? []).map((s) => [c.id, ...s]),
    ]);
    expect(rows.map((r) => [r[0], ...r.slice(3).map(Number)])).toEqual(fromJson);
  });

  it('a stored filter above the requested rate’s Nyquist → 422 naming the query parameter', async () => {
    const res = await dev().get(`/v1/tunings/${eqTuningId}/export?sampleRateHz=16000`);
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe('/query/sampleRateHz');
    expect(res.body.detail).toMatch(/channels\/0\/eq\/1/);
  });

  it('an unknown format → 400', async () => {
    expect((await dev().get(`/v1/tunings/${eqTuningId}/export?format=xml`)).status).toBe(400);
  });
});

describe('owner isolation', () => {
  it('another owner gets 404 everywhere; a calculate key gets 403; an admin sees it', async () => {
    const other = as(ctx.keys.otherTuning);
    for (const path of [
      `/v1/tunings/${managedId}`,
      `/v1/tunings/${managedId}/versions`,
      `/v1/tunings/${managedId}/versions/1`,
      `/v1/tunings/${managedId}/export`,
      `/v1/tunings/compare?left=${managedId}&right=${fullRangeId}`,
      `/v1/rooms/${roomId}/tunings`,
    ]) {
      expect((await other.get(path)).status).toBe(404);
    }
    expect((await other.patch(`/v1/tunings/${managedId}`, { name: 'taken' })).status).toBe(404);
    expect((await other.post(`/v1/tunings/${managedId}/duplicate`, {})).status).toBe(404);
    expect((await other.post(`/v1/tunings/${managedId}/versions/1/restore`)).status).toBe(404);
    expect((await other.delete(`/v1/tunings/${managedId}`)).status).toBe(404);
    expect((await as(ctx.keys.calculate).get(`/v1/tunings/${managedId}`)).status).toBe(403);
    expect((await as(ctx.keys.admin).get(`/v1/tunings/${managedId}`)).status).toBe(200);
    const list = await dev().get(`/v1/rooms/${roomId}/tunings`);
    expectToMatchContract('listRoomTunings', 200, list.body);
    expect(list.body.data.length).toBeGreaterThanOrEqual(3);
  });

  it('DELETE removes a tuning and its versions', async () => {
    const copy = await dev().post(`/v1/tunings/${managedId}/duplicate`);
    expect(copy.status).toBe(201);
    expect((await dev().delete(`/v1/tunings/${copy.body.id}`)).status).toBe(204);
    expect((await dev().get(`/v1/tunings/${copy.body.id}/versions/1`)).status).toBe(404);
  });
});

describe('demo seed: Stage 3 with two tunings', () => {
  it('loads the room and a bass-managed and a full-range tuning that compare as such', async () => {
    const { seedDemoStage3 } = await import('../../seeds/demo-stage3');
    const { newId } = await import('../../api/db/ids');
    const ownerId = newId('usr');
    await ctx.db.write((transaction) =>
      ctx.db.models.User.create(
        {
          id: ownerId,
          email: 'dev@kestrel.example',
          name: 'Demo developer',
          role: 'developer',
          passwordHash: null,
          lastSignInAt: null,
        },
        { transaction },
      ),
    );
    await seedDemoStage3(ctx.services);
    const key = await ctx.addKey('tuning', ownerId);
    const rooms = await as(key).get('/v1/rooms');
    expect(rooms.body.data.map((r: { name: string }) => r.name)).toEqual(['Stage 3']);
    const room = rooms.body.data[0];
    expect(room.notes).toMatch(/^Demo data/);
    const tunings = await as(key).get(`/v1/rooms/${room.id}/tunings`);
    expect(tunings.body.data.map((t: { name: string }) => t.name)).toEqual([
      'Bass-managed 80 Hz (demo)',
      'Full range (demo)',
    ]);
    const [managed, full] = tunings.body.data;
    expect(managed.channels.filter((c: { bassManaged: boolean }) => c.bassManaged)).toHaveLength(11);
    expect(full.channels.every((c: { highPass: unknown }) => c.highPass === null)).toBe(true);
    expect(managed.subwoofer.lowPass).toEqual({ family: 'linkwitzRiley', order: 4, frequencyHz: 80 });
    expect(full.subwoofer.lowPass).toBeNull();
    // Cut-first EQ fitted from the invented responses, within the room's eight bands.
    const centre = managed.channels.find((c: { id: string }) => c.id === 'M+000');
    expect(centre.eq.length).toBeGreaterThan(0);
    expect(centre.eq.length).toBeLessThanOrEqual(8);
    expect(centre.eq.every((f: { gainDb: number }) => f.gainDb < 0)).toBe(true);
    const diff = await as(key).get(`/v1/tunings/compare?left=${managed.id}&right=${full.id}`);
    expect(
      diff.body.channels.filter((c: { bassManagedChanged: boolean }) => c.bassManagedChanged),
    ).toHaveLength(11);
    const report = await as(key).get(`/v1/rooms/${room.id}/report`);
    expect(report.status).toBe(200);
    expect(report.text).toContain('Demo data');

    // The room uses the demo processor profile: the export rounds to its steps and layout.
    expect(room.profileId).toMatch(/^prof_/);
    const exported = await as(key).get(`/v1/tunings/${managed.id}/export`);
    expect(exported.status).toBe(200);
    expectToMatchContract('exportTuning', 200, exported.body);
    expect(exported.body.stale).toBeNull();
    expect(exported.body.header.profile.name).toBe('Generic 8-band, 48/96 kHz (demo)');
    expect(exported.body.coefficientLayout).toEqual({
      order: ['b0', 'b1', 'b2', 'a1', 'a2'],
      feedbackSign: 'minus',
      numberFormat: 'decimal',
      decimalPlaces: 9,
    });
    type Exported = {
      delayMs: number;
      delaySamples: number;
      trimDb: number;
      eq: Array<{ gainDb: number; coefficients: number[] }>;
      eqRounding: { maxDeviationDb: number };
    };
    for (const c of exported.body.channels as Exported[]) {
      // On the profile's 0.01 ms and 0.1 dB steps; samples from the same quantised delay.
      expect(Math.abs(c.delayMs * 100 - Math.round(c.delayMs * 100))).toBeLessThan(1e-9);
      expect(c.delaySamples).toBeCloseTo(c.delayMs * 48, 9);
      expect(Math.abs(c.trimDb * 10 - Math.round(c.trimDb * 10))).toBeLessThan(1e-9);
      for (const band of c.eq) {
        expect(band.coefficients.every((x) => Math.abs(x * 1e9 - Math.round(x * 1e9)) < 1e-3)).toBe(true);
      }
      expect(c.eqRounding.maxDeviationDb).toBeGreaterThanOrEqual(0);
    }
    expect(exported.body.bassManagement.routing).toHaveLength(12);
    expect(exported.body.header.cautions.map((c: { code: string }) => c.code)).toContain('testSignalLevel');
  });
});
