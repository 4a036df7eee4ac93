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

const post = poster(() => ctx, '/v1/bass-management');
const postRaw = rawPoster(() => ctx, '/v1/bass-management');
const SEVEN = ['M+030', 'M-030', 'M+000', 'M+090', 'M-090', 'M+135', 'M-135'];

describe('POST /v1/bass-management', () => {
  // Issue 2 check value: 7 managed + LFE at +10 dB → 20·log10(7 + 10^(10/20)) ≈ 20.1 dB.
  it('7.1: defaults to LR4 at 80 Hz, LFE at +10 dB, headroom 20.1 dB with a warning and a caution', async () => {
    const res = await post({
      channels: [...SEVEN.map((id) => ({ id, bassManaged: true })), { id: 'LFE1' }],
    });
    expect(res.status).toBe(200);
    expectToMatchContract('planBassManagement', 200, res.body);
    expectAnswered(res.body.headroomDb, 20 * Math.log10(7 + Math.pow(10, 0.5)), 'db');
    expect(res.body.channels[0].highPass).toMatchObject({
      family: 'linkwitzRiley',
      order: 4,
      frequencyHz: 80,
      polarity: 'normal',
    });
    expect(res.body.subwoofer.inputs.at(-1)).toEqual({ id: 'LFE1', gainDb: 10, route: 'direct' });
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toEqual(['headroomLarge']);
    expect(res.body.cautions.map((c: { code: string }) => c.code)).toEqual(['bassSumming']);
  });

  // Common practice: n subwoofers fed the same signal are each fed −20·log10(n) dB.
  it('splits the feed between two subwoofers at −6.02 dB each and honours a per-channel crossover', async () => {
    const res = await post({
      subwooferCount: 2,
      lfeGainDb: 10,
      channels: [
        { id: 'M+030', bassManaged: true },
        { id: 'U+045', bassManaged: true, crossover: { frequencyHz: 100, order: 8 } },
        { id: 'M+000' },
        { id: 'LFE1' },
      ],
    });
    expect(res.status).toBe(200);
    expectToMatchContract('planBassManagement', 200, res.body);
    expectAnswered(res.body.subwoofer.feedGainDb, 20 * Math.log10(0.5), 'db');
    expect(res.body.channels[1].highPass).toMatchObject({ order: 8, frequencyHz: 100 });
    expect(res.body.channels[1].highPass.sections).toHaveLength(4);
    expect(res.body.subwoofer.inputs[1]).toMatchObject({
      route: 'ownLowPass',
      lowPass: { order: 8, frequencyHz: 100 },
    });
    expect(res.body.channels[2]).toEqual({ id: 'M+000', role: 'fullRange' });
  });

  describe('bad input gets a problem document naming the field', () => {
    it.each([
      ['missing channels → 400', {}, 400, '/body/channels'],
      [
        'bassManaged as a string → 400',
        { channels: [{ id: 'M+030', bassManaged: 'yes' }] },
        400,
        '/body/channels/0/bassManaged',
      ],
      ['lfeGainDb "NaN" → 400', { channels: [{ id: 'LFE1' }], lfeGainDb: 'NaN' }, 400, '/body/lfeGainDb'],
      [
        'subwooferCount 0 → 400',
        { channels: [{ id: 'LFE1' }], subwooferCount: 0 },
        400,
        '/body/subwooferCount',
      ],
      [
        'crossover order 9 → 400',
        { channels: [{ id: 'LFE1' }], crossover: { order: 9 } },
        400,
        '/body/crossover/order',
      ],
      [
        'a negative crossover frequency → 400',
        { channels: [{ id: 'LFE1' }], crossover: { frequencyHz: -80 } },
        400,
        '/body/crossover/frequencyHz',
      ],
      [
        'an LFE channel flagged bassManaged → 422',
        { channels: [{ id: 'LFE1', bassManaged: true }] },
        422,
        '/body/channels/0/bassManaged',
      ],
      [
        'LR order 5 → 422',
        { channels: [{ id: 'LFE1' }], crossover: { order: 5 } },
        422,
        '/body/crossover/order',
      ],
      [
        'a crossover at Nyquist → 422',
        { channels: [{ id: 'M+030', bassManaged: true, crossover: { frequencyHz: 24000 } }] },
        422,
        '/body/channels/0/crossover/frequencyHz',
      ],
    ])('%s', async (_what, body, status, pointer) => {
      expectProblem(await post(body), status, pointer);
    });

    it('129 and 10,000 channels → 400', async () => {
      for (const n of [129, 10000]) {
        const channels = Array.from({ length: n }, (_, i) => ({ id: `c${i}`, bassManaged: true }));
        expectProblem(await post({ channels }), 400, '/body/channels');
      }
    });

    it('deeply nested junk → 400', async () => {
      expectProblem(await post({ channels: [{ id: 'M+030', crossover: deeplyNested(500) }] }), 400);
    });

    it('wrong content type → 415', async () => {
      expectProblem(await postRaw('channels', 'text/csv'), 415);
    });
  });
});
