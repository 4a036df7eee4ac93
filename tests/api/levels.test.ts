import { STAGE3_REFERENCE_DB, STAGE3_SPL_DB } from '../../seeds/demo-stage3-room';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { deeplyNested, expectProblem, poster, rawPoster } from './calculation-helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const post = poster(() => ctx, '/v1/levels');
const postRaw = rawPoster(() => ctx, '/v1/levels');

describe('POST /v1/levels', () => {
  // trim = target − measured (common practice); LFE +10 dB in band (ISO 21727:2016). Demo readings are invented.
  it('trims the Stage 3 demo readings to 79 dB with LFE +10 dB in band', async () => {
    const channels = Object.entries(STAGE3_SPL_DB).map(([id, measuredDb]) => ({
      id,
      measuredDb,
      ...(id === 'LFE1' ? { targetOffsetDb: 10 } : {}),
    }));
    const res = await post({
      channels,
      targetDb: STAGE3_REFERENCE_DB,
      limits: { trimMinDb: -12, trimMaxDb: 12 },
    });
    expect(res.status).toBe(200);
    expectToMatchContract('computeLevels', 200, res.body);
    for (const c of res.body.channels) {
      const offset = c.id === 'LFE1' ? 10 : 0;
      expect(c.trimDb).toBeCloseTo(79 + offset - STAGE3_SPL_DB[c.id], 10);
      expect(c.expectedDb).toBeCloseTo(79 + offset, 10);
      expect(c.clamped).toBe(false);
    }
    const anyBoost = Object.entries(STAGE3_SPL_DB).some(([l, spl]) => 79 + (l === 'LFE1' ? 10 : 0) - spl > 0);
    expect(res.body.cautions.map((c: { code: string }) => c.code)).toEqual(
      anyBoost ? ['testSignalLevel', 'levelBoost'] : ['testSignalLevel'],
    );
  });

  it('aligns to the quietest channel without a target, so every trim is a cut', async () => {
    const res = await post({
      channels: [
        { id: 'M+030', measuredDb: 80.6 },
        { id: 'M+000', measuredDb: 81.8 },
        { id: 'U-135', measuredDb: 79.1 },
      ],
    });
    expect(res.status).toBe(200);
    expectToMatchContract('computeLevels', 200, res.body);
    expect(res.body.alignedTo).toBe('quietestChannel');
    expect(res.body.targetDb).toBe(79.1);
    expect(res.body.channels.every((c: { trimDb: number }) => c.trimDb <= 0)).toBe(true);
  });

  // Inverse-square law: doubling the distance is −20·log10(2) = −6.02 dB.
  it('estimates from distance, flagged estimated, and clamps to the trim range with a warning', async () => {
    const res = await post({
      channels: [
        { id: 'near', distance: '1 m' },
        { id: 'far', distance: 8 },
      ],
      limits: { trimMinDb: -12, trimMaxDb: 12 },
    });
    expect(res.status).toBe(200);
    expectToMatchContract('computeLevels', 200, res.body);
    const [near, far] = res.body.channels;
    expect(near).toMatchObject({ estimated: true, clamped: true, trimDb: -12 });
    // Two answered levels, each within 0.005 dB of its own value (the contract's rounding).
    expect(Math.abs(near.levelDb - far.levelDb - 20 * Math.log10(8))).toBeLessThanOrEqual(0.01 + 1e-9);
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toEqual(['trimClamped', 'levelEstimated']);
  });

  describe('bad input gets a problem document naming the field', () => {
    it.each([
      ['missing channels → 400', {}, 400, '/body/channels'],
      [
        'measuredDb as a string → 400',
        { channels: [{ id: 'a', measuredDb: '80' }] },
        400,
        '/body/channels/0/measuredDb',
      ],
      [
        'measuredDb "NaN" → 400',
        { channels: [{ id: 'a', measuredDb: 'NaN' }] },
        400,
        '/body/channels/0/measuredDb',
      ],
      [
        'targetDb "Infinity" → 400',
        { channels: [{ id: 'a', measuredDb: 80 }], targetDb: 'Infinity' },
        400,
        '/body/targetDb',
      ],
      [
        'measuredDb out of range → 400',
        { channels: [{ id: 'a', measuredDb: 200 }] },
        400,
        '/body/channels/0/measuredDb',
      ],
      [
        'trimMinDb above 0 → 400',
        { channels: [{ id: 'a', measuredDb: 80 }], limits: { trimMinDb: 3 } },
        400,
        '/body/limits/trimMinDb',
      ],
      ['neither reading nor distance → 422', { channels: [{ id: 'a' }] }, 422, '/body/channels/0/measuredDb'],
      [
        'a distance with a target but no levelAt1mDb → 422',
        { channels: [{ id: 'a', distance: 3 }], targetDb: 79 },
        422,
        '/body/levelAt1mDb',
      ],
      [
        'a distance in seconds → 422',
        { channels: [{ id: 'a', distance: '3 s' }] },
        422,
        '/body/channels/0/distance',
      ],
    ])('%s', async (_what, body, status, pointer) => {
      expectProblem(await post(body), status, pointer);
    });

    it('129 and 10,000 channels → 400', async () => {
      for (const n of [129, 10000]) {
        const channels = Array.from({ length: n }, (_, i) => ({ id: `c${i}`, measuredDb: 80 }));
        expectProblem(await post({ channels }), 400, '/body/channels');
      }
    });

    it('deeply nested junk → 400', async () => {
      expectProblem(
        await post({ channels: [{ id: 'a', measuredDb: deeplyNested(500) }] }),
        400,
        '/body/channels/0/measuredDb',
      );
    });

    it('wrong content type → 415', async () => {
      expectProblem(await postRaw('<levels/>', 'application/xml'), 415);
    });
  });
});
