import { expectWithin } from '../filters/test-helpers';
import { powerAverage, powerAverageResampled } from './spatial-average';

describe('spatial (power) average of microphone positions', () => {
  const f = [50, 100, 200];

  it('averages energy, not decibels: 0 dB and −10 dB give 10·log10(1.1/2) = −2.596 dB', () => {
    const result = powerAverage([
      { frequenciesHz: f, magnitudeDb: [0, 0, 0] },
      { frequenciesHz: f, magnitudeDb: [-10, -10, -10] },
    ]);
    result.magnitudeDb.forEach((db) => expectWithin(db, 10 * Math.log10(1.1 / 2), 1e-12, 'average'));
    expect(result.frequenciesHz).toEqual(f);
  });

  it('leaves equal responses unchanged and a single response as it is', () => {
    const one = { frequenciesHz: f, magnitudeDb: [80, 75.5, 90] };
    powerAverage([one, one, one]).magnitudeDb.forEach((db, i) =>
      expectWithin(db, one.magnitudeDb[i], 1e-12, 'same'),
    );
    powerAverage([one]).magnitudeDb.forEach((db, i) => expectWithin(db, one.magnitudeDb[i], 1e-12, 'single'));
  });

  it('is dominated by the loudest position: +20 dB and a deep null average to 20 − 3.01 dB', () => {
    const result = powerAverage([
      { frequenciesHz: [60], magnitudeDb: [20] },
      { frequenciesHz: [60], magnitudeDb: [-100] },
    ]);
    expectWithin(result.magnitudeDb[0], 20 - 10 * Math.log10(2), 1e-6, 'null filled');
  });

  it('refuses responses on different grids, naming the position and point', () => {
    expect(() =>
      powerAverage([
        { frequenciesHz: f, magnitudeDb: [0, 0, 0] },
        { frequenciesHz: [50, 101, 200], magnitudeDb: [0, 0, 0] },
      ]),
    ).toThrow(expect.objectContaining({ field: '/responses/1/frequenciesHz/1' }));
    expect(() => powerAverage([])).toThrow(/at least one/);
  });
});

describe('power average of responses on different grids', () => {
  it('brings each to a common log grid over the shared range, then averages energy', () => {
    const a = { frequenciesHz: [20, 100, 1000, 5000], magnitudeDb: [0, 0, 0, 0] };
    const b = {
      frequenciesHz: Array.from({ length: 200 }, (_, i) => 50 + i * 10),
      magnitudeDb: new Array(200).fill(-10),
    };
    const result = powerAverageResampled([a, b]);
    expect(result.frequenciesHz[0]).toBeGreaterThanOrEqual(50);
    expect(result.frequenciesHz.at(-1)).toBeLessThanOrEqual(2040);
    // 48 points per octave from 50 Hz to 2040 Hz: log2(2040/50)·48 ≈ 257 points.
    expect(Math.abs(result.frequenciesHz.length - 257)).toBeLessThanOrEqual(1);
    result.magnitudeDb.forEach((db) => expectWithin(db, 10 * Math.log10(1.1 / 2), 1e-9, 'average'));
  });

  it('averages responses whose common range ends exactly on a 1/48-octave grid point (100 Hz)', () => {
    // 100 Hz = 1000·G^(−160/48) with G = 10^(3/10) (IEC 61260-1) is a grid point; computed, it rounds to 100.00000000000001 Hz.
    const grid = Array.from({ length: 17 }, (_, i) => 20 + i * 5);
    const result = powerAverageResampled([
      { frequenciesHz: grid, magnitudeDb: grid.map(() => 0) },
      { frequenciesHz: grid, magnitudeDb: grid.map(() => -10) },
    ]);
    expect(result.frequenciesHz.at(-1)).toBeLessThanOrEqual(100);
    expect(result.frequenciesHz[0]).toBeGreaterThanOrEqual(20);
    result.magnitudeDb.forEach((db) => expectWithin(db, 10 * Math.log10(1.1 / 2), 1e-9, 'average'));
  });

  it('refuses responses without a common range', () => {
    expect(() =>
      powerAverageResampled([
        { frequenciesHz: [20, 40], magnitudeDb: [0, 0] },
        { frequenciesHz: [100, 200], magnitudeDb: [0, 0] },
      ]),
    ).toThrow(/do not share a frequency range/);
  });
});
