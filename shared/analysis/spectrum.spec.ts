import { expectWithin } from '../filters/test-helpers';
import { logFrequencyGrid } from '../dsp/grid';
import { realSpectrum, smoothedResponse } from './spectrum';

const fs = 48000;
const grid = logFrequencyGrid(20, 20000, 12, 'iec');
const impulseAt = (n: number, length: number, amplitude = 1): Float64Array => {
  const x = new Float64Array(length);
  x[n] = amplitude;
  return x;
};

describe('FFT frequency response (fft.js) with fractional-octave smoothing', () => {
  it('reads a full-scale unit impulse as 0 dB and 0° everywhere', () => {
    const response = smoothedResponse(realSpectrum(impulseAt(0, 4800), fs), 0, 1 / 12, grid);
    response.magnitudeDb.forEach((db, i) => expectWithin(db, 0, 1e-9, `${grid[i]} Hz`));
    response.phaseDeg.forEach((deg) => expectWithin(deg, 0, 1e-6, 'phase'));
  });

  it('reads an impulse of amplitude 0.5 as 20·log10(0.5) = −6.0206 dB', () => {
    const response = smoothedResponse(realSpectrum(impulseAt(10, 4800, 0.5), fs), 10, 1 / 6, grid);
    response.magnitudeDb.forEach((db) => expectWithin(db, -6.020599913279624, 1e-9, 'level'));
  });

  it('removes the arrival delay from the phase, and without removal shows −360°·f·d/fs (DFT sign e^(−jωn))', () => {
    const delayed = realSpectrum(impulseAt(700, 9600), fs);
    const aligned = smoothedResponse(delayed, 700, 1 / 48, grid);
    aligned.phaseDeg.forEach((deg) => expectWithin(deg, 0, 1e-6, 'aligned phase'));

    const raw = smoothedResponse(realSpectrum(impulseAt(2, 9600), fs), 0, 1 / 48, [100, 1000, 3000]);
    [100, 1000, 3000].forEach((f, i) => {
      const expected = (-360 * f * 2) / fs;
      expectWithin(raw.phaseDeg[i], expected, 0.05, `phase at ${f} Hz`);
    });
  });

  it('matches |H| = |cos(πf/fs)| of the two-tap average [0.5, 0.5] (−3.0103 dB at fs/4)', () => {
    const x = new Float64Array(1024);
    x[0] = 0.5;
    x[1] = 0.5;
    const freqs = [1000, 6000, 12000];
    const response = smoothedResponse(realSpectrum(x, fs), 0, 1 / 48, freqs);
    freqs.forEach((f, i) => {
      const expected = 20 * Math.log10(Math.cos((Math.PI * f) / fs));
      expectWithin(response.magnitudeDb[i], expected, 0.002, `${f} Hz`);
    });
    expectWithin(response.magnitudeDb[2], -3.0103, 0.002, 'fs/4');
  });

  it('keeps the phase inside (−180°, 180°] for every alignment, and says −300 dB only for a true zero', () => {
    // Delays of every fraction of a period put phases right at ±180° (atan2 of −0 and negative reals).
    for (const delay of [1, 2, 3, 7, 24, 48, 333]) {
      const response = smoothedResponse(realSpectrum(impulseAt(delay, 4096, -1), fs), 0, 1 / 48, grid);
      for (const deg of response.phaseDeg) expect(deg > -180 && deg <= 180).toBe(true);
    }
    // An impulse of 1e-100 has power 1e-200 in every bin (−2000 dB): tiny, not zero; all zeros is the true zero.
    const tiny = smoothedResponse(realSpectrum(impulseAt(0, 1024, 1e-100), fs), 0, 1 / 12, [1000]);
    expect(tiny.magnitudeDb[0]).toBeCloseTo(-2000, 6);
    const zero = smoothedResponse(realSpectrum(new Float64Array(1024), fs), 0, 1 / 12, [1000]);
    expect(zero.magnitudeDb[0]).toBe(-300);
  });

  it('pads to the next power of two', () => {
    expect(realSpectrum(new Float64Array(1000), fs).fftSize).toBe(1024);
    expect(realSpectrum(new Float64Array(1025), fs).re).toHaveLength(2048 / 2 + 1);
  });

  it('refuses fewer than two samples', () => {
    expect(() => realSpectrum(new Float64Array(1), fs)).toThrow(/at least 2 samples/);
  });
});
