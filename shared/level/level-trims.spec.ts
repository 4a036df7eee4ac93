import { catchInputError, expectWithin } from '../filters/test-helpers';
import { computeLevelTrims, LevelInput } from './level-trims';

describe('computeLevelTrims', () => {
  // trim = target − measured (the definition of a trim, common practice).
  it('trims measured levels to a target', () => {
    const plan = computeLevelTrims({
      channels: [
        { id: 'M+030', measuredDb: 80.0 },
        { id: 'M+000', measuredDb: 82.5 },
        { id: 'M-030', measuredDb: 78.2 },
      ],
      targetDb: 79,
    });
    expect(plan.alignedTo).toBe('target');
    expectWithin(plan.channels[0].trimDb, -1, 1e-12, 'M+030');
    expectWithin(plan.channels[1].trimDb, -3.5, 1e-12, 'M+000');
    expectWithin(plan.channels[2].trimDb, 0.8, 1e-12, 'M-030 boost');
    for (const c of plan.channels) expectWithin(c.expectedDb, 79, 1e-12, `${c.id} expected`);
    expect(plan.cautions.map((c) => c.code)).toEqual(['testSignalLevel', 'levelBoost']);
    expect(plan.cautions[1].message).toContain('M-030');
    // Three uncorrelated channels at 79 dB: 79 + 10·log10(3) = 83.77 dB (power sum of uncorrelated sources).
    expect(plan.cautions[0].message).toContain('reach about 83.77 dB');
  });

  it('without a target aligns to the quietest channel, so every trim is a cut', () => {
    const plan = computeLevelTrims({
      channels: [
        { id: 'a', measuredDb: 80.0 },
        { id: 'b', measuredDb: 77.4 },
        { id: 'c', measuredDb: 84.1 },
      ],
    });
    expect(plan.alignedTo).toBe('quietestChannel');
    expect(plan.targetDb).toBe(77.4);
    expect(plan.channels.map((c) => c.trimDb).every((t) => t <= 0)).toBe(true);
    expectWithin(plan.channels[2].trimDb, 77.4 - 84.1, 1e-12, 'c');
    expect(plan.channels[1].trimDb).toBe(0);
    expect(plan.cautions.map((c) => c.code)).toEqual(['testSignalLevel']);
  });

  // ISO 21727:2016: LFE is set 10 dB above the other channels in band.
  it('honours per-channel target offsets, e.g. LFE +10 dB in band', () => {
    const plan = computeLevelTrims({
      channels: [
        { id: 'M+030', measuredDb: 85.6 },
        { id: 'LFE1', measuredDb: 93.0, targetOffsetDb: 10 },
      ],
      targetDb: 85,
    });
    expectWithin(plan.channels[1].trimDb, 2, 1e-12, 'LFE trim');
    expectWithin(plan.channels[1].expectedDb, 95, 1e-12, 'LFE level');
  });

  // Inverse-square law: estimate L(r) = L(r0) − 20·log10(r/r0).
  it('estimates from distance by the inverse-square law and flags the estimate', () => {
    const plan = computeLevelTrims({
      channels: [
        { id: 'near', distance: 2 },
        { id: 'far', distance: '4 m' },
      ],
    });
    expect(plan.channels.every((c) => c.estimated)).toBe(true);
    expectWithin(plan.channels[0].trimDb, -20 * Math.log10(2), 1e-12, 'doubling distance is −6.02 dB');
    expect(plan.channels[1].trimDb).toBe(0);
    expect(plan.warnings.map((w) => w.code)).toContain('levelEstimated');
  });

  it('compares distance estimates with measurements through levelAt1mDb', () => {
    const plan = computeLevelTrims({
      channels: [
        { id: 'measured', measuredDb: 80 },
        { id: 'estimated', distance: 3 },
      ],
      levelAt1mDb: 90,
      targetDb: 79,
    });
    expectWithin(plan.channels[1].levelDb, 90 - 20 * Math.log10(3), 1e-12, 'estimate');
    expectWithin(plan.channels[1].trimDb, 79 - (90 - 20 * Math.log10(3)), 1e-12, 'trim');
    expect(plan.channels.map((c) => c.estimated)).toEqual([false, true]);
  });

  it('clamps to limits.trimMinDb..trimMaxDb with a warning', () => {
    const plan = computeLevelTrims({
      channels: [
        { id: 'loud', measuredDb: 96 },
        { id: 'quiet', measuredDb: 64 },
        { id: 'ok', measuredDb: 80 },
      ],
      targetDb: 79,
      limits: { trimMinDb: -12, trimMaxDb: 12 },
    });
    expect(plan.channels[0]).toMatchObject({ trimDb: -12, expectedDb: 84, clamped: true });
    expect(plan.channels[1]).toMatchObject({ trimDb: 12, expectedDb: 76, clamped: true });
    expect(plan.channels[2]).toMatchObject({ trimDb: -1, clamped: false });
    expect(plan.warnings.map((w) => [w.code, w.channel])).toEqual([
      ['trimClamped', 'loud'],
      ['trimClamped', 'quiet'],
    ]);
    expect(plan.warnings[0].message).toContain('5 dB loud');
  });

  it.each([
    [{ channels: [] }, '/channels'],
    [{ channels: [{ id: 'a', measuredDb: 80, distance: 2 }] }, '/channels/0/distance'],
    [{ channels: [{ id: 'a' }] }, '/channels/0/measuredDb'],
    [{ channels: [{ id: 'a', measuredDb: 151 }] }, '/channels/0/measuredDb'],
    [{ channels: [{ id: 'a', measuredDb: NaN }] }, '/channels/0/measuredDb'],
    [{ channels: [{ id: 'a', measuredDb: 80 }], targetDb: -151 }, '/targetDb'],
    [{ channels: [{ id: 'a', measuredDb: 80, targetOffsetDb: 41 }] }, '/channels/0/targetOffsetDb'],
    [{ channels: [{ id: 'a', distance: 2 }], targetDb: 79 }, '/levelAt1mDb'],
    [
      {
        channels: [
          { id: 'a', distance: 2 },
          { id: 'b', measuredDb: 80 },
        ],
      },
      '/levelAt1mDb',
    ],
    [{ channels: [{ id: 'a', distance: '2 s' }] }, '/channels/0/distance'],
    [{ channels: [{ id: 'a', measuredDb: 80 }], limits: { trimMinDb: 1 } }, '/limits/trimMinDb'],
    [{ channels: [{ id: 'a', measuredDb: 80 }], limits: { trimMaxDb: -1 } }, '/limits/trimMaxDb'],
  ])('refuses %j, naming %s', (input, field) => {
    expect(catchInputError(() => computeLevelTrims(input as LevelInput)).field).toBe(field);
  });
});

describe('the "all channels together" figure is the power sum of the levels the channels will reach', () => {
  // Power sum of uncorrelated levels, 10·log10(Σ 10^(L/10)) (IEC 61672-1 energy summation):
  // 10·log10(10^7.9 + 10^8.9) = 89.41 dB — a main at 79 dB and the LFE at 79 + 10 dB in band.
  const powerSum = (levels: number[]) => 10 * Math.log10(levels.reduce((s, l) => s + 10 ** (l / 10), 0));

  it('79 dB and the LFE at +10 dB (89 dB) reach 89.41 dB together, not 82.01', () => {
    const plan = computeLevelTrims({
      channels: [
        { id: 'M+030', measuredDb: 80.6 },
        { id: 'LFE1', measuredDb: 90.2, targetOffsetDb: 10 },
      ],
      targetDb: 79,
    });
    expect(plan.channels.map((c) => c.expectedDb)).toEqual([79, 89].map((l) => expect.closeTo(l, 12)));
    expect(powerSum([79, 89])).toBeCloseTo(89.41, 2);
    expect(plan.cautions[0].message).toContain('reach about 89.41 dB');
  });

  it('a channel whose trim is clamped counts at the level it will really reach, and gets the wiring caution', () => {
    const plan = computeLevelTrims({
      channels: [
        { id: 'M+030', measuredDb: 79 },
        { id: 'M-030', measuredDb: 60 },
      ],
      targetDb: 79,
      limits: { trimMaxDb: 12 },
    });
    expect(plan.channels[1]).toMatchObject({ trimDb: 12, expectedDb: 72, clamped: true });
    const expected = Math.round(powerSum([79, 72]) * 100) / 100;
    expect(plan.cautions[0].message).toContain(`reach about ${expected} dB`);
    const wiring = plan.cautions.find((c) => c.code === 'trimAtLimit');
    expect(wiring?.message).toMatch(
      /M-030 reads so low .* check the loudspeaker and its wiring before adding gain/,
    );
  });

  it('hearing cautions defer to local occupational limits and name one published figure', () => {
    const plan = computeLevelTrims({ channels: [{ id: 'a', measuredDb: 80 }], targetDb: 79 });
    expect(plan.cautions[0].message).toMatch(/occupational noise limits that apply where you work/);
    expect(plan.cautions[0].message).toMatch(
      /NIOSH \(Criteria for a Recommended Standard, 1998\) recommends at most 85 dBA over 8 hours/,
    );
  });
});
