import { CalculationInputError } from '../errors';
import { expectWithin } from '../filters/test-helpers';
import { logFrequencyGrid } from '../dsp/grid';
import { fractionalOctaveMean, smoothMagnitudeDb } from './smoothing';

const fftGrid = (bins: number, binHz: number) => Array.from({ length: bins }, (_, k) => k * binHz);

describe('fractional-octave smoothing (power average over f·2^(∓w/2), common practice)', () => {
  it('keeps a flat response flat at every width from 1/48 to 1/1 octave', () => {
    const freqs = fftGrid(4097, 48000 / 8192);
    const flat = freqs.map(() => 2.5);
    const out = logFrequencyGrid(20, 20000, 24, 'iec');
    for (const width of [1 / 48, 1 / 24, 1 / 12, 1 / 6, 1 / 3, 1 / 2, 1]) {
      for (const v of fractionalOctaveMean(freqs, flat, width, out))
        expectWithin(v, 2.5, 1e-12, `w=${width}`);
    }
    const db = smoothMagnitudeDb(
      out,
      out.map(() => -7.25),
      1 / 3,
    );
    db.forEach((v) => expectWithin(v, -7.25, 1e-12, 'flat dB'));
  });

  it('averages a linear function to its value at the window centre in Hz, f·(2^(w/2) + 2^(−w/2))/2', () => {
    // Mean of a + b·f over [f1, f2] is a + b·(f1 + f2)/2 (calculus); the windows are f·2^(∓w/2).
    const freqs = fftGrid(2049, 10);
    const values = freqs.map((f) => 3 + 0.01 * f);
    const width = 1 / 3;
    const out = [250, 1000, 5000];
    const got = fractionalOctaveMean(freqs, values, width, out);
    out.forEach((f, i) => {
      const centre = (f * (Math.pow(2, width / 2) + Math.pow(2, -width / 2))) / 2;
      expectWithin(got[i], 3 + 0.01 * centre, 1e-9, `at ${f} Hz`);
    });
  });

  it('spreads one spike over its window: mean = spike area / window width', () => {
    // A single bin of height P between zero bins is a triangle of area P·Δf in the piecewise-linear model.
    const binHz = 5;
    const freqs = fftGrid(4001, binHz);
    const values = freqs.map((f) => (f === 1000 ? 8 : 0));
    const width = 1 / 3;
    const [mean] = fractionalOctaveMean(freqs, values, width, [1000]);
    const windowHz = 1000 * (Math.pow(2, width / 2) - Math.pow(2, -width / 2));
    expectWithin(mean, (8 * binHz) / windowHz, 1e-12, 'spike mean');
  });

  it('interpolates linearly when the window is narrower than the input spacing', () => {
    const freqs = [100, 200];
    const values = [1, 3];
    const [v] = fractionalOctaveMean(freqs, values, 1 / 48, [150]);
    expectWithin(v, 2, 1e-3, 'interpolated');
  });

  it('lays the one-third-octave grid on the IEC 61260-1 centres 1000·10^(x/10)', () => {
    const grid = logFrequencyGrid(19, 21000, 3, 'iec');
    expect(grid).toHaveLength(31);
    grid.forEach((f, i) => expectWithin(f, 1000 * Math.pow(10, (i - 17) / 10), 1e-9 * f, `x=${i - 17}`));
  });

  it.each([
    ['too narrow', 1 / 60],
    ['too wide', 1.5],
  ])('refuses a window that is %s, naming smoothingOctaves', (_name, width) => {
    expect(() => fractionalOctaveMean([1, 2, 3], [1, 1, 1], width, [2])).toThrow(
      expect.objectContaining({ field: '/smoothingOctaves' }),
    );
  });

  it('refuses non-ascending input and output frequencies outside the input', () => {
    expect(() => fractionalOctaveMean([1, 3, 2], [1, 1, 1], 1 / 3, [2])).toThrow(CalculationInputError);
    expect(() => fractionalOctaveMean([1, 2, 3], [1, 1, 1], 1 / 3, [4])).toThrow(/outside the input range/);
    expect(() => fractionalOctaveMean([1, 2, 3], [1, 1], 1 / 3, [2])).toThrow(/as many values/);
  });
});
