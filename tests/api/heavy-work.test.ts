import request from 'supertest';
import { WaveFile } from 'wavefile';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { exponentialSweep } from '../../shared/capture/sweep';
import { MAX_EQ_BANDS, MAX_FIT_POINTS, MAX_PLAN_FITS } from '../../shared/limits';
import { createTestContext, type TestContext } from '../support/test-context';

/*
 * Heavy work (analysis, EQ fits, plans) runs on worker threads: one thread and no waiting room here, so
 * a second heavy request while one runs is refused at once.
 */
let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({ env: { HEAVY_WORK_THREADS: '1', HEAVY_WORK_QUEUE_LIMIT: '0' } });
});
afterAll(async () => {
  await ctx.close();
});

/** A measured response with deep ripple over the whole band: the fit uses every band it may. */
function rippled(points: number) {
  const frequenciesHz = Array.from(
    { length: points },
    (_, i) => +(20 * 1000 ** (i / (points - 1))).toFixed(3),
  );
  const magnitudeDb = frequenciesHz.map((_, i) => 10 * Math.sin(i / 5) + 5 * Math.sin(i / 23));
  return { frequenciesHz, magnitudeDb };
}
/** The costliest fit the contract takes: most bands, most points, boosts and cuts at their limits. */
const heaviestFit = {
  sampleRateHz: 48000,
  measured: rippled(MAX_FIT_POINTS),
  maxBands: MAX_EQ_BANDS,
  maxBoostDb: 24,
  maxCutDb: 48,
};
const post = (path: string, body: object) =>
  request(ctx.app).post(path).set('Authorization', `Bearer ${ctx.keys.calculate}`).send(body);

/** Resolves once `count` heavy tasks are running or waiting. */
async function untilInFlight(count: number): Promise<void> {
  while (ctx.services.work.inFlight < count) await new Promise((resolve) => setImmediate(resolve));
}

describe('heavy work on worker threads', () => {
  it('answers /healthz while a heavy fit is still running', async () => {
    const order: string[] = [];
    const heavy = post('/v1/eq/fit', heaviestFit).then((res) => {
      order.push('fit');
      return res;
    });
    await untilInFlight(1);
    const health = await request(ctx.app).get('/healthz');
    order.push('healthz');
    expect(health.status).toBe(200);
    // On the event loop the fit would have held /healthz until it finished.
    expect(ctx.services.work.inFlight).toBe(1);
    const fit = await heavy;
    expect(order).toEqual(['healthz', 'fit']);
    expect(fit.status).toBe(200);
    expect(fit.body.bands.length).toBeGreaterThan(0);
  });

  it('refuses a heavy request with 503, Retry-After and a problem document while the pool is full', async () => {
    const running = ctx.services.work.run('fitEq', heaviestFit);
    expect(ctx.services.work.inFlight).toBe(ctx.services.work.capacity);
    const refused = await post('/v1/plans', {
      layout: '2.0',
      channels: [
        { id: 'M+030', distance: 2 },
        { id: 'M-030', distance: 2 },
      ],
    });
    await running;
    expect(refused.status).toBe(503);
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(refused.body).toMatchObject({
      status: 503,
      type: 'https://isochron.dev/problems/heavy-work-busy',
      instance: '/v1/plans',
    });
    expect(refused.body.requestId).toBe(refused.headers['request-id']);
    // Cheap calculations never wait for the pool.
    const cheap = await post('/v1/biquads', {
      filters: [{ type: 'peaking', frequencyHz: 1000, gainDb: -3, q: 1.41 }],
    });
    expect(cheap.status).toBe(200);
  });

  it('turns a refusal inside the worker into a 422 naming the request field', async () => {
    const unordered = { ...heaviestFit, measured: { frequenciesHz: [20, 200, 100], magnitudeDb: [0, 1, 2] } };
    const res = await post('/v1/eq/fit', unordered);
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([
      { pointer: '/body/measured/frequenciesHz/2', message: expect.stringMatching(/ascend/) },
    ]);
  });

  it('refuses a plan with more EQ fits than its budget, naming the first response over it', async () => {
    // 9.1.6 has 16 channels; two measured responses each would be 32 fits, so the 25th is over.
    const layout = await request(ctx.app)
      .get('/v1/layouts/9.1.6')
      .set('Authorization', `Bearer ${ctx.keys.calculate}`);
    const labels: string[] = layout.body.channels.map((c: { label: string }) => c.label);
    const measuredResponse = { frequenciesHz: [20, 200, 2000], magnitudeDb: [0, 0, 0] };
    const channels = labels.map((id) => ({ id, distance: 2, measuredResponse }));
    const res = await post('/v1/plans', {
      layout: '9.1.6',
      limits: { eqBandsPerChannel: 2 },
      channels: [...channels, ...channels.slice(0, MAX_PLAN_FITS + 1 - channels.length)],
    });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe(`/body/channels/${MAX_PLAN_FITS}/measuredResponse`);
  });

  it('turns a WAV the worker cannot read into a 422 unusable-audio problem', async () => {
    const res = await request(ctx.app)
      .post('/v1/analysis/impulse-response')
      .set('Authorization', `Bearer ${ctx.keys.calculate}`)
      .attach('file', Buffer.from('RIFF\u0004\u0000\u0000\u0000WAVE'), {
        filename: 'short.wav',
        contentType: 'audio/wav',
      });
    expect(res.status).toBe(422);
    expect(res.body.type).toBe('https://isochron.dev/problems/unusable-audio');
    expect(res.body.errors[0].pointer).toBe('/body/file');
  });
});

/** A 1 s sweep (20 Hz–20 kHz at 48 kHz, −12 dBFS) recorded 2 ms late with 0.3 s of room after it, 24-bit. */
function sweepWav(): Buffer {
  const played = exponentialSweep({
    sampleRateHz: 48000,
    startHz: 20,
    endHz: 20000,
    durationS: 1,
    fadeInS: 0.05,
    fadeOutS: 0.01,
    levelDbfs: -12,
    silenceAfterS: 0,
  });
  const recorded = new Array<number>(played.length + 0.3 * 48000).fill(0);
  played.forEach((v, i) => (recorded[i + 96] = Math.round(v * 8388607)));
  const file = new WaveFile();
  file.fromScratch(1, 48000, '24', recorded);
  return Buffer.from(file.toBuffer());
}

describe('every heavy route waits for the pool, and is refused while it is full', () => {
  let roomId: string;
  const tuning = () => ({ Authorization: `Bearer ${ctx.keys.tuning}` });
  beforeAll(async () => {
    const room = await request(ctx.app).post('/v1/rooms').set(tuning()).send(structuredClone(STAGE3_ROOM));
    expect(room.status).toBe(201);
    roomId = room.body.id;
  });

  const routes: Array<[string, () => request.Test]> = [
    [
      'POST /v1/analysis/sweep',
      () =>
        request(ctx.app)
          .post('/v1/analysis/sweep')
          .set('Authorization', `Bearer ${ctx.keys.calculate}`)
          .field('durationS', '1')
          .attach('file', sweepWav(), 'sweep.wav'),
    ],
    [
      'POST /v1/rooms/{roomId}/plans',
      () => request(ctx.app).post(`/v1/rooms/${roomId}/plans`).set(tuning()).send({}),
    ],
    [
      'POST /v1/rooms/{roomId}/measurements (a WAV impulse response)',
      () =>
        request(ctx.app)
          .post(`/v1/rooms/${roomId}/measurements`)
          .set(tuning())
          .field('channel', 'M+030')
          .attach('file', sweepWav(), 'ir.wav'),
    ],
  ];

  /**
   * Keeps the pool full until released: fit after fit, each started in the same turn the last one ends
   * in (only microtasks run between), so an upload still arriving meets a full pool whenever it lands.
   */
  function holdPool(): () => Promise<void> {
    let held = true;
    const holding = (async () => {
      while (held) await ctx.services.work.run('fitEq', heaviestFit);
    })();
    return async () => {
      held = false;
      await holding;
    };
  }

  it.each(routes)('%s: 503 heavy-work-busy with Retry-After while the pool is full', async (_name, send) => {
    const release = holdPool();
    expect(ctx.services.work.inFlight).toBe(ctx.services.work.capacity);
    const refused = await send();
    await release();
    expect(refused.status).toBe(503);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(refused.body.type).toBe('https://isochron.dev/problems/heavy-work-busy');
  });

  it.each(routes)('%s: answered from the worker once the pool is free', async (_name, send) => {
    const res = await send();
    expect(res.status).toBeLessThan(300);
    expect(ctx.services.work.inFlight).toBe(0);
  });

  it('a sweep cut outside the file is refused by the worker as a 422 naming the field', async () => {
    const res = await request(ctx.app)
      .post('/v1/analysis/sweep')
      .set('Authorization', `Bearer ${ctx.keys.calculate}`)
      .field('durationS', '1')
      .field('offsetS', '5')
      .attach('file', sweepWav(), 'sweep.wav');
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([
      { pointer: '/body/offsetS', message: expect.stringMatching(/inside the file/) },
    ]);
  });

  it('a silent loopback channel of an upload is refused by the worker, naming the field', async () => {
    const file = new WaveFile();
    const mic = new Array<number>(48000).fill(0);
    mic[480] = 4_000_000;
    file.fromScratch(2, 48000, '24', [mic, new Array<number>(48000).fill(0)]);
    const res = await request(ctx.app)
      .post(`/v1/rooms/${roomId}/measurements`)
      .set(tuning())
      .field('channel', 'M+030')
      .field('fileChannel', '0')
      .field('referenceFileChannel', '1')
      .attach('file', Buffer.from(file.toBuffer()), 'ir.wav');
    expect(res.status).toBe(422);
    expect(res.body.errors[0]).toEqual({
      pointer: '/body/referenceFileChannel',
      message: expect.stringMatching(/silent/),
    });
  });
});
