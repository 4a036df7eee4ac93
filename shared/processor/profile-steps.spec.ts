import type { TuningSettings } from '../plan/tuning';
import { exportForProcessor } from './processor-export';
import type { ProcessorProfileSettings } from './profile';
import { profileStepRounding } from './profile-steps';

const profile = (delay: ProcessorProfileSettings['delay']): ProcessorProfileSettings => ({
  sampleRatesHz: [48000],
  delay,
  trimDb: { min: -12, max: 12, step: 0.5 },
  eq: {
    bandsPerChannel: 8,
    filterTypes: ['peaking', 'lowShelf', 'highShelf'],
    frequencyHz: { min: 20, max: 20000, step: 1 },
    frequencyStepUnit: 'hz',
    gainDb: { min: -12, max: 6, step: 0.5 },
    q: { min: 0.3, max: 10, step: 0.1 },
  },
  coefficients: { order: ['b0', 'b1', 'b2', 'a1', 'a2'], feedbackSign: 'plus', numberFormat: 'float32' },
});

const settings: TuningSettings = {
  sampleRateHz: 48000,
  subwoofer: {
    channel: 'LFE1',
    lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80.4 },
    lfeGainDb: 10,
  },
  channels: [
    {
      id: 'M+030',
      delayMs: 1.5636,
      trimDb: -1.6,
      polarity: 'normal',
      eq: [{ type: 'peaking', frequencyHz: 209.7, gainDb: -3.54, q: 2.33 }],
      highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
      bassManaged: true,
    },
    {
      id: 'LFE1',
      delayMs: 2.5,
      trimDb: -1.5,
      polarity: 'normal',
      eq: [{ type: 'peaking', frequencyHz: 42, gainDb: -8, q: 4 }],
      highPass: null,
      bassManaged: false,
    },
  ],
};

describe('profileStepRounding', () => {
  it('names every setting off its step with what it becomes and by how much (hand figures)', () => {
    const found = profileStepRounding(settings, profile({ unit: 'ms', min: 0, max: 75, step: 0.01 }));
    const by = Object.fromEntries(found.map((r) => [`${r.setting} ${r.unit}`, r]));
    // 1.5636 ms on a 0.01 ms step is 1.56 ms; −1.6 dB on 0.5 dB is −1.5; 209.7 Hz on 1 Hz is 210;
    // −3.54 dB on 0.5 dB is −3.5; Q 2.33 on 0.1 is 2.3; the sub's 80.4 Hz low-pass is 80 Hz.
    expect(by['/channels/0/delayMs ms']).toMatchObject({ value: 1.5636, rounded: 1.56 });
    expect(by['/channels/0/delayMs ms'].message).toContain('it is exported as 1.56 ms (-0.0036 ms)');
    expect(by['/channels/0/trimDb dB']).toMatchObject({ value: -1.6, rounded: -1.5 });
    expect(by['/channels/0/eq/0/frequencyHz Hz']).toMatchObject({ rounded: 210 });
    expect(by['/channels/0/eq/0/gainDb dB']).toMatchObject({ rounded: -3.5 });
    expect(by['/channels/0/eq/0/q ']).toMatchObject({ value: 2.33, rounded: 2.3 });
    expect(by['/subwoofer/lowPass/frequencyHz Hz']).toMatchObject({ rounded: 80 });
    // 1.56 ms at 48 kHz is 74.88 samples: a whole-sample processor gives 75 (1.5625 ms, 0.0025 ms off).
    expect(by['/channels/0/delayMs samples']).toMatchObject({ rounded: 75 });
    expect(by['/channels/0/delayMs samples'].value).toBeCloseTo(74.88, 9);
    expect(by['/channels/0/delayMs samples'].message).toContain('gives 75 (1.5625 ms, 0.0025 ms off)');
    // LFE1 is on every step: 2.5 ms is 120 samples, −1.5 dB, 42 Hz, −8 dB, Q 4.
    expect(found.filter((r) => r.setting.startsWith('/channels/1/'))).toEqual([]);
    expect(found).toHaveLength(7);
  });

  it('with a profile counting samples, the delay is rounded to its sample step, and no fractional-sample note', () => {
    const found = profileStepRounding(settings, profile({ unit: 'samples', min: 0, max: 3600, step: 1 }));
    const delays = found.filter((r) => r.setting.endsWith('delayMs'));
    expect(delays).toEqual([
      expect.objectContaining({ setting: '/channels/0/delayMs', unit: 'samples', rounded: 75 }),
    ]);
  });

  it('agrees with the export: every rounded value is what the export writes', () => {
    const p = profile({ unit: 'ms', min: 0, max: 75, step: 0.01 });
    const exported = exportForProcessor(settings, 48000, p);
    const found = profileStepRounding(settings, p);
    const at = (setting: string, unit: string) =>
      found.find((r) => r.setting === setting && r.unit === unit)?.rounded;
    expect(exported.channels[0].delayMs).toBe(at('/channels/0/delayMs', 'ms'));
    expect(exported.channels[0].trimDb).toBe(at('/channels/0/trimDb', 'dB'));
    expect(exported.channels[0].eq[0]).toMatchObject({
      frequencyHz: at('/channels/0/eq/0/frequencyHz', 'Hz'),
      gainDb: at('/channels/0/eq/0/gainDb', 'dB'),
      q: at('/channels/0/eq/0/q', ''),
    });
  });
});
