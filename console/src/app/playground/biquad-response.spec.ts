import Fili from 'fili';
import {
  MAGNITUDE_FLOOR_DB,
  type Section,
  cascadeAt,
  isSection,
  logFrequencies,
  magnitudeDb,
  phaseDeg,
} from './biquad-response';

// Independent reference: the fili library (its own coefficient design and its own response evaluation),
// plus closed-form facts: a 2nd-order Butterworth low-pass is −3.0103 dB at its corner (20·log10(1/√2)),
// and the cookbook peaking filter has exactly its gain at its centre (RBJ Audio EQ Cookbook).
interface FiliCoefficients {
  a: number[];
  b: number[];
}

function toSection(c: FiliCoefficients): Section {
  // fili stores a = [a1, a2] and b = [b0, b1, b2], already divided by a0.
  return { b0: c.b[0], b1: c.b[1], b2: c.b[2], a1: c.a[0], a2: c.a[1] };
}

const fs = 48000;

describe('cascadeAt', () => {
  it('matches fili’s response for Butterworth low- and high-pass cascades within 1e-6 dB', () => {
    const calculator = new Fili.CalcCascades();
    for (const kind of ['lowpass', 'highpass'] as const) {
      // fili's `order` counts biquads, so 1, 2, 3 are 2nd-, 4th- and 6th-order filters.
      for (const order of [1, 2, 3]) {
        const coefficients = calculator[kind]({
          order,
          characteristic: 'butterworth',
          Fs: fs,
          Fc: 80,
        }) as FiliCoefficients[];
        const filter = new Fili.IirFilter(coefficients);
        const sections = coefficients.map(toSection);
        for (const f of [20, 55, 80, 120, 1000, 15000]) {
          const reference = filter.responsePoint({ Fs: fs, Fr: f }) as { dBmagnitude: number };
          expect(reference.dBmagnitude).toBeGreaterThan(MAGNITUDE_FLOOR_DB);
          expect(magnitudeDb(cascadeAt(sections, f, fs))).toBeCloseTo(reference.dBmagnitude, 6);
        }
      }
    }
  });

  it('gives −3.0103 dB at the corner of a 2nd-order Butterworth low-pass (Q = 1/√2)', () => {
    const w0 = (2 * Math.PI * 1000) / fs;
    const alpha = Math.sin(w0) / (2 * Math.SQRT1_2);
    const a0 = 1 + alpha;
    const section: Section = {
      b0: (1 - Math.cos(w0)) / 2 / a0,
      b1: (1 - Math.cos(w0)) / a0,
      b2: (1 - Math.cos(w0)) / 2 / a0,
      a1: (-2 * Math.cos(w0)) / a0,
      a2: (1 - alpha) / a0,
    };
    expect(magnitudeDb(cascadeAt([section], 1000, fs))).toBeCloseTo(20 * Math.log10(Math.SQRT1_2), 9);
    expect(magnitudeDb(cascadeAt([section], 0, fs))).toBeCloseTo(0, 12);
    expect(phaseDeg(cascadeAt([section], 1000, fs))).toBeCloseTo(-90, 9);
  });

  it('gives a cookbook peaking filter its gain at the centre frequency', () => {
    const gainDb = -6;
    const A = 10 ** (gainDb / 40);
    const w0 = (2 * Math.PI * 63) / fs;
    const alpha = Math.sin(w0) / (2 * 4.3);
    const a0 = 1 + alpha / A;
    const section: Section = {
      b0: (1 + alpha * A) / a0,
      b1: (-2 * Math.cos(w0)) / a0,
      b2: (1 - alpha * A) / a0,
      a1: (-2 * Math.cos(w0)) / a0,
      a2: (1 - alpha / A) / a0,
    };
    expect(magnitudeDb(cascadeAt([section], 63, fs))).toBeCloseTo(gainDb, 9);
  });

  it('is 0 dB and 0° for an empty cascade and floors a perfect zero', () => {
    expect(cascadeAt([], 1000, fs)).toEqual([1, 0]);
    expect(magnitudeDb([0, 0])).toBe(MAGNITUDE_FLOOR_DB);
    expect(phaseDeg([-1, -0])).toBe(180);
  });
});

describe('logFrequencies', () => {
  it('spaces points evenly per octave and ends exactly at the upper frequency', () => {
    const grid = logFrequencies(20, 20000, 3);
    expect(grid[0]).toBe(20);
    expect(grid[3]).toBeCloseTo(40, 12);
    expect(grid[grid.length - 1]).toBe(20000);
    expect(grid.length).toBe(Math.ceil(Math.log2(1000) * 3) + 1);
    expect(logFrequencies(100, 50)).toEqual([]);
  });
});

describe('isSection', () => {
  it('requires five finite numbers', () => {
    expect(isSection({ b0: 1, b1: 0, b2: 0, a1: 0, a2: 0, type: 'peaking' })).toBe(true);
    expect(isSection({ b0: 1, b1: 0, b2: 0, a1: 0 })).toBe(false);
    expect(isSection({ b0: 1, b1: 0, b2: 0, a1: 0, a2: Number.NaN })).toBe(false);
    expect(isSection(null)).toBe(false);
  });
});
