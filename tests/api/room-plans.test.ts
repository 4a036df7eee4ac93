import request from 'supertest';
import { WaveFile } from 'wavefile';
import { STAGE3_ROOM, STAGE3_SPL_DB } from '../../seeds/demo-stage3-room';
import { stage3MeasuredResponses } from '../../seeds/demo-stage3-measurements';
import { logFrequencyGrid } from '../../shared/dsp/grid';
import { MAX_PLAN_FITS } from '../../shared/limits';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectProblem } from './calculation-helpers';
import { expectAnswered } from '../support/presentation';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const auth = (key = ctx.keys.tuning) => ({ Authorization: `Bearer ${key}` });
const fs = 48000;
/** Speed of sound at 21 °C, 343.2·sqrt((t + 273.15)/293.15) (ISO 9613-1 form, as in the pyfar library). */
const c21 = 343.2 * Math.sqrt(294.15 / 293.15);
const distance = (id: string) => {
  const s = STAGE3_ROOM.loudspeakers.find((l) => l.id === id) as { x: number; y: number; z: number };
  const l = STAGE3_ROOM.listener;
  return Math.hypot(s.x - l.x, s.y - l.y, s.z - l.z);
};

async function newRoom(body: object = STAGE3_ROOM): Promise<string> {
  const res = await request(ctx.app).post('/v1/rooms').set(auth()).send(structuredClone(body));
  expect(res.status).toBe(201);
  return res.body.id as string;
}
async function measure(roomId: string, body: object): Promise<string> {
  const res = await request(ctx.app).post(`/v1/rooms/${roomId}/measurements`).set(auth()).send(body);
  expect(res.status).toBe(201);
  return res.body.id as string;
}
const plan = (roomId: string, body: object = {}, key?: string) =>
  request(ctx.app).post(`/v1/rooms/${roomId}/plans`).set(auth(key)).send(body);

type Source = { source: string; measurementIds: string[] } & Record<string, unknown>;
type Channel = {
  id: string;
  trimDb: number;
  delayMs: number;
  sources: { delay: Source; level: Source; response: Source };
  eq: { bands: unknown[]; residualRmsDb: unknown };
};
const channel = (body: { channels: Channel[] }, id: string) =>
  body.channels.find((ch) => ch.id === id) as Channel;

describe('POST /v1/rooms/{roomId}/plans', () => {
  let roomId: string;
  const ids: Record<string, string> = {};
  beforeAll(async () => {
    roomId = await newRoom();
    for (const [id, splDb] of Object.entries(STAGE3_SPL_DB)) {
      ids[`spl:${id}`] = await measure(roomId, { kind: 'spl', channel: id, micPosition: 'MLP', splDb });
    }
    const responses = stage3MeasuredResponses();
    const left = responses['M+030'];
    ids.left1 = await measure(roomId, {
      kind: 'frequencyResponse',
      channel: 'M+030',
      micPosition: 'MLP',
      response: { frequenciesHz: left.frequenciesHz, magnitudeDb: left.magnitudeDb.map((x) => x + 80) },
    });
    // The second position reads 6 dB higher at every frequency: the power average of L and L + 6 is
    // L + 10·log10((1 + 10^0.6)/2) = L + 3.9732 dB.
    ids.left2 = await measure(roomId, {
      kind: 'frequencyResponse',
      channel: 'M+030',
      micPosition: '2',
      response: { frequenciesHz: left.frequenciesHz, magnitudeDb: left.magnitudeDb.map((x) => x + 86) },
    });
  });

  it('takes every input from the store and says where each number came from', async () => {
    const res = await plan(roomId, { targets: { referenceDb: 79, crossoverHz: 80 }, temperatureC: 21 });
    expect(res.status).toBe(200);
    expectToMatchContract('planStoredRoom', 200, res.body);
    expect(res.body.measurements.referencePosition).toBe('MLP');
    const rear = channel(res.body, 'M-135');
    expect(rear.trimDb).toBeCloseTo(79 - 82.7, 9); // trim = target − measured
    expect(rear.sources.level).toEqual({
      source: 'splReading',
      measurementIds: [ids['spl:M-135']],
      micPosition: 'MLP',
      weighting: 'C',
    });
    // Delays from geometry (no impulse responses stored): hand computation as in the plans test.
    const expectedMs = ((distance('LFE1') - distance('M-135')) / c21) * 1000;
    expectAnswered(rear.delayMs, expectedMs, 'ms');
    expect(rear.sources.delay).toMatchObject({ source: 'geometry', measurementIds: [] });
    const left = channel(res.body, 'M+030');
    expect(left.sources.response).toEqual({
      source: 'responseAverage',
      measurementIds: [ids.left1, ids.left2],
      micPositions: ['MLP', '2'],
      kind: 'frequencyResponse',
    });
    // The averaged response was fitted (how many bands it needs is the fitter's business).
    expect(left.eq.residualRmsDb).not.toBeNull();
    expect(channel(res.body, 'M-030').sources.response.source).toBe('none');
    expect(res.body.subwoofer.integration).toMatchObject({ source: 'geometry', measurementIds: [] });
    expect(res.body.subwoofer.integration.reason).toMatch(/phase/);
    expect([...res.body.measurements.used].sort()).toEqual(Object.values(ids).sort());
  });

  it('averages the positions as power (the same plan as POST /v1/plans given the average)', async () => {
    const avg = await request(ctx.app)
      .get(`/v1/rooms/${roomId}/measurements/average?channel=M%2B030`)
      .set(auth());
    const direct = await request(ctx.app)
      .post('/v1/plans')
      .set(auth())
      .send({
        layout: '7.1.4',
        room: STAGE3_ROOM.dimensions,
        listener: STAGE3_ROOM.listener,
        temperatureC: 21,
        sampleRateHz: 48000,
        targets: { referenceDb: 79, crossoverHz: 80 },
        limits: STAGE3_ROOM.limits,
        channels: STAGE3_ROOM.loudspeakers.map(({ id, x, y, z }) => ({
          id,
          position: { x, y, z },
          measuredDb: STAGE3_SPL_DB[id],
          bassManaged: !id.startsWith('LFE'),
          ...(id === 'M+030' && {
            measuredResponse: { frequenciesHz: avg.body.frequenciesHz, magnitudeDb: avg.body.magnitudeDb },
          }),
        })),
      });
    const stored = await plan(roomId, { targets: { referenceDb: 79, crossoverHz: 80 }, temperatureC: 21 });
    expect(direct.status).toBe(200);
    // The average is answered to 0.01 dB (the contract's rule), so the direct plan fits a response
    // within 0.005 dB of the one the stored plan averaged at full precision: the same bands, and a
    // residual that may differ in its last shown decimal.
    type Residual = { before: number; after: number };
    const { residualRmsDb: storedResidual, ...storedEq } = channel(stored.body, 'M+030').eq as {
      residualRmsDb: Residual;
    };
    const { residualRmsDb: directResidual, ...directEq } = channel(direct.body, 'M+030').eq as {
      residualRmsDb: Residual;
    };
    expect(storedEq).toEqual(directEq);
    expect(Math.abs(storedResidual.before - directResidual.before)).toBeLessThanOrEqual(0.01 + 1e-9);
    expect(Math.abs(storedResidual.after - directResidual.after)).toBeLessThanOrEqual(0.01 + 1e-9);
    // One point of the average against the hand figure above.
    const responses = stage3MeasuredResponses();
    const i = responses['M+030'].frequenciesHz.findIndex((f) => f >= 1000);
    const f = responses['M+030'].frequenciesHz[i];
    const j = avg.body.frequenciesHz.findIndex((x: number) => Math.abs(x - f) / f < 0.01);
    if (j >= 0) {
      expect(avg.body.magnitudeDb[j]).toBeCloseTo(responses['M+030'].magnitudeDb[i] + 80 + 3.9732, 0);
    }
  });

  it('leaves "after" measurements out, and says so', async () => {
    const stored = await plan(roomId, { store: true, name: 'First plan', targets: { referenceDb: 79 } });
    const tuningId = stored.body.tuning.id;
    const after = await measure(roomId, {
      kind: 'spl',
      channel: 'M-135',
      micPosition: 'MLP',
      splDb: 60,
      tuningId,
      tuningVersion: 1,
    });
    const res = await plan(roomId, { targets: { referenceDb: 79 } });
    expect(channel(res.body, 'M-135').trimDb).toBeCloseTo(79 - 82.7, 9);
    expect(res.body.measurements.ignored).toContainEqual({
      id: after,
      reason: expect.stringMatching(/after a tuning was loaded/),
    });
  });

  it('store: true saves version 1 of a new tuning with the plan settings and its promise', async () => {
    const res = await plan(roomId, { store: true, targets: { referenceDb: 79, crossoverHz: 80 } });
    expect(res.status).toBe(201);
    expectToMatchContract('planStoredRoom', 201, res.body);
    expect(res.headers.location).toBe(`/v1/tunings/${res.body.tuning.id}`);
    expect(res.body.tuning).toMatchObject({ version: 1, origin: 'plan', name: 'Plan from measurements' });
    const got = await request(ctx.app).get(`/v1/tunings/${res.body.tuning.id}`).set(auth());
    const rear = got.body.channels.find((ch: { id: string }) => ch.id === 'M-135');
    expect(rear.trimDb).toBeCloseTo(channel(res.body, 'M-135').trimDb, 12);
    expect(rear.delayMs).toBeCloseTo(channel(res.body, 'M-135').delayMs, 12);
  });

  it('refuses a calculate key (403) and a room of someone else (404)', async () => {
    expect((await plan(roomId, {}, ctx.keys.calculate)).status).toBe(403);
    expect((await plan(roomId, {}, ctx.keys.otherTuning)).status).toBe(404);
  });

  it('bad overrides name the field', async () => {
    expectProblem(
      await plan(roomId, { measurements: { delaysFrom: 'measuredArrival' } }),
      422,
      '/body/measurements/delaysFrom',
    );
    expectProblem(
      await plan(roomId, { measurements: { include: ['meas_0000000000000000000000'] } }),
      422,
      '/body/measurements/include/0',
    );
    expectProblem(await plan(roomId, { bassManaged: ['LFE1'] }), 422, '/body/bassManaged/0');
    expectProblem(await plan(roomId, { targets: { crossoverHz: 30000 } }), 422, '/body/targets/crossoverHz');
    expectProblem(await plan(roomId, { surprise: 1 }), 400);
  });
});

describe('arrivals from impulse responses with a timing reference', () => {
  /** A two-channel WAV: the loudspeaker's impulse at `arrivalMs` and the loopback's at `loopMs`. */
  function capture(arrivalMs: number, loopMs: number): Buffer {
    const n = 0.25 * fs;
    const speaker = new Float64Array(n);
    const loop = new Float64Array(n);
    speaker[Math.round((arrivalMs * fs) / 1000)] = 0.5;
    for (let i = Math.round((arrivalMs * fs) / 1000) + 1; i < n; i++)
      speaker[i] = 1e-4 * Math.sin(i) * Math.exp(-i / 2000);
    loop[Math.round((loopMs * fs) / 1000)] = 0.8;
    const wav = new WaveFile();
    wav.fromScratch(2, fs, '32f', [Array.from(speaker), Array.from(loop)]);
    return Buffer.from(wav.toBuffer());
  }
  const stereo = {
    name: 'Two-channel check',
    layout: '0+2+0',
    dimensions: { widthM: 4, lengthM: 5, heightM: 2.6 },
    listener: { x: 2, y: 3, z: 1.2 },
    loudspeakers: [
      { id: 'M+030', x: 1, y: 1.2, z: 1.2 },
      { id: 'M-030', x: 3, y: 1.2, z: 1.2 },
    ],
    limits: { delayMaxMs: 20 },
    sampleRateHz: fs,
  };

  it('uses arrivals relative to each capture’s loopback, so a different latency per capture cancels', async () => {
    const roomId = await newRoom(stereo);
    // Left arrives 1.0 ms later than right acoustically; the captures have latencies of 12 ms and 3 ms.
    const upload = (ch: string, file: Buffer) =>
      request(ctx.app)
        .post(`/v1/rooms/${roomId}/measurements`)
        .set(auth())
        .field('channel', ch)
        .field('micPosition', 'MLP')
        .field('fileChannel', '0')
        .field('referenceFileChannel', '1')
        .attach('file', file, `${ch}.wav`);
    const l = await upload('M+030', capture(12 + 6.0, 12));
    const r = await upload('M-030', capture(3 + 5.0, 3));
    expect(l.status).toBe(201);
    expect(l.body.result.timingReference).toEqual({ source: 'loopback', arrivalMs: 12, fileChannel: 1 });
    const res = await plan(roomId, {});
    expect(res.status).toBe(200);
    expectToMatchContract('planStoredRoom', 200, res.body);
    const right = channel(res.body, 'M-030');
    expect(right.sources.delay).toEqual({
      source: 'measuredArrival',
      measurementIds: [r.body.id],
      micPosition: 'MLP',
      timingReference: true,
    });
    expect(right.delayMs).toBeCloseTo(1.0, 9); // 6.0 − 5.0 ms, latencies cancelled
    expect(channel(res.body, 'M+030').delayMs).toBe(0);
    // Forced to geometry, the same room plans from the positions (equal distances: no delay).
    const geometry = await plan(roomId, { measurements: { delaysFrom: 'geometry' } });
    expect(channel(geometry.body, 'M-030').delayMs).toBeCloseTo(0, 12);
  });

  it('refuses a loopback channel that is the loudspeaker channel', async () => {
    const roomId = await newRoom(stereo);
    const res = await request(ctx.app)
      .post(`/v1/rooms/${roomId}/measurements`)
      .set(auth())
      .field('channel', 'M+030')
      .field('fileChannel', '1')
      .field('referenceFileChannel', '1')
      .attach('file', capture(10, 2), 'x.wav');
    expectProblem(res, 422, '/body/referenceFileChannel');
  });
});

describe('subwoofer integration from measured complex responses', () => {
  const grid = logFrequencyGrid(15, 400, 96);
  /** A loudspeaker that is a pure delay (flat, phase −360·f·t), as a frequency response with phase. */
  const response = (ms: number, levelDb: number, inverted = false) => ({
    frequenciesHz: grid,
    magnitudeDb: grid.map(() => levelDb),
    phaseDeg: grid.map((f) => {
      const p = -360 * f * (ms / 1000) + (inverted ? 180 : 0);
      return p - 360 * Math.round(p / 360);
    }),
  });

  it('recovers the subwoofer’s known extra path (2.5 ms early) and its inverted polarity', async () => {
    const roomId = await newRoom();
    const latencyMs = 4; // the rig's latency, the same for every capture
    for (const [id, splDb] of Object.entries(STAGE3_SPL_DB)) {
      await measure(roomId, { kind: 'spl', channel: id, micPosition: 'MLP', splDb });
    }
    // The measured subwoofer is wired inverted and its sound arrives 2.5 ms earlier than its position says.
    const sub = await measure(roomId, {
      kind: 'frequencyResponse',
      channel: 'LFE1',
      micPosition: 'MLP',
      response: response((distance('LFE1') / c21) * 1000 + latencyMs - 2.5, 90.2, true),
    });
    const mains = [];
    for (const id of ['M+030', 'M-030', 'M+000']) {
      mains.push(
        await measure(roomId, {
          kind: 'frequencyResponse',
          channel: id,
          micPosition: 'MLP',
          response: response((distance(id) / c21) * 1000 + latencyMs, 79),
        }),
      );
    }
    const res = await plan(roomId, { targets: { referenceDb: 79, crossoverHz: 80 }, temperatureC: 21 });
    expect(res.status).toBe(200);
    expectToMatchContract('planStoredRoom', 200, res.body);
    const integration = res.body.subwoofer.integration;
    expect(integration.source).toBe('measuredResponses');
    expect(integration.measurementIds).toEqual([sub, ...mains]);
    expect(integration.mains).toEqual(['M+030', 'M-030', 'M+000']);
    // The subwoofer is the latest channel by geometry (delay 0); 2.5 ms early, it needs 2.5 ms = 120 samples.
    expect(Math.abs(integration.chosen.delaySamples - 120)).toBeLessThanOrEqual(1);
    expect(integration.chosen.polarity).toBe('inverted');
    expect(res.body.subwoofer.suggestedDelaySamples).toBe(integration.chosen.delaySamples);
    expect(res.body.subwoofer.suggestedPolarity).toBe('inverted');
    expect(integration.geometric).toMatchObject({ delaySamples: 0, polarity: 'normal' });
    // Levels matched over each path's pass band (the sub was captured 11.2 dB hotter than the mains' 79):
    // the LR4 sum is then an all-pass, flat at 0 dB over the band (Linkwitz-Riley sum property; S. H.
    // Linkwitz, JAES 24(1), 1976).
    expect(integration.subGainDb).toBeCloseTo(-11.2, 9);
    for (const s of integration.summed) for (const db of s.magnitudeDb) expect(db).toBeCloseTo(0, 1);
    expect(integration.runnersUp.length).toBeGreaterThanOrEqual(2);
    // Stored, the tuning's subwoofer output carries the measured choice.
    const stored = await plan(roomId, {
      store: true,
      targets: { referenceDb: 79, crossoverHz: 80 },
      temperatureC: 21,
    });
    const lfe = stored.body.tuning.channels.find((ch: { id: string }) => ch.id === 'LFE1');
    expect(lfe.polarity).toBe('inverted');
    expectAnswered(lfe.delayMs, (integration.chosen.delaySamples / fs) * 1000, 'ms');
  }, 180_000);
});

describe('EQ-fit budget of a stored room’s plan', () => {
  // The same budget as POST /v1/plans (MAX_PLAN_FITS fits per plan), here counted over the channels
  // whose stored measurements give a response: a room of up to MAX_CHANNELS loudspeakers could
  // otherwise ask one request for MAX_CHANNELS fits.
  const count = MAX_PLAN_FITS + 2;
  const labels = Array.from({ length: count }, (_, i) => `X${String(i + 1).padStart(2, '0')}`);
  let roomId: string;
  const responseIds: Record<string, string> = {};
  beforeAll(async () => {
    roomId = await newRoom({
      name: 'Budget check',
      layout: 'bs2051-h',
      dimensions: { widthM: 12, lengthM: 14, heightM: 5 },
      listener: { x: 6, y: 7, z: 1.2 },
      limits: { eqBandsPerChannel: 1 },
      // A ring of loudspeakers 3 m from the listener; the labels are not the layout's (a warning only).
      loudspeakers: labels.map((id, i) => ({
        id,
        x: 6 + 3 * Math.sin((2 * Math.PI * i) / count),
        y: 7 - 3 * Math.cos((2 * Math.PI * i) / count),
        z: 1.2,
      })),
    });
    for (const id of labels) {
      responseIds[id] = await measure(roomId, {
        kind: 'frequencyResponse',
        channel: id,
        micPosition: 'MLP',
        response: { frequenciesHz: [20, 100, 1000, 20000], magnitudeDb: [80, 86, 80, 80] },
      });
    }
  });

  it('refuses more fits than the budget with a problem naming measurements.exclude and the channels over it', async () => {
    const res = await plan(roomId, { targets: { referenceDb: 79 } });
    expectProblem(res, 422, '/body/measurements/exclude');
    const message: string = res.body.errors[0].message;
    expect(message).toContain(`at most ${MAX_PLAN_FITS}`);
    expect(message).toContain(`responses for ${count} channels`);
    expect(message).toContain(labels.slice(MAX_PLAN_FITS).join(', '));
  });

  it('plans once the responses of channels over the budget are left out', async () => {
    const left = labels.slice(MAX_PLAN_FITS).map((id) => responseIds[id]);
    const res = await plan(roomId, { targets: { referenceDb: 79 }, measurements: { exclude: left } });
    expect(res.status).toBe(200);
    const fitted = (res.body.channels as Channel[]).filter((ch) => ch.sources.response.source !== 'none');
    expect(fitted).toHaveLength(MAX_PLAN_FITS);
    expect(res.body.measurements.ignored.map((i: { id: string }) => i.id).sort()).toEqual([...left].sort());
  }, 180_000);
});
