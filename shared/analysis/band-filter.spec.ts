import { expectWithin } from '../filters/test-helpers';
import { cascadeResponse } from '../dsp/response';
import { designBandPass } from './band-filter';
import { bandCentreHz, bandEdgesHz } from './iec-bands';

/**
 * Magnitude of the analogue sixth-order Butterworth band-pass (third-order prototype) after the bilinear
 * transform, written from the textbook definition |H|² = 1/(1 + ((Ω² − Ω0²)/(B·Ω))^6) with pre-warped
 * Ω = 2fs·tan(πf/fs) (e.g. Oppenheim & Schafer, Discrete-Time Signal Processing, bilinear design).
 */
function butterworthBandPassDb(f: number, lowerHz: number, upperHz: number, fs: number): number {
  const warp = (hz: number) => 2 * fs * Math.tan((Math.PI * hz) / fs);
  const w1 = warp(lowerHz);
  const w2 = warp(upperHz);
  const w = warp(f);
  const x = (w * w - w1 * w2) / ((w2 - w1) * w);
  return -10 * Math.log10(1 + Math.pow(x, 6));
}

const cascadeDb = (f: number, fs: number, centreHz: number, b: number) =>
  cascadeResponse(designBandPass(centreHz, b, fs), [f], fs).magnitudeDb[0];

describe('octave-band filters (sixth-order Butterworth band-pass, IEC 61260-1 band edges)', () => {
  it.each([44100, 48000, 96000, 192000])('matches the Butterworth band-pass formula at %i Hz', (fs) => {
    for (const x of [-4, -2, 0, 2, 3]) {
      const fm = bandCentreHz(x, 1);
      const { lowerHz, upperHz } = bandEdgesHz(fm, 1);
      for (const ratio of [0.25, 0.5, 0.7, 1, 1.3, 2, 3]) {
        const f = fm * ratio;
        if (f >= fs / 2) continue;
        const expected = butterworthBandPassDb(f, lowerHz, upperHz, fs);
        expectWithin(
          cascadeDb(f, fs, fm, 1),
          expected,
          1e-6 + 1e-9 * Math.abs(expected),
          `${fm} Hz × ${ratio}`,
        );
      }
    }
  });

  it('is −3.0103 dB at both band edges and passes the centre at 0 dB', () => {
    const fm = 1000;
    const { lowerHz, upperHz } = bandEdgesHz(fm, 1);
    expectWithin(cascadeDb(lowerHz, 48000, fm, 1), -3.0103, 1e-4, 'lower edge');
    expectWithin(cascadeDb(upperHz, 48000, fm, 1), -3.0103, 1e-4, 'upper edge');
    const centre = 2 * 48000 * Math.tan((Math.PI * Math.sqrt(lowerHz * upperHz)) / 48000);
    expectWithin(
      cascadeDb((Math.atan(centre / (2 * 48000)) * 48000) / Math.PI, 48000, fm, 1),
      0,
      1e-9,
      'centre',
    );
  });

  it('refuses a band whose upper edge reaches Nyquist', () => {
    expect(() => designBandPass(16000, 1, 44100)).toThrow(/upper band edge/);
  });
});
