import { expectWithin } from '../filters/test-helpers';
import { powerAverage } from './spatial-average';

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
