import { MAX_CHANNELS } from '../../shared/limits';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { deeplyNested, expectProblem, poster, rawPoster } from './calculation-helpers';
import { expectAnswered } from '../support/presentation';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const post = poster(() => ctx, '/v1/delays');
const postRaw = rawPoster(() => ctx, '/v1/delays');

describe('POST /v1/delays', () => {
  // Rule of thumb (common practice): one loudspeaker 0.5 ms late → it gets 0, the others +0.5 ms.
  it('one channel 0.5 ms late: it is the reference and every other channel gets +0.5 ms (24 samples at 48 kHz)', async () => {
    const res = await post({
      channels: [
        { id: 'M+030', arrivalMs: 8.75 },
        { id: 'M-030', arrivalMs: 8.75 },
        { id: 'M+000', arrivalMs: 9.25 },
      ],
    });
    expect(res.status).toBe(200);
    expectToMatchContract('computeDelays', 200, res.body);
    expect(res.body.referenceChannel).toBe('M+000');
    expect(res.body.sampleRateHz).toBe(48000);
    expect(res.body.channels.map((c: { delayMs: number }) => c.delayMs)).toEqual([0.5, 0.5, 0]);
    expect(res.body.channels.map((c: { delaySamples: number }) => c.delaySamples)).toEqual([24, 24, 0]);
  });

  // Speed of sound 343.2·sqrt((t + 273.15)/293.15) m/s (pyfar, ISO 9613-1 form); 1 ft = 0.3048 m, 1 in = 0.0254 m.
  it('reads distances with units and aligns them at the air temperature', async () => {
    const res = await post({
      temperatureC: 20,
      sampleRateHz: 96000,
      channels: [
        { id: 'M+030', distance: '10.5 ft' },
        { id: 'M-030', distance: '126 in' },
        { id: 'M+000', distance: 2.9 },
      ],
    });
    expect(res.status).toBe(200);
    expectToMatchContract('computeDelays', 200, res.body);
    expect(res.body.speedOfSoundMps).toBeCloseTo(343.2, 9);
    const [left, right, centre] = res.body.channels;
    expect(left.distanceM).toBeCloseTo(3.2004, 12);
    expect(right.distanceM).toBeCloseTo(3.2004, 12);
    const expectedMs = ((3.2004 - 2.9) / 343.2) * 1000;
    expectAnswered(centre.delayMs, expectedMs, 'ms');
    expect(centre.delaySamples).toBe(Math.round(expectedMs * 96));
    expect(Math.abs(centre.quantizationErrorUs)).toBeLessThanOrEqual(1e6 / 96000 / 2);
  });

  it('clamps to limits.delayMaxMs and warns', async () => {
    const res = await post({
      channels: [
        { id: 'far', arrivalMs: 90 },
        { id: 'near', arrivalMs: 5 },
      ],
      limits: { delayMaxMs: 75 },
    });
    expect(res.status).toBe(200);
    expectToMatchContract('computeDelays', 200, res.body);
    expect(res.body.channels[1]).toMatchObject({ delayMs: 75, delaySamples: 3600, clamped: true });
    expect(res.body.warnings[0]).toMatchObject({ code: 'delayClamped', channel: 'near' });
  });

  it('accepts MAX_CHANNELS channels and refuses one more', async () => {
    const channels = Array.from({ length: MAX_CHANNELS + 1 }, (_, i) => ({
      id: `ch${i}`,
      distance: 2 + i / 50,
    }));
    const res = await post({ channels: channels.slice(0, MAX_CHANNELS) });
    expect(res.status).toBe(200);
    expect(res.body.channels).toHaveLength(MAX_CHANNELS);
    const over = await post({ channels });
    expect(over.status).toBe(400);
    expect(over.body.errors[0].pointer).toBe('/body/channels');
  });

  describe('bad input gets a problem document naming the field', () => {
    it.each([
      ['no body fields → 400', {}, 400, '/body/channels'],
      ['channels of the wrong type → 400', { channels: 'M+030' }, 400, '/body/channels'],
      ['an empty channel list → 400', { channels: [] }, 400, '/body/channels'],
      ['a channel without an id → 400', { channels: [{ distance: 3 }] }, 400, '/body/channels/0/id'],
      [
        'a channel named by `label` instead of `id` → 400',
        { channels: [{ label: 'M+030', distance: 3 }] },
        400,
        '/body/channels/0/label',
      ],
      [
        'a distance of the wrong type → 400',
        { channels: [{ id: 'a', distance: true }] },
        400,
        '/body/channels/0/distance',
      ],
      [
        'arrivalMs as the string "NaN" → 400',
        { channels: [{ id: 'a', arrivalMs: 'NaN' }] },
        400,
        '/body/channels/0/arrivalMs',
      ],
      [
        'arrivalMs as "Infinity" → 400',
        { channels: [{ id: 'a', arrivalMs: 'Infinity' }] },
        400,
        '/body/channels/0/arrivalMs',
      ],
      [
        'a negative arrival → 400',
        { channels: [{ id: 'a', arrivalMs: -1 }] },
        400,
        '/body/channels/0/arrivalMs',
      ],
      [
        'a negative distance → 400',
        { channels: [{ id: 'a', distance: -3 }] },
        400,
        '/body/channels/0/distance',
      ],
      [
        'a temperature out of range → 400',
        { channels: [{ id: 'a', arrivalMs: 1 }], temperatureC: 99 },
        400,
        '/body/temperatureC',
      ],
      [
        'an unknown field → 400',
        { channels: [{ id: 'a', arrivalMs: 1 }], colour: 'red' },
        400,
        '/body/colour',
      ],
      [
        'a sample rate out of range → 400',
        { channels: [{ id: 'a', arrivalMs: 1 }], sampleRateHz: 1000 },
        400,
        '/body/sampleRateHz',
      ],
      [
        'a distance that is not a length → 422',
        { channels: [{ id: 'a', distance: '3 kg' }] },
        422,
        '/body/channels/0/distance',
      ],
      [
        'a distance of "NaN m" → 422',
        { channels: [{ id: 'a', distance: 'NaN m' }] },
        422,
        '/body/channels/0/distance',
      ],
      [
        'both distance and arrival → 422',
        { channels: [{ id: 'a', distance: 3, arrivalMs: 2 }] },
        422,
        '/body/channels/0/arrivalMs',
      ],
      [
        'a repeated id → 422',
        {
          channels: [
            { id: 'a', arrivalMs: 1 },
            { id: 'a', arrivalMs: 2 },
          ],
        },
        422,
        '/body/channels/1/id',
      ],
      [
        'both temperature and speed of sound → 422',
        { channels: [{ id: 'a', arrivalMs: 1 }], temperatureC: 20, speedOfSoundMps: 343 },
        422,
        '/body/speedOfSoundMps',
      ],
    ])('%s', async (_what, body, status, pointer) => {
      expectProblem(await post(body), status, pointer);
    });

    it('a repeated id is named in the message as well as the pointer', async () => {
      const res = await post({
        channels: [
          { id: 'M+030', arrivalMs: 1 },
          { id: 'M+030', arrivalMs: 2 },
        ],
      });
      expectProblem(res, 422, '/body/channels/1/id');
      expect(res.body.errors[0].message).toBe('id M+030 appears more than once');
    });

    it('129 channels → 400', async () => {
      const channels = Array.from({ length: 129 }, (_, i) => ({ id: `c${i}`, arrivalMs: 1 }));
      expectProblem(await post({ channels }), 400, '/body/channels');
    });

    it('10,000 channels → 400', async () => {
      const channels = Array.from({ length: 10000 }, (_, i) => ({ id: `c${i}`, arrivalMs: 1 }));
      expectProblem(await post({ channels }), 400, '/body/channels');
    });

    it.each([1000, 2000])('junk nested %i levels deep → 400', async (depth) => {
      expectProblem(await post({ channels: [{ id: 'a', distance: deeplyNested(depth) }] }), 400);
      expectProblem(await post(deeplyNested(depth)), 400);
    });

    it('wrong content type → 415, broken JSON → 400', async () => {
      expectProblem(await postRaw('channels=M+030', 'application/x-www-form-urlencoded'), 415);
      expectProblem(await postRaw('{"channels": [', 'application/json'), 400);
    });
  });
});
