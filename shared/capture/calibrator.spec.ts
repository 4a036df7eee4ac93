import { seededGaussian } from '../analysis/test-signals';
import { readCalibrator } from './calibrator';

const FS = 48000;
/** A sine of `rmsDbfs` raw RMS (peak = RMS·√2) at `hz`, `seconds` long, plus optional white noise. */
function tone(hz: number, rmsDbfs: number, seconds: number, noiseRmsDbfs?: number): Float64Array {
  const peak = Math.SQRT2 * Math.pow(10, rmsDbfs / 20);
  const noise = seededGaussian(7);
  const noiseRms = noiseRmsDbfs === undefined ? 0 : Math.pow(10, noiseRmsDbfs / 20);
  return Float64Array.from(
    { length: Math.round(seconds * FS) },
    (_, i) => peak * Math.sin((2 * Math.PI * hz * i) / FS) + noiseRms * noise(),
  );
}

describe('readCalibrator', () => {
  it('turns a 94 dB SPL tone read at −30 dBFS RMS into an offset of 124 dB (within 0.05 dB)', () => {
    // A sine of amplitude A has RMS A/√2 (the definition of RMS); the band filter passes 1 kHz at unit gain.
    const reading = readCalibrator(tone(1000, -30, 4), FS, 94);
    expect(Math.abs(reading.rmsDbfs + 30)).toBeLessThan(0.05);
    expect(Math.abs(reading.splOffsetDb - 124)).toBeLessThan(0.05);
    expect(Math.abs(reading.measuredFrequencyHz - 1000)).toBeLessThan(0.5);
    expect(reading.analysedS).toBeCloseTo(3.5, 9);
    expect(reading.warnings).toEqual([]);
  });

  it('reads a 114 dB calibrator 2 % off 1 kHz and warns about broadband noise without counting it', () => {
    // White noise at −25 dBFS spread over 24 kHz leaves about −25 − 10·log10(24000/707) ≈ −40 dBFS in the
    // 1 kHz octave band (707 Hz wide): +0.04 dB on the tone, +1.2 dB on everything.
    const reading = readCalibrator(tone(1020, -20, 3, -25), FS, 114);
    expect(Math.abs(reading.measuredFrequencyHz - 1020)).toBeLessThan(0.5);
    expect(Math.abs(reading.rmsDbfs + 20)).toBeLessThan(0.1);
    expect(reading.broadbandRmsDbfs).toBeGreaterThan(reading.rmsDbfs + 0.3);
    expect(reading.splOffsetDb).toBeCloseTo(114 - reading.rmsDbfs, 12);
    expect(reading.warnings.map((w) => w.code)).toEqual(['calibratorNoise']);
  });

  it.each([
    ['a 250 Hz tone', tone(250, -20, 3), /strongest tone is at 250/],
    ['a clipped tone', tone(1000, 0, 3).map((v) => Math.max(-1, Math.min(1, v))), /clipped/],
    ['a short recording', tone(1000, -20, 1.2), /at least 1.5 s/],
    ['silence', new Float64Array(3 * FS), /silent/],
  ])('refuses %s, naming the file', (_name, samples, message) => {
    expect(() => readCalibrator(samples, FS, 94)).toThrow(
      expect.objectContaining({ field: '/file', message: expect.stringMatching(message) }),
    );
  });
});
