import { designBiquad } from '../filters/biquad-design';
import { linkwitzRileySections } from '../filters/crossover';
import { cascadeResponse } from '../dsp/response';
import { planRoom } from './plan-room';
import { planToTuningSettings } from './plan-to-tuning';
import { checkTuningSettings, type TuningSettings } from './tuning';
import { compareTunings } from './tuning-compare';
import { designTuning } from './tuning-design';

const base = (): TuningSettings => ({
  sampleRateHz: 48000,
  channels: [
    {
      id: 'M+030',
      delayMs: 1.25,
      trimDb: -2,
      polarity: 'normal',
      eq: [{ type: 'peaking', frequencyHz: 120, gainDb: -4, q: 3 }],
      highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
      bassManaged: true,
    },
    { id: 'LFE1', delayMs: 0, trimDb: 0, polarity: 'normal', eq: [], highPass: null, bassManaged: false },
  ],
  subwoofer: {
    channel: 'LFE1',
    lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
    lfeGainDb: 10,
  },
});

describe('checkTuningSettings', () => {
  it('accepts good settings and names the bad field otherwise', () => {
    expect(() => checkTuningSettings(base())).not.toThrow();
    const s = base();
    s.channels[0].eq[0] = { type: 'peaking', frequencyHz: 30000, gainDb: -4, q: 3 };
    expect(() => checkTuningSettings(s)).toThrow(
      expect.objectContaining({ field: '/channels/0/eq/0/frequencyHz' }),
    );
    const lr3 = base();
    lr3.channels[0].highPass = { family: 'linkwitzRiley', order: 3, frequencyHz: 80 };
    expect(() => checkTuningSettings(lr3)).toThrow(
      expect.objectContaining({ field: '/channels/0/highPass/order' }),
    );
    const delay = base();
    delay.channels[1].delayMs = -1;
    expect(() => checkTuningSettings(delay)).toThrow(
      expect.objectContaining({ field: '/channels/1/delayMs' }),
    );
  });
});

describe('designTuning', () => {
  // Stored parameters are re-designed at each rate: the EQ section equals designBiquad (Audio EQ Cookbook)
  // and the crossover equals the Linkwitz-Riley design at that rate, never a resampled copy.
  it.each([44100, 48000, 96000])('at %i Hz equals designBiquad and linkwitzRileySections', (rate) => {
    const designed = designTuning(base(), rate);
    const main = designed.channels[0];
    expect(main.delaySamples).toBe(Math.round((1.25 * rate) / 1000));
    const { stage: _stage, ...eq } = main.sections[0];
    expect(eq).toEqual(designBiquad({ type: 'peaking', frequencyHz: 120, gainDb: -4, q: 3 }, rate));
    expect(main.sections.slice(1).map(({ stage: _s, ...s }) => s)).toEqual(
      linkwitzRileySections('highPass', 4, 80, rate),
    );
    expect(designed.channels[1].sections.map(({ stage: _s, ...s }) => s)).toEqual(
      linkwitzRileySections('lowPass', 4, 80, rate),
    );
    // Cookbook property: the peaking section gives exactly −4 dB at 120 Hz.
    expect(cascadeResponse([main.sections[0]], [120], rate).magnitudeDb[0]).toBeCloseTo(-4, 9);
  });
});

describe('compareTunings', () => {
  it('identical settings: identical, no differences', () => {
    const result = compareTunings(base(), base());
    expect(result.identical).toBe(true);
    expect(result.channels.every((c) => c.maxResponseDifferenceDb === 0)).toBe(true);
  });

  // A pure trim change moves the whole correction by the same number of dB at every frequency.
  it('a 1.5 dB trim change is a 1.5 dB response difference; a removed channel shows on one side', () => {
    const right = base();
    right.channels[0].trimDb = -0.5;
    right.channels = right.channels.slice(0, 1);
    right.subwoofer = null;
    const result = compareTunings(base(), right);
    expect(result.channels[0].trimDbDifference).toBeCloseTo(1.5, 12);
    expect(result.channels[0].maxResponseDifferenceDb).toBeCloseTo(1.5, 9);
    expect(result.channels[1]).toMatchObject({
      id: 'LFE1',
      presentIn: 'left',
      maxResponseDifferenceDb: null,
    });
    expect(result.subwoofer.lowPassChanged).toBe(true);
  });
});

describe('planToTuningSettings', () => {
  it('stores parameters, not coefficients, and gives the subwoofer the suggested delay and polarity', () => {
    const plan = planRoom({
      layout: '5.1',
      sampleRateHz: 48000,
      targets: { crossoverHz: 80, crossoverFamily: 'butterworth', crossoverOrder: 1 },
      channels: [
        { id: 'M+030', distance: 2.5, bassManaged: true },
        { id: 'M-030', distance: 2.5, bassManaged: true },
        { id: 'LFE1', distance: 2.0 },
      ],
    });
    const settings = planToTuningSettings(plan);
    const sub = settings.channels.find((c) => c.id === 'LFE1')!;
    expect(sub.delayMs).toBeCloseTo(plan.subwoofer!.suggestedDelayMs, 12);
    // First-order pair: 90° apart at 80 Hz (see subwoofer-alignment tests) → the subwoofer waits 3.125 ms less
    // than its distance alignment; here it is 0.5 m closer (1.457 ms at 343.2 m/s), so it is clamped to 0.
    expect(sub.delayMs).toBe(0);
    expect(plan.warnings.map((w) => w.code)).toContain('subwooferEarlyAtCrossover');
    expect(settings.channels[0].highPass).toEqual({ family: 'butterworth', order: 1, frequencyHz: 80 });
    expect(settings.subwoofer).toMatchObject({
      channel: 'LFE1',
      lowPass: { family: 'butterworth', order: 1, frequencyHz: 80 },
      lfeGainDb: 10,
    });
  });
});
