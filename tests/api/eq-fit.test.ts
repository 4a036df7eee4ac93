import request from 'supertest';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';
import { expectProblem, poster } from './calculation-helpers';
import { cookbookPeakingDb, referenceDb } from '../../shared/filters/test-helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const post = poster(() => ctx, '/v1/eq/fit');

const freqs = Array.from({ length: 113 }, (_, k) => 20 * Math.pow(25, k / 112));
const measured = (peaks: Array<[number, number, number]>, fs: number) =>
  freqs.map((f) => 80 + peaks.reduce((db, [f0, g, q]) => db + cookbookPeakingDb(f0, g, q, f, fs), 0));

describe('POST /v1/eq/fit', () => {
  it('flattens known resonances with cut bands whose sections are the cookbook design of the bands', async () => {
    const fs = 96000;
    const res = await post({
      sampleRateHz: fs,
      measured: {
        frequenciesHz: freqs,
        magnitudeDb: measured(
          [
            [45, 8, 6],
            [88, 6, 4],
            [300, 5, 5],
          ],
          fs,
        ),
      },
      maxBands: 4,
      fromHz: 20,
      toHz: 500,
    });
    expect(res.status).toBe(200);
    expectToMatchContract('fitEq', 200, res.body);
    expect(res.body.residualRmsDb.after).toBeLessThan(0.3);
    expect(res.body.cautions).toEqual([]);
    res.body.bands.forEach((band: { frequencyHz: number; gainDb: number; q: number }, i: number) => {
      expect(band.gainDb).toBeLessThan(0);
      expect(band.gainDb).toBeGreaterThanOrEqual(-12);
      for (const f of [band.frequencyHz, 100, 1000]) {
        expect(referenceDb([res.body.sections[i]], f, fs)).toBeCloseTo(
          cookbookPeakingDb(band.frequencyHz, band.gainDb, band.q, f, fs),
          9,
        );
      }
    });
  });

  it('adds a boost caution when it boosts', async () => {
    const res = await post({
      measured: {
        frequenciesHz: freqs,
        magnitudeDb: measured(
          [
            [60, 7, 5],
            [150, -6, 1.5],
          ],
          48000,
        ),
      },
      maxBands: 4,
      maxBoostDb: 6,
    });
    expect(res.status).toBe(200);
    expect(res.body.sampleRateHz).toBe(48000);
    expect(res.body.bands.some((b: { gainDb: number }) => b.gainDb > 0)).toBe(true);
    expect(res.body.cautions.map((c: { code: string }) => c.code)).toEqual(['eqBoost']);
  });

  it('holds the boost limit for all bands together and states the combined figure in the caution', async () => {
    const res = await post({
      measured: { frequenciesHz: freqs, magnitudeDb: measured([[140, -6, 1.2]], 48000) },
      maxBands: 8,
      maxBoostDb: 2,
      toHz: 400,
    });
    expect(res.status).toBe(200);
    expectToMatchContract('fitEq', 200, res.body);
    // The summed bands, evaluated independently (cookbook peaking sections), never exceed +2 dB.
    const total = (f: number) =>
      res.body.bands.reduce(
        (db: number, b: { frequencyHz: number; gainDb: number; q: number }) =>
          db + cookbookPeakingDb(b.frequencyHz, b.gainDb, b.q, f, 48000),
        0,
      );
    const worst = Math.max(...Array.from({ length: 400 }, (_, k) => total(20 * Math.pow(25, k / 399))));
    expect(worst).toBeLessThanOrEqual(2 + 1e-6);
    expect(res.body.combined.maxBoostDb).toBeCloseTo(worst, 1);
    expect(res.body.cautions[0].message).toMatch(
      new RegExp(
        `^Boosts: EQ \\+${res.body.combined.maxBoostDb} dB at [\\d.]+ Hz \\(EQ figures are the bands together`,
      ),
    );
  });

  it('fits several microphone positions and reports each one', async () => {
    const res = await post({
      positions: [70, 85, 100].map((dip, k) => ({
        label: `mic ${k + 1}`,
        measured: {
          frequenciesHz: freqs,
          magnitudeDb: measured(
            [
              [45, 8, 5],
              [dip, -15, 6],
            ],
            48000,
          ),
        },
      })),
      maxBands: 6,
      maxBoostDb: 6,
      toHz: 300,
    });
    expect(res.status).toBe(200);
    expectToMatchContract('fitEq', 200, res.body);
    expect(res.body.positions.map((p: { label: string }) => p.label)).toEqual(['mic 1', 'mic 2', 'mic 3']);
    expect(res.body.bands.every((b: { gainDb: number }) => b.gainDb < 0)).toBe(true);
    expect(res.body.average.frequenciesHz.length).toBeGreaterThan(100);
  });

  it('refuses a request with neither measured nor positions, naming /body/measured', async () => {
    expectProblem(await post({ maxBands: 2 }), 422, '/body/measured');
  });

  it('warns instead of boosting into a deep narrow null', async () => {
    const res = await post({
      measured: {
        frequenciesHz: freqs,
        magnitudeDb: measured(
          [
            [60, 7, 5],
            [110, -16, 10],
          ],
          48000,
        ),
      },
      maxBands: 4,
      maxBoostDb: 6,
    });
    expect(res.status).toBe(200);
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('nullNotBoosted');
  });

  it.each([
    ['no maxBands', { measured: { frequenciesHz: [20, 40], magnitudeDb: [0, 0] } }, 400, '/body/maxBands'],
    [
      'too many bands',
      { measured: { frequenciesHz: [20, 40], magnitudeDb: [0, 0] }, maxBands: 65 },
      400,
      '/body/maxBands',
    ],
    [
      'an unknown target',
      { measured: { frequenciesHz: [20, 40], magnitudeDb: [0, 0] }, maxBands: 2, target: { kind: 'smile' } },
      400,
      '/body/target',
    ],
    [
      'an extra field',
      { measured: { frequenciesHz: [20, 40], magnitudeDb: [0, 0] }, maxBands: 2, boost: true },
      400,
      '/body/boost',
    ],
    [
      'mismatched arrays',
      { measured: { frequenciesHz: [20, 40, 80], magnitudeDb: [0, 0] }, maxBands: 2 },
      422,
      '/body/measured/magnitudeDb',
    ],
    [
      'descending frequencies',
      { measured: { frequenciesHz: [40, 20], magnitudeDb: [0, 0] }, maxBands: 2 },
      422,
      '/body/measured/frequenciesHz/1',
    ],
    [
      'qRange min above max',
      {
        measured: { frequenciesHz: [20, 400], magnitudeDb: [0, 0] },
        maxBands: 2,
        qRange: { min: 5, max: 2 },
      },
      422,
      '/body/qRange/max',
    ],
    [
      'a fit band outside the measurement',
      { measured: { frequenciesHz: [20, 400], magnitudeDb: [0, 0] }, maxBands: 2, fromHz: 1000, toHz: 2000 },
      422,
      '/body/fromHz',
    ],
  ])('refuses %s', async (_name, body, status, pointer) => {
    expectProblem(await post(body), status, pointer);
  });

  it('requires a key', async () => {
    const res = await request(ctx.app)
      .post('/v1/eq/fit')
      .send({ measured: { frequenciesHz: [20, 40], magnitudeDb: [0, 0] }, maxBands: 1 });
    expect(res.status).toBe(401);
  });
});
