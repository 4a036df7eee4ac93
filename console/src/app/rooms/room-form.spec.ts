import { formPathOf, layoutLabel, limitsOf, mm } from './room-form';

describe('room form helpers', () => {
  it('maps API pointers to form paths', () => {
    expect(formPathOf('/body/loudspeakers/3/x')).toEqual(['loudspeakers', '3', 'x']);
    expect(formPathOf('/body/name')).toEqual(['name']);
    expect(formPathOf('/body')).toBeNull();
    expect(formPathOf('/query/limit')).toBeNull();
  });

  it('labels layouts by BS.2051 name, trade names and system', () => {
    expect(layoutLabel({ name: '4+7+0', aliases: ['7.1.4'], system: 'J' })).toBe('4+7+0 · 7.1.4 (system J)');
    expect(layoutLabel({ name: '4+9+0', aliases: [], system: null })).toBe('4+9+0');
  });

  it('keeps only the limits that were filled in, as numbers', () => {
    expect(
      limitsOf({
        delayMaxMs: 75,
        trimMinDb: -12,
        trimMaxDb: null,
        eqBandsPerChannel: 8,
        eqMaxBoostDb: null,
        eqMaxCutDb: null,
      }),
    ).toEqual({ delayMaxMs: 75, trimMinDb: -12, eqBandsPerChannel: 8 });
    expect(
      limitsOf({
        delayMaxMs: null,
        trimMinDb: null,
        trimMaxDb: null,
        eqBandsPerChannel: null,
        eqMaxBoostDb: null,
        eqMaxCutDb: null,
      }),
    ).toBeUndefined();
    expect(mm(1.23456)).toBe(1.235);
  });
});
