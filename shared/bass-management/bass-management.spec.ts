import { catchInputError, expectWithin, referenceDb } from '../filters/test-helpers';
import { BassManagementInput, planBassManagement } from './bass-management';

const SEVEN_ONE = ['M+030', 'M-030', 'M+000', 'M+090', 'M-090', 'M+135', 'M-135'];
const managed = (labels: string[]) => labels.map((id) => ({ id, bassManaged: true }));
const MINUS_6_DB = 20 * Math.log10(0.5);

describe('planBassManagement', () => {
  // Issue 2 check value: 7 managed channels + LFE at +10 dB → 20·log10(7 + 10^(10/20)) ≈ 20.1 dB.
  it('7.1 with LFE at +10 dB needs 20·log10(7 + 10^0.5) = 20.14 dB of headroom, and warns', () => {
    const plan = planBassManagement({ channels: [...managed(SEVEN_ONE), { id: 'LFE1' }] });
    expectWithin(plan.headroomDb, 20 * Math.log10(7 + Math.pow(10, 10 / 20)), 1e-12, 'headroom');
    expectWithin(plan.headroomDb, 20.14, 0.005, 'rounded');
    expect(plan.warnings.map((w) => w.code)).toEqual(['headroomLarge']);
    expect(plan.cautions.map((c) => c.code)).toEqual(['bassSumming']);
    expect(plan.cautions[0].message).toContain('20.1 dB');
  });

  // Common practice: LR4 at 80 Hz on both sides; LR outputs are −6.02 dB at fc.
  it('defaults to LR4 at 80 Hz: high-passes and the subwoofer low-pass are −6.02 dB at 80 Hz', () => {
    const plan = planBassManagement({
      channels: [...managed(['M+030', 'M-030']), { id: 'M+000' }, { id: 'LFE1' }],
    });
    const [left, , centre, lfe] = plan.channels;
    expect(left).toMatchObject({
      role: 'managed',
      highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80, polarity: 'normal' },
    });
    expect(left.highPass!.sections).toHaveLength(2);
    expectWithin(referenceDb(left.highPass!.sections, 80, 48000), MINUS_6_DB, 1e-9, 'HP at 80 Hz');
    expectWithin(referenceDb(plan.subwoofer.lowPass.sections, 80, 48000), MINUS_6_DB, 1e-9, 'LP at 80 Hz');
    expect(centre).toEqual({ id: 'M+000', role: 'fullRange' });
    expect(lfe).toEqual({ id: 'LFE1', role: 'lfe' });
    expect(plan.subwoofer.inputs).toEqual([
      { id: 'M+030', gainDb: 0, route: 'sharedLowPass' },
      { id: 'M-030', gainDb: 0, route: 'sharedLowPass' },
      { id: 'LFE1', gainDb: 10, route: 'direct' },
    ]);
    expectWithin(plan.headroomDb, 20 * Math.log10(2 + Math.pow(10, 0.5)), 1e-12, 'headroom');
  });

  it('takes a per-channel crossover for that channel’s high-pass and its own low-pass into the subwoofer', () => {
    const plan = planBassManagement({
      sampleRateHz: 96000,
      channels: [
        { id: 'M+030', bassManaged: true },
        { id: 'U+045', bassManaged: true, crossover: { frequencyHz: 100 } },
      ],
    });
    const top = plan.channels[1];
    expect(top.highPass).toMatchObject({ family: 'linkwitzRiley', order: 4, frequencyHz: 100 });
    expectWithin(referenceDb(top.highPass!.sections, 100, 96000), MINUS_6_DB, 1e-9, 'top HP at 100 Hz');
    const input = plan.subwoofer.inputs[1];
    expect(input).toMatchObject({ id: 'U+045', route: 'ownLowPass', lowPass: { frequencyHz: 100 } });
    expectWithin(referenceDb(input.lowPass!.sections, 100, 96000), MINUS_6_DB, 1e-9, 'own LP at 100 Hz');
  });

  it('inverts the high-pass for an LR2 crossover (S. H. Linkwitz, JAES 24(1), 1976; scipy.signal butter) and warns about high crossovers', () => {
    const plan = planBassManagement({
      crossover: { order: 2, frequencyHz: 150 },
      channels: managed(['M+030']),
    });
    expect(plan.channels[0].highPass!.polarity).toBe('inverted');
    expect(plan.channels[0].highPass!.sections).toHaveLength(1);
    expect(plan.warnings).toEqual([expect.objectContaining({ code: 'crossoverHigh', channel: 'M+030' })]);
  });

  it('uses lfeGainDb for LFE channels and cautions about boosts above +10 dB', () => {
    const plan = planBassManagement({ lfeGainDb: 12, channels: [{ id: 'LFE1' }, { id: 'LFE2' }] });
    expect(plan.subwoofer.inputs.map((i) => i.gainDb)).toEqual([12, 12]);
    expectWithin(plan.headroomDb, 20 * Math.log10(2 * Math.pow(10, 12 / 20)), 1e-12, 'two LFE inputs');
    expect(plan.cautions.map((c) => c.code)).toEqual(['bassSumming', 'lowFrequencyBoost']);
  });

  // Common practice: n subwoofers in phase add 20·log10(n) at the listening position, so each is fed −20·log10(n).
  it.each([
    [1, 0],
    [2, -6.0206],
    [4, -12.0412],
  ])('%i subwoofers share the feed at %d dB each', (count, gainDb) => {
    const plan = planBassManagement({
      subwooferCount: count,
      channels: [...managed(SEVEN_ONE), { id: 'LFE1' }],
    });
    expect(plan.subwoofer.count).toBe(count);
    expectWithin(plan.subwoofer.feedGainDb, gainDb, 1e-4, 'feed gain');
    expectWithin(plan.headroomDb, 20.14, 0.005, 'headroom of the summed feed does not depend on the split');
  });

  it('warns when nothing feeds the subwoofer and reports 0 dB headroom', () => {
    const plan = planBassManagement({ channels: [{ id: 'M+030' }] });
    expect(plan.headroomDb).toBe(0);
    expect(plan.warnings.map((w) => w.code)).toEqual(['subwooferUnused']);
    expect(plan.cautions).toEqual([]);
  });

  it('stays quiet below headroomWarningDb', () => {
    const plan = planBassManagement({
      headroomWarningDb: 25,
      channels: [...managed(SEVEN_ONE), { id: 'LFE1' }],
    });
    expect(plan.warnings).toEqual([]);
  });

  it.each([
    [{ channels: [] }, '/channels'],
    [{ channels: [{ id: 'LFE1', bassManaged: true }] }, '/channels/0/bassManaged'],
    [{ channels: [{ id: 'LFE1', crossover: { frequencyHz: 100 } }] }, '/channels/0/crossover'],
    [{ channels: [{ id: 'M+030', crossover: { frequencyHz: 100 } }] }, '/channels/0/crossover'],
    [{ channels: [{ id: 'M+030' }], subwooferCount: 0 }, '/subwooferCount'],
    [{ channels: [{ id: 'M+030' }], subwooferCount: 17 }, '/subwooferCount'],
    [{ channels: [{ id: 'M+030' }], subwooferCount: 1.5 }, '/subwooferCount'],
    [{ channels: [{ id: 'M+030' }], lfeGainDb: 21 }, '/lfeGainDb'],
    [{ channels: [{ id: 'M+030' }], headroomWarningDb: -1 }, '/headroomWarningDb'],
    [{ channels: [{ id: 'M+030' }], crossover: { order: 3 } }, '/crossover/order'],
    [{ channels: [{ id: 'M+030' }], crossover: { frequencyHz: 24000 } }, '/crossover/frequencyHz'],
    [
      {
        channels: [
          { id: 'M+030' },
          { id: 'M-030', bassManaged: true, crossover: { family: 'butterworth', order: 9 } },
        ],
      },
      '/channels/1/crossover/order',
    ],
  ])('refuses %j, naming %s', (input, field) => {
    expect(catchInputError(() => planBassManagement(input as BassManagementInput)).field).toBe(field);
  });
});
