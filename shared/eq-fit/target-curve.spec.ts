import { expectWithin, referenceDb } from '../filters/test-helpers';
import { requireTargetCurve, targetDb } from './target-curve';

/** Audio EQ Cookbook low shelf (W3C Note 2021), written here, evaluated digitally at 384 kHz. */
function cookbookLowShelfDb(f0: number, gainDb: number, f: number, fs = 384000): number {
  const A = Math.pow(10, gainDb / 40);
  const w0 = (2 * Math.PI * f0) / fs;
  const alpha = (Math.sin(w0) / 2) * Math.sqrt((A + 1 / A) * (1 / 1 - 1) + 2);
  const c = Math.cos(w0);
  const sq = 2 * Math.sqrt(A) * alpha;
  const b = [A * (A + 1 - (A - 1) * c + sq), 2 * A * (A - 1 - (A + 1) * c), A * (A + 1 - (A - 1) * c - sq)];
  const a = [A + 1 + (A - 1) * c + sq, -2 * (A - 1 + (A + 1) * c), A + 1 + (A - 1) * c - sq];
  const [b0, b1, b2, a1, a2] = [b[0] / a[0], b[1] / a[0], b[2] / a[0], a[1] / a[0], a[2] / a[0]];
  return referenceDb([{ b0, b1, b2, a1, a2 }], f, fs);
}

describe('target curves', () => {
  it('flat is 0 dB everywhere', () => {
    for (const f of [20, 1000, 20000]) expect(targetDb({ kind: 'flat' }, f)).toBe(0);
  });

  it('tilt is a straight line in dB per octave through 0 dB at the pivot (default 1 kHz)', () => {
    const tilt = { kind: 'tilt', dbPerOctave: -1.5 } as const;
    expectWithin(targetDb(tilt, 1000), 0, 1e-12, 'pivot');
    expectWithin(targetDb(tilt, 2000), -1.5, 1e-12, 'one octave up');
    expectWithin(targetDb(tilt, 31.25), 7.5, 1e-12, 'five octaves down');
    expectWithin(targetDb({ kind: 'tilt', dbPerOctave: 1, pivotHz: 100 }, 400), 2, 1e-12, 'pivot 100 Hz');
  });

  it('lowFrequencyLift matches a cookbook low shelf (S = 1): full gain at DC, half at the corner, 0 dB far above', () => {
    const lift = { kind: 'lowFrequencyLift', gainDb: 6, cornerHz: 120 } as const;
    expectWithin(targetDb(lift, 0.001), 6, 1e-6, 'DC');
    expectWithin(targetDb(lift, 120), 3, 1e-9, 'corner');
    expectWithin(targetDb(lift, 20000), 0, 1e-3, 'far above');
    for (const f of [10, 40, 80, 120, 200, 400, 1000]) {
      // At 384 kHz the bilinear warping below 1 kHz is under 0.01 % in frequency.
      expectWithin(targetDb(lift, f), cookbookLowShelfDb(120, 6, f), 0.005, `${f} Hz`);
    }
  });

  it('points are interpolated linearly in log frequency and held beyond the ends', () => {
    const curve = {
      kind: 'points',
      points: [
        { frequencyHz: 20, gainDb: 6 },
        { frequencyHz: 80, gainDb: 2 },
        { frequencyHz: 2000, gainDb: 0 },
        { frequencyHz: 16000, gainDb: -3 },
      ],
    } as const;
    expectWithin(targetDb(curve, 10), 6, 1e-12, 'below the first point');
    expectWithin(targetDb(curve, 20), 6, 1e-12, 'first point');
    // 40 Hz is one of the two octaves from 20 to 80 Hz: half way from 6 to 2 dB.
    expectWithin(targetDb(curve, 40), 4, 1e-12, '40 Hz');
    // 4 kHz is one of the three octaves from 2 to 16 kHz: a third of the way from 0 to −3 dB.
    expectWithin(targetDb(curve, 4000), -1, 1e-12, '4 kHz');
    expectWithin(targetDb(curve, 20000), -3, 1e-12, 'above the last point');
  });

  it.each([
    [{ kind: 'points', points: [{ frequencyHz: 100, gainDb: 0 }] }, '/target/points'],
    [
      {
        kind: 'points',
        points: [
          { frequencyHz: 100, gainDb: 0 },
          { frequencyHz: 100, gainDb: 1 },
        ],
      },
      '/target/points/1/frequencyHz',
    ],
    [
      {
        kind: 'points',
        points: [
          { frequencyHz: 100, gainDb: 0 },
          { frequencyHz: 200, gainDb: 41 },
        ],
      },
      '/target/points/1/gainDb',
    ],
    [{ kind: 'tilt', dbPerOctave: 7 }, '/target/dbPerOctave'],
    [{ kind: 'tilt', dbPerOctave: 1, pivotHz: 5 }, '/target/pivotHz'],
    [{ kind: 'lowFrequencyLift', gainDb: 30, cornerHz: 100 }, '/target/gainDb'],
    [{ kind: 'lowFrequencyLift', gainDb: 3, cornerHz: 5000 }, '/target/cornerHz'],
    [{ kind: 'bass' }, '/target/kind'],
  ])('refuses %j, naming %s', (curve, field) => {
    expect(() => requireTargetCurve(curve as never)).toThrow(expect.objectContaining({ field }));
  });
});
