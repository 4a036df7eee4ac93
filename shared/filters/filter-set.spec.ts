import { designFilterSet } from './filter-set';
import { catchInputError, expectWithin, referenceDb } from './test-helpers';

describe('designFilterSet', () => {
  it('designs one section per filter and the cascade response on the grid', () => {
    const set = designFilterSet({
      filters: [
        { type: 'peaking', frequencyHz: 56, gainDb: -6, q: 4.5 },
        { type: 'highShelf', frequencyHz: 8000, gainDb: -1.5 },
      ],
      response: { frequenciesHz: [56, 8000] },
    });
    expect(set.sampleRateHz).toBe(48000);
    expect(set.sections.map((s) => s.type)).toEqual(['peaking', 'highShelf']);
    set.response!.frequenciesHz.forEach((f, i) =>
      expectWithin(set.response!.magnitudeDb[i], referenceDb(set.sections, f, 48000), 1e-9, `${f} Hz`),
    );
    expect(set.warnings).toEqual([]);
    expect(set.cautions).toEqual([]);
  });

  it('warns about limits the processor cannot meet but still designs every filter', () => {
    const set = designFilterSet({
      filters: [
        { type: 'peaking', frequencyHz: 40, gainDb: 6 },
        { type: 'peaking', frequencyHz: 400, gainDb: -15 },
        { type: 'notch', frequencyHz: 60 },
      ],
      limits: { eqBandsPerChannel: 2, eqMaxBoostDb: 3, eqMaxCutDb: 12 },
    });
    expect(set.sections).toHaveLength(3);
    expect(set.warnings.map((w) => w.code)).toEqual([
      'bandLimitExceeded',
      'boostLimitExceeded',
      'cutLimitExceeded',
    ]);
    expect(set.cautions.map((c) => c.code)).toEqual(['eqBoost']);
    // The notch at 60 Hz and the cut at 400 Hz pull the wide +6 dB peak at 40 Hz down and lower in
    // frequency: the designed response boosts less than the largest band's 6 dB, below 40 Hz.
    const [, db, hz] = /EQ \+([\d.]+) dB at ([\d.]+) Hz/.exec(set.cautions[0].message) ?? [];
    expect(Number(db)).toBeGreaterThan(0);
    expect(Number(db)).toBeLessThan(6);
    expect(Number(hz)).toBeLessThan(40);
  });

  it.each([
    [
      {
        filters: [
          { type: 'notch', frequencyHz: 50 },
          { type: 'lowPass', frequencyHz: 24000 },
        ],
      },
      '/filters/1/frequencyHz',
    ],
    [
      { filters: [{ type: 'notch', frequencyHz: 50 }], response: { fromHz: 10, toHz: 25000 } },
      '/response/toHz',
    ],
    [
      { filters: [{ type: 'notch', frequencyHz: 50 }], limits: { eqBandsPerChannel: -1 } },
      '/limits/eqBandsPerChannel',
    ],
  ])('refuses %j, naming %s', (input, field) => {
    expect(catchInputError(() => designFilterSet(input as never)).field).toBe(field);
  });
});
