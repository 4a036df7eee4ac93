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

const post = poster(() => ctx, '/v1/biquads');
const postRaw = rawPoster(() => ctx, '/v1/biquads');

/** |H(e^jω)| in dB of one section, evaluated here from the returned coefficients. */
function sectionDb(
  s: { b0: number; b1: number; b2: number; a1: number; a2: number },
  f: number,
  fs: number,
): number {
  const w = (2 * Math.PI * f) / fs;
  const num = [
    s.b0 + s.b1 * Math.cos(w) + s.b2 * Math.cos(2 * w),
    -s.b1 * Math.sin(w) - s.b2 * Math.sin(2 * w),
  ];
  const den = [1 + s.a1 * Math.cos(w) + s.a2 * Math.cos(2 * w), -s.a1 * Math.sin(w) - s.a2 * Math.sin(2 * w)];
  return 20 * Math.log10(Math.hypot(num[0], num[1]) / Math.hypot(den[0], den[1]));
}

describe('POST /v1/biquads', () => {
  // Audio EQ Cookbook (W3C Note 2021) properties: peaking = gainDb at f0; LPF at f0 = Q (−3.0103 dB at 1/√2);
  // shelf = half its gain at f0.
  it('returns normalised sections with the cookbook properties, and the cascade response', async () => {
    const res = await post({
      sampleRateHz: 44100,
      filters: [
        { type: 'peaking', frequencyHz: 1000, gainDb: -4.5, q: 2 },
        { type: 'lowPass', frequencyHz: 12000 },
        { type: 'lowShelf', frequencyHz: 100, gainDb: 3 },
      ],
      response: { frequenciesHz: [100, 1000, 12000] },
    });
    expect(res.status).toBe(200);
    expectToMatchContract('designBiquads', 200, res.body);
    const [peak, lowPass, shelf] = res.body.sections;
    expect(sectionDb(peak, 1000, 44100)).toBeCloseTo(-4.5, 9);
    expect(sectionDb(lowPass, 12000, 44100)).toBeCloseTo(-3.0103, 4);
    expect(sectionDb(shelf, 100, 44100)).toBeCloseTo(1.5, 9);
    const total = [100, 1000, 12000].map((f) =>
      res.body.sections.reduce((db: number, s: never) => db + sectionDb(s, f, 44100), 0),
    );
    res.body.response.magnitudeDb.forEach((db: number, i: number) => expectAnswered(db, total[i], 'db'));
    expect(res.body.response.groupDelayMs).toHaveLength(3);
    expect(res.body.cautions.map((c: { code: string }) => c.code)).toEqual(['eqBoost']);
  });

  it('sweeps the response from fromHz to toHz', async () => {
    const res = await post({
      filters: [{ type: 'notch', frequencyHz: 60, bandwidthOctaves: 0.333 }],
      response: { fromHz: 30, toHz: 120, pointsPerOctave: 4 },
    });
    expect(res.status).toBe(200);
    expectToMatchContract('designBiquads', 200, res.body);
    expect(res.body.response.frequenciesHz).toHaveLength(9);
    expect(res.body.response.frequenciesHz[4]).toBeCloseTo(60, 9);
    expect(res.body.response.magnitudeDb[4]).toBeLessThan(-100);
  });

  describe('bad input gets a problem document naming the field', () => {
    it.each([
      ['missing filters → 400', {}, 400, '/body/filters'],
      [
        'an unknown type → 400',
        { filters: [{ type: 'comb', frequencyHz: 100 }] },
        400,
        '/body/filters/0/type',
      ],
      [
        'frequency as a string → 400',
        { filters: [{ type: 'notch', frequencyHz: '60' }] },
        400,
        '/body/filters/0/frequencyHz',
      ],
      [
        'frequency "NaN" → 400',
        { filters: [{ type: 'notch', frequencyHz: 'NaN' }] },
        400,
        '/body/filters/0/frequencyHz',
      ],
      [
        'gain "Infinity" → 400',
        { filters: [{ type: 'peaking', frequencyHz: 60, gainDb: 'Infinity' }] },
        400,
        '/body/filters/0/gainDb',
      ],
      [
        'a negative frequency → 400',
        { filters: [{ type: 'notch', frequencyHz: -60 }] },
        400,
        '/body/filters/0/frequencyHz',
      ],
      [
        'Q out of range → 400',
        { filters: [{ type: 'notch', frequencyHz: 60, q: 0 }] },
        400,
        '/body/filters/0/q',
      ],
      [
        '65 filters → 400',
        { filters: new Array(65).fill({ type: 'notch', frequencyHz: 60 }) },
        400,
        '/body/filters',
      ],
      [
        'a frequency at Nyquist → 422',
        { sampleRateHz: 48000, filters: [{ type: 'lowPass', frequencyHz: 24000 }] },
        422,
        '/body/filters/0/frequencyHz',
      ],
      [
        'a frequency above Nyquist → 422',
        {
          sampleRateHz: 44100,
          filters: [
            { type: 'notch', frequencyHz: 60 },
            { type: 'highShelf', frequencyHz: 30000, gainDb: -2 },
          ],
        },
        422,
        '/body/filters/1/frequencyHz',
      ],
      [
        'peaking without gain → 422',
        { filters: [{ type: 'peaking', frequencyHz: 60 }] },
        422,
        '/body/filters/0/gainDb',
      ],
      [
        'both q and bandwidth → 422',
        { filters: [{ type: 'notch', frequencyHz: 60, q: 4, bandwidthOctaves: 1 }] },
        422,
        '/body/filters/0/bandwidthOctaves',
      ],
      [
        'a response above Nyquist → 422',
        { filters: [{ type: 'notch', frequencyHz: 60 }], response: { fromHz: 20, toHz: 30000 } },
        422,
        '/body/response/toHz',
      ],
    ])('%s', async (_what, body, status, pointer) => {
      expectProblem(await post(body), status, pointer);
    });

    it('deeply nested junk → 400', async () => {
      expectProblem(
        await post({ filters: [{ type: 'notch', frequencyHz: 60, q: deeplyNested(500) }] }),
        400,
        '/body/filters/0/q',
      );
    });

    it('wrong content type → 415', async () => {
      expectProblem(await postRaw('type=notch', 'text/plain'), 415);
    });
  });
});
