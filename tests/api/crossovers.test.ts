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

const post = poster(() => ctx, '/v1/crossovers');
const postRaw = rawPoster(() => ctx, '/v1/crossovers');

describe('POST /v1/crossovers', () => {
  // S. H. Linkwitz, JAES 24(1), 1976; scipy.signal butter: every LR order is −6.02 dB at fc on both outputs; LR4 keeps the high-pass polarity and sums flat.
  it('LR4 at 80 Hz: two sections per output, −6.02 dB at fc, normal polarity, flat sum', async () => {
    const res = await post({
      family: 'linkwitzRiley',
      order: 4,
      frequencyHz: 80,
      response: { fromHz: 20, toHz: 320, pointsPerOctave: 2 },
    });
    expect(res.status).toBe(200);
    expectToMatchContract('designCrossover', 200, res.body);
    expect(res.body.lowPass.sections).toHaveLength(2);
    expect(res.body.highPass.sections).toHaveLength(2);
    expect(res.body.highPassPolarity).toBe('normal');
    const at80 = res.body.response.frequenciesHz.indexOf(80);
    expectAnswered(res.body.response.lowPass.magnitudeDb[at80], 20 * Math.log10(0.5), 'db');
    expectAnswered(res.body.response.highPass.magnitudeDb[at80], 20 * Math.log10(0.5), 'db');
    for (const db of res.body.response.sum.magnitudeDb) expect(Math.abs(db)).toBeLessThan(0.01);
  });

  // Butterworth of odd order: one first-order section (b2 = a2 = 0) and −3.01 dB at fc.
  it('Butterworth order 3 has a first-order section and is −3.01 dB at fc', async () => {
    const res = await post({
      family: 'butterworth',
      order: 3,
      frequencyHz: 2400,
      sampleRateHz: 96000,
      response: { frequenciesHz: [2400] },
    });
    expect(res.status).toBe(200);
    expectToMatchContract('designCrossover', 200, res.body);
    expect(res.body.lowPass.sections[0]).toMatchObject({ b2: 0, a2: 0 });
    expectAnswered(res.body.response.lowPass.magnitudeDb[0], 10 * Math.log10(0.5), 'db');
    expectAnswered(res.body.response.highPass.magnitudeDb[0], 10 * Math.log10(0.5), 'db');
  });

  it('LR2 inverts the high-pass; Butterworth 4 is warned that its sum is not flat', async () => {
    const lr2 = await post({ family: 'linkwitzRiley', order: 2, frequencyHz: 100 });
    expect(lr2.body.highPassPolarity).toBe('inverted');
    const bw4 = await post({ family: 'butterworth', order: 4, frequencyHz: 100 });
    expect(bw4.body.warnings.map((w: { code: string }) => w.code)).toEqual(['sumNotFlat']);
    expectToMatchContract('designCrossover', 200, bw4.body);
  });

  describe('bad input gets a problem document naming the field', () => {
    it.each([
      ['missing family → 400', { order: 4, frequencyHz: 80 }, 400, '/body/family'],
      ['an unknown family → 400', { family: 'bessel', order: 4, frequencyHz: 80 }, 400, '/body/family'],
      ['order 0 → 400', { family: 'butterworth', order: 0, frequencyHz: 80 }, 400, '/body/order'],
      ['order 9 → 400', { family: 'butterworth', order: 9, frequencyHz: 80 }, 400, '/body/order'],
      ['order 2.5 → 400', { family: 'butterworth', order: 2.5, frequencyHz: 80 }, 400, '/body/order'],
      ['order "4" → 400', { family: 'butterworth', order: '4', frequencyHz: 80 }, 400, '/body/order'],
      [
        'frequency "NaN" → 400',
        { family: 'butterworth', order: 4, frequencyHz: 'NaN' },
        400,
        '/body/frequencyHz',
      ],
      [
        'a negative frequency → 400',
        { family: 'butterworth', order: 4, frequencyHz: -80 },
        400,
        '/body/frequencyHz',
      ],
      ['LR order 3 → 422', { family: 'linkwitzRiley', order: 3, frequencyHz: 80 }, 422, '/body/order'],
      ['LR order 6 → 422', { family: 'linkwitzRiley', order: 6, frequencyHz: 80 }, 422, '/body/order'],
      [
        'a frequency at Nyquist → 422',
        { family: 'linkwitzRiley', order: 4, frequencyHz: 22050, sampleRateHz: 44100 },
        422,
        '/body/frequencyHz',
      ],
      [
        'a response sweep beyond Nyquist → 422',
        { family: 'linkwitzRiley', order: 4, frequencyHz: 80, response: { fromHz: 20, toHz: 40000 } },
        422,
        '/body/response/toHz',
      ],
    ])('%s', async (_what, body, status, pointer) => {
      expectProblem(await post(body), status, pointer);
    });

    it('deeply nested junk → 400', async () => {
      expectProblem(
        await post({ family: 'butterworth', order: 4, frequencyHz: 80, response: deeplyNested(500) }),
        400,
      );
    });

    it('wrong content type → 415', async () => {
      expectProblem(await postRaw('family=butterworth', 'application/x-www-form-urlencoded'), 415);
    });
  });
});
