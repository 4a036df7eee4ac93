import { expectWithin } from '../filters/test-helpers';
import { detectArrival, signalLevel } from './level';
import { seededGaussian } from './test-signals';

describe('arrival (ISO 3382-1 Annex A onset: first rise within 20 dB of the peak [from memory])', () => {
  it('finds an impulse at sample 700 at 48 kHz at 700/48000 s = 14.583 ms', () => {
    const x = new Float64Array(4800);
    x[700] = 0.8;
    const arrival = detectArrival(x, 48000, signalLevel(x));
    expect(arrival.arrivalSample).toBe(700);
    expectWithin(arrival.arrivalMs, 14.583333, 1e-6, 'arrivalMs');
    expectWithin(arrival.peakMs, 14.583333, 1e-6, 'peakMs');
  });

  it('puts the onset at the first sample within 20 dB of the peak, before the peak itself', () => {
    const x = new Float64Array(2000);
    x[690] = 0.05; // −26 dB re the peak: below the threshold
    x[695] = 0.2; // −14 dB: the onset
    x[700] = 1;
    const arrival = detectArrival(x, 48000, signalLevel(x));
    expect(arrival.arrivalSample).toBe(695);
    expect(arrival.peakSample).toBe(700);
    expect(arrival.thresholdDb).toBe(-20);
  });

  it('scales with the sample rate: sample 700 at 96 kHz is 7.2917 ms', () => {
    const x = new Float64Array(9600);
    x[700] = 1;
    expectWithin(detectArrival(x, 96000, signalLevel(x)).arrivalMs, 7.291667, 1e-6, 'arrivalMs');
  });

  it('raises the threshold to 15 dB over noise that lies within 35 dB of the peak, so noise never marks the onset', () => {
    const noise = seededGaussian(7);
    const x = Float64Array.from({ length: 48000 }, () => 0.03 * noise());
    x[20000] = 0.3; // noise RMS 0.03 is 20 dB under the peak
    const level = signalLevel(x);
    const arrival = detectArrival(x, 48000, level);
    expect(arrival.thresholdDb).toBeGreaterThan(-20);
    expect(arrival.arrivalSample).toBe(20000);
  });
});

describe('signal levels', () => {
  it('reports peak, RMS and energy of known signals in dB re full scale', () => {
    const x = new Float64Array(1000);
    x[0] = 0.5;
    const level = signalLevel(x);
    expectWithin(level.peakDbfs, 20 * Math.log10(0.5), 1e-12, 'peak');
    expectWithin(level.energyDb, 10 * Math.log10(0.25), 1e-12, 'energy');
    expectWithin(level.rmsDbfs, 10 * Math.log10(0.25 / 1000), 1e-12, 'rms');
    expect(level.noiseFloorDbfs).toBe(-300);

    const square = Float64Array.from({ length: 1000 }, (_, i) => (i % 2 ? 1 : -1));
    expectWithin(signalLevel(square).rmsDbfs, 0, 1e-12, 'full-scale square RMS');
  });

  it('reads the background noise from the last tenth', () => {
    const x = Float64Array.from({ length: 10000 }, (_, i) => (i >= 9000 ? (i % 2 ? 0.01 : -0.01) : 0));
    x[100] = 1;
    const level = signalLevel(x);
    expectWithin(level.noiseFloorDbfs, -40, 1e-9, 'noise');
    expectWithin(level.peakToNoiseDb, 40, 1e-9, 'peak to noise');
  });

  it('refuses an empty signal', () => {
    expect(() => signalLevel(new Float64Array(0))).toThrow(/no samples/);
  });
});
