import { STAGE3_REFERENCE_DB, STAGE3_ROOM, STAGE3_SPL_DB } from '../../seeds/demo-stage3-room';
import { stage3MeasuredResponses } from '../../seeds/demo-stage3-measurements';
import { designCrossover } from '../filters/crossover';
import { cascadeResponse } from '../dsp/response';
import { planRoom, type PlanInput } from './plan-room';
import { alignSubwooferAtCrossover } from './subwoofer-alignment';

const fs = 48000;

function stage3Plan(overrides: Partial<PlanInput> = {}): PlanInput {
  return {
    layout: STAGE3_ROOM.layout,
    room: STAGE3_ROOM.dimensions,
    listener: STAGE3_ROOM.listener,
    channels: STAGE3_ROOM.loudspeakers.map(({ id, x, y, z }) => ({
      id,
      position: { x, y, z },
      measuredDb: STAGE3_SPL_DB[id],
      bassManaged: !id.startsWith('LFE'),
    })),
    targets: { referenceDb: STAGE3_REFERENCE_DB, crossoverHz: 80 },
    limits: { delayMaxMs: 75, trimMinDb: -12, trimMaxDb: 12, eqBandsPerChannel: 8, eqMaxCutDb: 12 },
    temperatureC: 21,
    sampleRateHz: fs,
    ...overrides,
  };
}

describe('alignSubwooferAtCrossover', () => {
  // Linkwitz-Riley outputs are in phase at every frequency (S. H. Linkwitz, JAES 24(1), 1976; scipy.signal butter): nothing to change.
  it('LR4 low-pass against LR4 high-pass: normal polarity, no extra delay', () => {
    const x = designCrossover({ family: 'linkwitzRiley', order: 4, frequencyHz: 80 }, fs);
    const a = alignSubwooferAtCrossover(x.lowPass.sections, x.highPass.sections, x.highPassPolarity, 80, fs);
    expect(a.polarity).toBe('normal');
    expect(Math.abs(a.correctionMs)).toBeLessThan(1e-9);
  });

  // Analogue first-order prototypes 1/(1+s) and s/(1+s) are at −45° and +45° at the corner; the bilinear
  // transform pre-warped at fc keeps that value at fc. Δ = −90° → a quarter period earlier: 1/(4·80 Hz) = 3.125 ms.
  it('first-order Butterworth pair: the subwoofer lags 90°, so 3.125 ms less delay at 80 Hz', () => {
    const x = designCrossover({ family: 'butterworth', order: 1, frequencyHz: 80 }, fs);
    const a = alignSubwooferAtCrossover(x.lowPass.sections, x.highPass.sections, 'normal', 80, fs);
    expect(a.phaseDifferenceDeg).toBeCloseTo(-90, 6);
    expect(a.polarity).toBe('normal');
    expect(a.correctionMs).toBeCloseTo(-3.125, 6);
  });

  // An LR2 pair needs the high-pass inverted (S. H. Linkwitz, JAES 24(1), 1976; scipy.signal butter). Told the mains run in normal polarity,
  // the subwoofer is 180° out at fc and the suggestion is to invert it, with no delay change.
  it('LR2 with the mains left in normal polarity: invert the subwoofer', () => {
    const x = designCrossover({ family: 'linkwitzRiley', order: 2, frequencyHz: 80 }, fs);
    const a = alignSubwooferAtCrossover(x.lowPass.sections, x.highPass.sections, 'normal', 80, fs);
    expect(Math.abs(a.phaseDifferenceDeg)).toBeCloseTo(180, 6);
    expect(a.polarity).toBe('inverted');
    expect(Math.abs(a.correctionMs)).toBeLessThan(1e-9);
  });
});

describe('planRoom — the demo room Stage 3 end to end', () => {
  const plan = planRoom(stage3Plan());
  const byId = Object.fromEntries(plan.channels.map((c) => [c.id, c]));

  // Speed of sound, ISO 9613-1 form, as in the pyfar library: 343.2·√((21 + 273.15)/293.15) = 343.7849 m/s at 21 °C.
  it('uses the speed of sound at 21 °C', () => {
    expect(plan.speedOfSoundMps).toBeCloseTo(343.2 * Math.sqrt(294.15 / 293.15), 9);
  });

  // Hand computation: LFE1 at (0.9, 0.5, 0.25) is √(2.15² + 2.8² + 0.95²) = 3.65582 m from the listener, the
  // farthest, so it is the reference; M+030 at √(1.56² + 2.7²) = 3.11827 m waits (3.65582 − 3.11827)/c.
  it('aligns every arrival to the farthest loudspeaker, the subwoofer', () => {
    const c = plan.speedOfSoundMps;
    const lfe = Math.sqrt(2.15 ** 2 + 2.8 ** 2 + 0.95 ** 2);
    const left = Math.sqrt(1.56 ** 2 + 2.7 ** 2);
    expect(plan.referenceChannel).toBe('LFE1');
    expect(byId.LFE1.delayMs).toBe(0);
    expect(byId['M+030'].distanceM).toBeCloseTo(left, 9);
    expect(byId['M+030'].delayMs).toBeCloseTo(((lfe - left) / c) * 1000, 9);
    expect(byId['M+030'].delaySamples).toBe(Math.round(((lfe - left) / c) * fs));
    // ITU-R BS.2051-3 Table 1 note 1: aligned within 100 µs; rounding to 48 kHz leaves at most 10.4 µs.
    for (const channel of plan.channels) {
      expect(
        Math.abs(channel.arrivalMs + channel.delaySamples / 48 - (byId.LFE1.arrivalMs + 0)),
      ).toBeLessThan(0.1);
    }
  });

  // trim = reference + offset − reading (common practice); LFE read 10 dB above the reference (ISO 21727 85/95 dB).
  it('trims every channel to 79 dB, the LFE to 89 dB in band', () => {
    expect(byId['M+030'].trimDb).toBeCloseTo(79 - 80.6, 9);
    expect(byId['M+135'].trimDb).toBeCloseTo(79 - 83.1, 9);
    expect(byId.LFE1.trimDb).toBeCloseTo(89 - 90.2, 9);
    expect(plan.channels.every((c) => c.expectedDb !== null)).toBe(true);
  });

  // Headroom (coherent in-phase sum, 20·log10 of the summed amplitudes): 11 managed channels + LFE at +10 dB → 20·log10(11 + 10^(10/20)).
  it('bass-manages eleven channels at 80 Hz LR4 and reports the headroom the sum needs', () => {
    expect(plan.subwoofer?.headroomDb).toBeCloseTo(20 * Math.log10(11 + Math.pow(10, 0.5)), 9);
    expect(plan.subwoofer?.lfeGainDb).toBe(10);
    expect(plan.subwoofer?.channel).toBe('LFE1');
    const hp = byId['M+030'].highPass!;
    expect(hp).toMatchObject({ family: 'linkwitzRiley', order: 4, frequencyHz: 80, polarity: 'normal' });
    // Every Linkwitz-Riley output is −6.02 dB at fc (S. H. Linkwitz, JAES 24(1), 1976; scipy.signal butter).
    const [atFc] = cascadeResponse(hp.sections, [80], fs).magnitudeDb;
    expect(atFc).toBeCloseTo(-6.0206, 3);
    const [lowAtFc] = cascadeResponse(plan.subwoofer!.lowPass.sections, [80], fs).magnitudeDb;
    expect(lowAtFc).toBeCloseTo(-6.0206, 3);
    expect(plan.subwoofer?.suggestedPolarity).toBe('normal');
    expect(plan.subwoofer?.suggestedDelayMs).toBeCloseTo(0, 9);
    expect(plan.warnings.map((w) => w.code)).toContain('headroomLarge');
  });

  it('carries the cautions: test-signal level, bass summing, overhead mounting', () => {
    expect(plan.cautions.map((c) => c.code)).toEqual(
      expect.arrayContaining(['testSignalLevel', 'bassSumming', 'overheadMounting']),
    );
  });

  it('the demo room passes its layout checks (no geometry warnings)', () => {
    const geometryCodes = [
      'azimuthOutOfRange',
      'elevationOutOfRange',
      'asymmetricPair',
      'surroundSpacing',
      'unknownChannel',
      'missingChannel',
    ];
    expect(plan.warnings.filter((w) => geometryCodes.includes(w.code))).toEqual([]);
  });

  it('is deterministic', () => {
    expect(planRoom(stage3Plan())).toEqual(plan);
  });
});

describe('planRoom — EQ from measured responses', () => {
  const responses = stage3MeasuredResponses();
  const input = stage3Plan();
  input.channels = input.channels.map((c) => ({ ...c, measuredResponse: responses[c.id] }));
  const plan = planRoom(input);

  it('fits cut-only bands within the band count and lowers the residual error', () => {
    const fitted = plan.channels.filter((c) => c.eq.residualRmsDb);
    expect(fitted.map((c) => c.id)).toEqual(['M+030', 'M-030', 'M+000', 'LFE1']);
    for (const channel of fitted) {
      expect(channel.eq.bands.length).toBeLessThanOrEqual(8);
      expect(channel.eq.bands.every((b) => b.gainDb < 0 && b.gainDb >= -12)).toBe(true);
      expect(channel.eq.bands.every((b) => b.frequencyHz <= channel.eq.toHz!)).toBe(true);
      expect(channel.eq.residualRmsDb!.after).toBeLessThanOrEqual(channel.eq.residualRmsDb!.before);
    }
    expect(plan.channels.find((c) => c.id === 'LFE1')!.eq.residualRmsDb!.after).toBeLessThan(
      plan.channels.find((c) => c.id === 'LFE1')!.eq.residualRmsDb!.before,
    );
    expect(plan.cautions.some((c) => c.code === 'eqBoost')).toBe(false);
  });

  // The invented subwoofer response has a +7 dB, Q 5 mode at 42 Hz (seeds/demo-stage3-measurements.ts).
  it('cuts the subwoofer mode at 42 Hz, fitting only up to an octave above the crossover', () => {
    const sub = plan.channels.find((c) => c.id === 'LFE1')!;
    expect(sub.eq.toHz).toBe(160);
    const mode = sub.eq.bands.find((b) => Math.abs(Math.log2(b.frequencyHz / 42)) < 0.1);
    expect(mode?.gainDb).toBeLessThan(-4);
  });

  it('a bass-managed main is fitted from the crossover up to the transition frequency, nothing above', () => {
    const main = plan.channels.find((c) => c.id === 'M+030')!;
    expect(main.eq.fromHz).toBe(80);
    // Stage 3 (6.10 × 7.40 × 3.05 m = 137.7 m³) with the assumed 0.3 s: 2000·√(0.3/137.677) = 93.4 Hz
    // (Kuttruff, "Room Acoustics"); the 112 Hz dip and the 190 Hz bump of the invented response lie above it.
    expect(main.eq.toHz).toBe(93.4);
    expect(main.eq.bands).toEqual([]);
    expect(plan.warnings).toContainEqual(
      expect.objectContaining({ code: 'reverberationTimeAssumed', channel: 'M+030' }),
    );
    const measuredT = planRoom({ ...input, targets: { ...input.targets, reverberationTimeS: 0.5 } });
    // 2000·√(0.5/137.677) = 120.5 Hz.
    expect(measuredT.channels.find((c) => c.id === 'M+030')!.eq.toHz).toBe(120.5);
    const upTo = planRoom({ ...input, targets: { ...input.targets, eqToHz: 300 } });
    const wider = upTo.channels.find((c) => c.id === 'M+030')!;
    expect(wider.eq.toHz).toBe(300);
    expect(wider.eq.bands.some((b) => b.frequencyHz > 150 && b.frequencyHz < 250 && b.gainDb < 0)).toBe(true);
  });

  it('keeps to the processor profile of the room: band count, filter types, frequency, gain and Q ranges, steps', () => {
    const processorEq = {
      bandsPerChannel: 2,
      filterTypes: ['peaking' as const],
      frequencyHz: { min: 30, max: 20000, step: 1 },
      frequencyStepUnit: 'hz' as const,
      gainDb: { min: -5, max: 3, step: 0.5 },
      q: { min: 0.5, max: 3, step: 0.1 },
    };
    const limited = planRoom({ ...input, processorEq });
    const bands = limited.channels.flatMap((c) => c.eq.bands);
    expect(bands.length).toBeGreaterThan(0);
    for (const channel of limited.channels) expect(channel.eq.bands.length).toBeLessThanOrEqual(2);
    for (const b of bands) {
      expect(b.frequencyHz).toBeGreaterThanOrEqual(30);
      expect(b.gainDb).toBeGreaterThanOrEqual(-5);
      expect(b.q).toBeLessThanOrEqual(3);
      expect(Number.isInteger(b.frequencyHz)).toBe(true);
      expect(Math.abs(b.gainDb * 2 - Math.round(b.gainDb * 2))).toBeLessThan(1e-9);
    }
    const shelvesOnly = planRoom({
      ...input,
      processorEq: { ...processorEq, filterTypes: ['lowShelf' as const] },
    });
    expect(shelvesOnly.channels.flatMap((c) => c.eq.bands)).toEqual([]);
  });

  it('refuses measured responses without a band count', () => {
    const { eqBandsPerChannel: _bands, ...limits } = input.limits!;
    expect(() => planRoom({ ...input, limits })).toThrow(
      expect.objectContaining({ field: '/limits/eqBandsPerChannel' }),
    );
  });
});

describe('planRoom — bad input names the field', () => {
  it('an unknown layout', () => {
    expect(() => planRoom(stage3Plan({ layout: '10.2' }))).toThrow(
      expect.objectContaining({ field: '/layout' }),
    );
  });

  it('a loudspeaker outside the room', () => {
    const input = stage3Plan();
    input.channels[7] = { ...input.channels[7], position: { x: 4.85, y: 7.6, z: 1.2 } };
    expect(() => planRoom(input)).toThrow(expect.objectContaining({ field: '/channels/7/position/y' }));
  });

  it('a repeated channel id', () => {
    const input = stage3Plan();
    input.channels[2] = { ...input.channels[2], id: 'M+030' };
    expect(() => planRoom(input)).toThrow(expect.objectContaining({ field: '/channels/2/id' }));
  });

  it('positions without a room', () => {
    expect(() => planRoom(stage3Plan({ room: undefined }))).toThrow(
      expect.objectContaining({ field: '/room' }),
    );
  });

  it('a channel with nothing to time it by', () => {
    const input = stage3Plan();
    input.channels[4] = { id: 'M+090', measuredDb: 82 };
    expect(() => planRoom(input)).toThrow(expect.objectContaining({ field: '/channels/4/position' }));
  });

  it('an LFE marked bass-managed, a Linkwitz-Riley of order 3', () => {
    const input = stage3Plan();
    input.channels[3] = { ...input.channels[3], bassManaged: true };
    expect(() => planRoom(input)).toThrow(expect.objectContaining({ field: '/channels/3/bassManaged' }));
    expect(() => planRoom(stage3Plan({ targets: { crossoverOrder: 3 } }))).toThrow(
      expect.objectContaining({ field: '/targets/crossoverOrder' }),
    );
  });
});
