import fc from 'fast-check';
import { analyseGeometry, type GeometryInput } from './analyse-geometry';
import { angleBetweenDeg, insideAzimuthRange, wrapDeg } from './angles';
import { fromListenerPolar, toListenerPolar } from './coordinates';

const listener = { x: 3, y: 4, z: 1.2 };

describe('toListenerPolar — hand-computed cases', () => {
  // Hand computation: 2 m ahead (−y) and 2 m to the left (−x) → atan(2/2) = 45° left, √8 = 2.828427 m.
  it('2 m ahead and 2 m left at ear height → azimuth +45°, distance 2.828 m, elevation 0°', () => {
    const p = toListenerPolar(listener, { x: 1, y: 2, z: 1.2 });
    expect(p.azimuthDeg).toBeCloseTo(45, 10);
    expect(p.distanceM).toBeCloseTo(2 * Math.SQRT2, 10);
    expect(p.elevationDeg).toBeCloseTo(0, 10);
  });

  // Hand computation: straight right is −90° in the positive-left convention (BS.2051).
  it('3 m to the right → azimuth −90°', () => {
    const p = toListenerPolar(listener, { x: 6, y: 4, z: 1.2 });
    expect(p.azimuthDeg).toBeCloseTo(-90, 10);
    expect(p.distanceM).toBeCloseTo(3, 10);
  });

  it('straight behind → azimuth 180°, behind-left at equal offsets → +135°', () => {
    expect(toListenerPolar(listener, { x: 3, y: 6, z: 1.2 }).azimuthDeg).toBeCloseTo(180, 10);
    expect(toListenerPolar(listener, { x: 2, y: 5, z: 1.2 }).azimuthDeg).toBeCloseTo(135, 10);
    expect(toListenerPolar(listener, { x: 4, y: 5, z: 1.2 }).azimuthDeg).toBeCloseTo(-135, 10);
  });

  // 3-4-5 triangle: 4 m ahead and 3 m up → 5 m, elevation atan(3/4) = 36.8699°.
  it('4 m ahead and 3 m above → 5 m at elevation 36.8699°', () => {
    const p = toListenerPolar({ x: 3, y: 5, z: 0 }, { x: 3, y: 1, z: 3 });
    expect(p.distanceM).toBeCloseTo(5, 10);
    expect(p.elevationDeg).toBeCloseTo(36.86989765, 7);
    expect(p.azimuthDeg).toBeCloseTo(0, 10);
  });

  it('straight overhead → elevation 90°', () => {
    expect(toListenerPolar(listener, { x: 3, y: 4, z: 3 }).elevationDeg).toBeCloseTo(90, 10);
  });

  it('fromListenerPolar inverts toListenerPolar (property, 500 random points)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.2, max: 20, noNaN: true }),
        fc.double({ min: -179.9, max: 180, noNaN: true }),
        fc.double({ min: -89, max: 89, noNaN: true }),
        (distanceM, azimuthDeg, elevationDeg) => {
          const back = toListenerPolar(
            listener,
            fromListenerPolar(listener, { distanceM, azimuthDeg, elevationDeg }),
          );
          expect(back.distanceM).toBeCloseTo(distanceM, 9);
          expect(Math.abs(wrapDeg(back.azimuthDeg - azimuthDeg))).toBeLessThan(1e-7);
          expect(back.elevationDeg).toBeCloseTo(elevationDeg, 7);
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe('angle helpers', () => {
  it('wraps into (−180, 180]', () => {
    expect(wrapDeg(190)).toBe(-170);
    expect(wrapDeg(-180)).toBe(180);
    expect(wrapDeg(540)).toBe(180);
    expect(wrapDeg(-45)).toBe(-45);
  });

  it('azimuth ranges run anticlockwise and work across ±180°', () => {
    expect(insideAzimuthRange(-179, [180, 180], 2)).toBe(true);
    expect(insideAzimuthRange(177, [180, 180], 2)).toBe(false);
    expect(insideAzimuthRange(112, [85, 110], 0)).toBe(false);
    expect(insideAzimuthRange(111.5, [85, 110], 2)).toBe(true);
    expect(insideAzimuthRange(-130, [-150, -120], 0)).toBe(true);
    expect(insideAzimuthRange(130, [-150, -120], 0)).toBe(false);
  });

  // Spherical geometry: two points at the same azimuth differ by their elevation difference;
  // at elevation 0, by their azimuth difference; (0°,0°)→(90°,0°) is a right angle.
  it('great-circle angle', () => {
    expect(
      angleBetweenDeg({ azimuthDeg: 45, elevationDeg: 30 }, { azimuthDeg: 45, elevationDeg: 50 }),
    ).toBeCloseTo(20, 10);
    expect(
      angleBetweenDeg({ azimuthDeg: 170, elevationDeg: 0 }, { azimuthDeg: -170, elevationDeg: 0 }),
    ).toBeCloseTo(20, 10);
    expect(
      angleBetweenDeg({ azimuthDeg: 0, elevationDeg: 90 }, { azimuthDeg: 0, elevationDeg: 0 }),
    ).toBeCloseTo(90, 10);
  });
});

/** A 7.1.4 room with every loudspeaker 2.5 m from the listener at its nominal direction. */
function nominalRoom(
  overrides: Record<string, { azimuthDeg: number; elevationDeg?: number }> = {},
): GeometryInput {
  const nominal: Record<string, [number, number]> = {
    'M+030': [30, 0],
    'M-030': [-30, 0],
    'M+000': [0, 0],
    'M+090': [90, 0],
    'M-090': [-90, 0],
    'M+135': [135, 0],
    'M-135': [-135, 0],
    'U+045': [45, 40],
    'U-045': [-45, 40],
    'U+135': [135, 40],
    'U-135': [-135, 40],
  };
  const center = { x: 3.05, y: 3.3, z: 1.2 };
  return {
    room: { widthM: 6.1, lengthM: 7.4, heightM: 3.05 },
    listener: center,
    layout: '7.1.4',
    angleToleranceDeg: 0,
    speakers: Object.entries(nominal).map(([id, [az, el]]) => {
      const o = overrides[id];
      const distanceM = id.startsWith('U') ? 2.2 : 2.5;
      return {
        id,
        ...fromListenerPolar(center, {
          distanceM,
          azimuthDeg: o?.azimuthDeg ?? az,
          elevationDeg: o?.elevationDeg ?? el,
        }),
      };
    }),
  };
}

describe('analyseGeometry — BS.2051 rules', () => {
  it('a nominal 7.1.4 room passes every check; only the LFE is reported missing', () => {
    const result = analyseGeometry(nominalRoom());
    expect(result.speakers.every((s) => s.withinTolerance === true)).toBe(true);
    expect(result.warnings.map((w) => w.code)).toEqual(['missingChannel']);
    expect(result.warnings[0].channel).toBe('LFE1');
    const u135 = result.speakers.find((s) => s.id === 'U+135')!;
    expect(u135.deviation!.azimuthDeg).toBeCloseTo(0, 9);
    expect(u135.deviation!.elevationDeg).toBeCloseTo(10, 9);
  });

  // BS.2051-3 system J row U+135 (the standard's family of ranges): 100..150° azimuth. A top-back
  // loudspeaker 6° off nominal (the demo room's) stays inside its range, and the deviation says so.
  it('a top-back loudspeaker 6° off nominal reports a 6° deviation and stays within range', () => {
    const result = analyseGeometry(nominalRoom({ 'U-135': { azimuthDeg: -129, elevationDeg: 40 } }));
    const speaker = result.speakers.find((s) => s.id === 'U-135')!;
    expect(speaker.deviation!.azimuthDeg).toBeCloseTo(6, 9);
    expect(speaker.withinTolerance).toBe(true);
  });

  // System J row M+090: 85..110° (ITU-R BS.2051-3). 112° is outside with no allowance, inside with 2°.
  it('a side surround at 112° is out of range strictly, within the 2° allowance', () => {
    const strict = analyseGeometry(nominalRoom({ 'M+090': { azimuthDeg: 112 } }));
    expect(strict.speakers.find((s) => s.id === 'M+090')!.withinTolerance).toBe(false);
    expect(strict.warnings).toEqual(
      expect.arrayContaining([expect.objectContaining({ code: 'azimuthOutOfRange', channel: 'M+090' })]),
    );
    const lenient = analyseGeometry({
      ...nominalRoom({ 'M+090': { azimuthDeg: 111.5 } }),
      angleToleranceDeg: 2,
    });
    expect(lenient.speakers.find((s) => s.id === 'M+090')!.withinTolerance).toBe(true);
  });

  // Rule (ITU-R BS.2051-3): pairs beyond ±45° symmetric within 10°. M+135 at 135°, M−135 at −122°:
  // each inside 120..150°, but 13° from mirror symmetry.
  it('flags an asymmetric rear pair even when both are inside their ranges', () => {
    const result = analyseGeometry(nominalRoom({ 'M-135': { azimuthDeg: -122 } }));
    expect(result.speakers.find((s) => s.id === 'M-135')!.withinTolerance).toBe(true);
    const warning = result.warnings.find((w) => w.code === 'asymmetricPair');
    expect(warning?.channel).toBe('M+135');
    expect(warning?.message).toMatch(/13\.0°/);
    const within = analyseGeometry(nominalRoom({ 'M-135': { azimuthDeg: -126 } }));
    expect(within.warnings.some((w) => w.code === 'asymmetricPair')).toBe(false);
  });

  // Rule (ITU-R BS.2051-3): in systems G, I and J the two middle-layer surrounds on one side are 30..60° apart.
  // M+090 at 105° and M+135 at 125° are both inside their ranges but only 20° apart.
  it('flags side and rear surrounds closer than 30° on one side', () => {
    const result = analyseGeometry(
      nominalRoom({
        'M+090': { azimuthDeg: 105 },
        'M+135': { azimuthDeg: 125 },
        'M-090': { azimuthDeg: -105 },
        'M-135': { azimuthDeg: -150 },
      }),
    );
    const spacing = result.warnings.filter((w) => w.code === 'surroundSpacing');
    expect(spacing).toHaveLength(1);
    expect(spacing[0].channel).toBe('M+135');
    expect(spacing[0].message).toMatch(/20\.0°/);
  });

  it('the spacing rule is not applied to system D (5.1.4)', () => {
    const input = nominalRoom();
    const result = analyseGeometry({ ...input, layout: '5.1.4' });
    expect(result.warnings.some((w) => w.code === 'surroundSpacing')).toBe(false);
    expect(result.warnings.filter((w) => w.code === 'unknownChannel').map((w) => w.channel)).toEqual(
      expect.arrayContaining(['M+090', 'M+135', 'U+045']),
    );
  });

  it('without a layout only distances and angles are returned', () => {
    const { layout: _layout, ...input } = nominalRoom();
    const result = analyseGeometry(input);
    expect(result.layout).toBeNull();
    expect(result.warnings).toEqual([]);
    expect(result.speakers.every((s) => s.withinTolerance === null && s.nominal === null)).toBe(true);
    expect(result.speakers[0].distanceM).toBeCloseTo(2.5, 9);
  });
});

describe('analyseGeometry — bad input names the field', () => {
  const base = nominalRoom();

  it('a loudspeaker outside the room', () => {
    const speakers = base.speakers.map((s, i) => (i === 1 ? { ...s, y: -0.4 } : s));
    expect(() => analyseGeometry({ ...base, speakers })).toThrow(
      expect.objectContaining({
        name: 'CalculationInputError',
        field: '/speakers/1/y',
        message: expect.stringMatching(/outside the room/),
      }),
    );
  });

  it('a listener above the ceiling', () => {
    expect(() => analyseGeometry({ ...base, listener: { x: 3, y: 3, z: 3.5 } })).toThrow(
      expect.objectContaining({ field: '/listener/z' }),
    );
  });

  it('a repeated channel id', () => {
    const speakers = [...base.speakers.slice(0, 3), { ...base.speakers[0] }];
    expect(() => analyseGeometry({ ...base, speakers })).toThrow(
      expect.objectContaining({ field: '/speakers/3/id', message: expect.stringMatching(/appears twice/) }),
    );
  });

  it('an unknown layout', () => {
    expect(() => analyseGeometry({ ...base, layout: '13.1' })).toThrow(
      expect.objectContaining({ field: '/layout' }),
    );
  });

  it('a room dimension of zero and a loudspeaker on the listener', () => {
    expect(() => analyseGeometry({ ...base, room: { ...base.room, heightM: 0 } })).toThrow(
      expect.objectContaining({ field: '/room/heightM' }),
    );
    const speakers = [{ id: 'M+000', ...base.listener }];
    expect(() => analyseGeometry({ ...base, speakers })).toThrow(
      expect.objectContaining({ field: '/speakers/0' }),
    );
  });

  it('a negative allowance', () => {
    expect(() => analyseGeometry({ ...base, angleToleranceDeg: -1 })).toThrow(
      expect.objectContaining({ field: '/angleToleranceDeg' }),
    );
  });
});
