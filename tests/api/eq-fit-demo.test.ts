import request from 'supertest';
import { seedDemoPlatform } from '../../seeds/demo-platform';
import { seedDemoStage3 } from '../../seeds/demo-stage3';
import { seedDemoStage3Measurements } from '../../seeds/demo-stage3-stored-measurements';
import { eqFitRequest } from '../../console/src/app/rooms/room-measurements/measurement-view';
import { createTestContext, type TestContext } from '../support/test-context';

/*
 * The demo room's stored measurements fitted the way the console fits them (the room's limits, its volume
 * and the side surround's measured T30, cuts only), read as an engineer would read the advice. The demo
 * responses are invented from known room shapes (seeds/demo-stage3-measurements.ts), so where each mode
 * sits is known here.
 */

let ctx: TestContext;
let roomId: string;
let room: {
  dimensions: { widthM: number; lengthM: number; heightM: number };
  limits: object;
  sampleRateHz: number;
};
let t30: number;
const get = (path: string) => request(ctx.app).get(path).set('Authorization', `Bearer ${ctx.keys.admin}`);

beforeAll(async () => {
  ctx = await createTestContext();
  await seedDemoPlatform(ctx.services);
  await seedDemoStage3(ctx.services);
  await seedDemoStage3Measurements(ctx.services);
  room = (await get('/v1/rooms')).body.data.find((r: { name: string }) => r.name === 'Stage 3');
  roomId = (room as unknown as { id: string }).id;
  const list = await get(`/v1/rooms/${roomId}/measurements?limit=100`);
  const ir = list.body.data.find((m: { kind: string }) => m.kind === 'impulseResponse');
  t30 = (await get(`/v1/rooms/${roomId}/measurements/${ir.id}`)).body.result.decay.t30S;
});
afterAll(async () => {
  await ctx.close();
});

interface Band {
  frequencyHz: number;
  gainDb: number;
  q: number;
}

async function consoleFit(channel: string) {
  const average = await get(
    `/v1/rooms/${roomId}/measurements/average?channel=${encodeURIComponent(channel)}`,
  );
  const { widthM, lengthM, heightM } = room.dimensions;
  const body = eqFitRequest(average.body, room.limits, room.sampleRateHz, false, {
    volumeM3: widthM * lengthM * heightM,
    reverberationTimeS: t30,
  });
  const res = await request(ctx.app)
    .post('/v1/eq/fit')
    .set('Authorization', `Bearer ${ctx.keys.admin}`)
    .send(body);
  expect(res.status).toBe(200);
  return res.body as {
    bands: Band[];
    toHz: number;
    transition: { frequencyHz: number };
    residualRmsDb: { before: number; after: number };
    warnings: Array<{ code: string }>;
    explanation: { notUsed: Array<{ code: string }> };
  };
}

const near = (bands: Band[], f: number, octaves = 0.15) =>
  bands.filter((b) => Math.abs(Math.log2(b.frequencyHz / f)) <= octaves);

describe('EQ fits of the demo data', () => {
  it('correct only up to the transition frequency of Stage 3 (2000·√(T30/V), Kuttruff)', async () => {
    // The synthetic side-surround decay has an invented T60 of 0.30 s: about 93 Hz in 137.7 m³.
    expect(t30).toBeGreaterThan(0.25);
    expect(t30).toBeLessThan(0.35);
    for (const channel of ['M+030', 'M-030', 'M+000', 'LFE1', 'M+090']) {
      const fit = await consoleFit(channel);
      expect(fit.transition.frequencyHz).toBeCloseTo(2000 * Math.sqrt(t30 / (6.1 * 7.4 * 3.05)), 1);
      for (const band of fit.bands) {
        expect(band.frequencyHz).toBeLessThanOrEqual(fit.toHz);
        expect(band.gainDb).toBeLessThan(0);
      }
      expect(fit.residualRmsDb.after).toBeLessThanOrEqual(fit.residualRmsDb.before);
    }
  });

  it('cut the invented modes of the fronts: 56 Hz (M+030), 58 Hz (M-030), 63 Hz (M+000)', async () => {
    expect(near((await consoleFit('M+030')).bands, 56)).toHaveLength(1);
    expect(near((await consoleFit('M-030')).bands, 58)).toHaveLength(1);
    expect(near((await consoleFit('M+000')).bands, 63, 0.2)).toHaveLength(1);
  });

  it('match the subwoofer within its own band and cut its 42 Hz mode', async () => {
    const fit = await consoleFit('LFE1');
    expect(fit.warnings.map((w) => w.code)).toContain('levelReferenceOutOfBand');
    const mode = near(fit.bands, 42);
    expect(mode).toHaveLength(1);
    expect(mode[0].gainDb).toBeLessThan(-5);
  });

  it('leave the side surround alone above the transition: no narrow cut at 1.9 kHz, nothing at 10.75 kHz', async () => {
    const fit = await consoleFit('M+090');
    expect(fit.bands.filter((b) => b.frequencyHz > 200)).toEqual([]);
    expect(fit.explanation.notUsed.map((n) => n.code)).toContain('aboveTransition');
  });
});
