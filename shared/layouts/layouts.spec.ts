import { CalculationInputError } from '../errors';
import { findLayout, LAYOUTS, requireLayout } from './index';

function channel(layoutKey: string, label: string) {
  const found = findLayout(layoutKey)?.channels.find((c) => c.label === label);
  if (!found) throw new Error(`${layoutKey} has no ${label}`);
  return found;
}

describe('BS.2051-3 layout tables', () => {
  // Source: ITU-R BS.2051-3, system J (Table 11, number from memory).
  it('system J, row M+090: side surround permitted at +85..+110° azimuth', () => {
    expect(channel('J', 'M+090').azimuthRangesDeg).toEqual([[85, 110]]);
    expect(channel('J', 'M-090').azimuthRangesDeg).toEqual([[-110, -85]]);
  });

  // Source: ITU-R BS.2051-3, system J: U±045 at ±30..±45° azimuth, +30..+55° elevation.
  it('system J, rows U+045/U-045: upper fronts at 30..45° azimuth and 30..55° elevation', () => {
    expect(channel('J', 'U+045')).toMatchObject({
      azimuthDeg: 45,
      elevationDeg: 30,
      elevationRangeDeg: [30, 55],
    });
    expect(channel('J', 'U+045').azimuthRangesDeg).toEqual([[30, 45]]);
    expect(channel('J', 'U-045').azimuthRangesDeg).toEqual([[-45, -30]]);
  });

  // Source: ITU-R BS.775-3, Figure 1 table (LS/RS at 100..120°), which system B (Table 3, from memory) repeats.
  it('system B, rows M+110/M-110: surrounds at 100..120° as in BS.775-3', () => {
    expect(channel('5.1', 'M+110').azimuthRangesDeg).toEqual([[100, 120]]);
    expect(channel('5.1', 'M-110').azimuthRangesDeg).toEqual([[-120, -100]]);
    expect(channel('5.1', 'M+000')).toMatchObject({ azimuthDeg: 0, elevationDeg: 0 });
  });

  // Source: EBU ADM renderer CHANGELOG 1.2.0 ("M+-SC ... between 5 and 25 degrees, or 35 and 60 degrees").
  it('system G, rows M+SC/M-SC: two permitted azimuth intervals', () => {
    expect(channel('G', 'M+SC').azimuthRangesDeg).toEqual([
      [5, 25],
      [35, 60],
    ]);
    expect(channel('G', 'M-SC').azimuthRangesDeg).toEqual([
      [-25, -5],
      [-60, -35],
    ]);
  });

  // From memory (trade fact): 22.2 has 22 full-range loudspeakers in three layers plus two LFE.
  it('system H (22.2) has 24 channels: 9 upper, 10 middle, 3 bottom, 2 LFE', () => {
    const h = findLayout('22.2')!;
    const count = (layer: string) => h.channels.filter((c) => c.layer === layer).length;
    expect(h.system).toBe('H');
    expect(count('upper') + count('top') + count('upperHigh')).toBe(9);
    expect(count('middle')).toBe(10);
    expect(count('bottom')).toBe(3);
    expect(count('lfe')).toBe(2);
  });

  // Source: ITU-R BS.2051-3 (the system names and the counting rule Upper+Middle+Bottom, LFE not counted).
  it.each(LAYOUTS.map((l) => [l.id, l] as const))(
    '%s: the name counts upper+middle+bottom loudspeakers',
    (_id, layout) => {
      const [upper, middle, bottom] = layout.name.split('+').map(Number);
      const layers = layout.channels.map((c) => c.layer);
      expect(layers.filter((l) => l === 'upper' || l === 'upperHigh' || l === 'top').length).toBe(upper);
      expect(layers.filter((l) => l === 'middle').length).toBe(middle);
      expect(layers.filter((l) => l === 'bottom').length).toBe(bottom);
    },
  );

  it.each(LAYOUTS.map((l) => [l.id, l] as const))(
    '%s: every nominal position lies inside its own permitted ranges, every left row has a mirrored right row',
    (_id, layout) => {
      for (const c of layout.channels) {
        if (c.azimuthDeg === null || !c.azimuthRangesDeg || !c.elevationRangeDeg || c.elevationDeg === null)
          continue;
        if (c.label.endsWith('SC')) continue;
        expect(c.azimuthRangesDeg.some(([a, b]) => c.azimuthDeg! >= a && c.azimuthDeg! <= b)).toBe(true);
        expect(c.elevationDeg).toBeGreaterThanOrEqual(c.elevationRangeDeg[0]);
        expect(c.elevationDeg).toBeLessThanOrEqual(c.elevationRangeDeg[1]);
        if (c.label.includes('+') && c.azimuthDeg !== 0 && c.azimuthDeg !== 180 && !c.isLfe) {
          const mirror = layout.channels.find((m) => m.label === c.label.replace('+', '-'));
          expect(mirror).toBeDefined();
          expect(mirror!.azimuthDeg).toBe(-c.azimuthDeg);
          expect(mirror!.elevationRangeDeg).toEqual(c.elevationRangeDeg);
          expect(mirror!.azimuthRangesDeg!.map(([a, b]) => [-b, -a])).toEqual(c.azimuthRangesDeg);
        }
      }
    },
  );

  // Source: ITU-R BS.2051-3 — the 30°..60° side/rear surround rule applies in systems G, I and J only.
  it('the side-surround spacing rule is set for G, I and J and nowhere else', () => {
    const withRule = LAYOUTS.filter((l) => l.rules.sideSurroundSpacingDeg).map((l) => l.system);
    expect(withRule).toEqual(['G', 'I', 'J']);
    expect(findLayout('J')!.rules.sideSurroundSpacingDeg).toEqual([30, 60]);
  });
});

describe('trade aliases and 9.1.6', () => {
  // Trade names (common practice): 5.1 = B, 5.1.2 = C, 5.1.4 = D, 7.1 = I, 7.1.4 = J, 22.2 = H.
  it.each([
    ['5.1', 'B'],
    ['5.1.2', 'C'],
    ['5.1.4', 'D'],
    ['7.1', 'I'],
    ['7.1.4', 'J'],
    ['22.2', 'H'],
    ['4+7+0', 'J'],
    ['bs2051-j', 'J'],
    ['j', 'J'],
  ])('%s selects system %s', (alias, system) => {
    expect(findLayout(alias)?.system).toBe(system);
  });

  // Source: AOM IAMF specification, expanded_loudspeaker_layout 8 "9.1.6ch": 16 channels, a subset of system H
  // (FL/FR/FC/LFE1/BL/BR/FLc/FRc/SiL/SiR/TpFL/TpFR/TpBL/TpBR/TpSiL/TpSiR).
  it('9.1.6 is the 16-channel IAMF subset of system H with system H ranges', () => {
    const layout = findLayout('9.1.6')!;
    expect(layout.system).toBeNull();
    expect(layout.channels).toHaveLength(16);
    const h = findLayout('H')!;
    for (const c of layout.channels) {
      const row = h.channels.find((r) => r.label === c.label);
      expect(row).toBeDefined();
      expect(c.azimuthRangesDeg).toEqual(row!.azimuthRangesDeg);
      expect(c.elevationRangeDeg).toEqual(row!.elevationRangeDeg);
    }
    expect(layout.channels.filter((c) => c.layer === 'upper')).toHaveLength(6);
    expect(layout.channels.map((c) => c.label)).toEqual(
      expect.arrayContaining(['M+060', 'M-060', 'M+030', 'M-030', 'M+090', 'U+090', 'U-135']),
    );
  });

  it('an unknown layout is refused with the field named', () => {
    expect(findLayout('11.1.8')).toBeUndefined();
    expect(() => requireLayout('11.1.8', '/room/layout')).toThrow(
      expect.objectContaining({
        name: 'CalculationInputError',
        field: '/room/layout',
        message: expect.stringMatching(/11\.1\.8/),
      }),
    );
    expect(() => requireLayout('11.1.8')).toThrow(CalculationInputError);
  });

  it('ids are unique and every alias points to exactly one layout', () => {
    const keys = LAYOUTS.flatMap((l) => [l.id, l.name, ...l.aliases].map((k) => k.toLowerCase()));
    expect(new Set(keys).size).toBe(keys.length);
  });
});
