import fc from 'fast-check';
import { FILTER_TYPES, type FilterSpec, type FilterType } from '../filters/biquad-design';
import type { ProcessorProfileSettings } from '../processor/profile';
import type { TuningChannel, TuningSettings } from './tuning';
import { findLimitViolations, type RoomLimits } from './tuning-limits';

/**
 * Property test: every limit refuses a value just outside it and accepts one just inside, for limits
 * drawn at random (fast-check, fixed seed so a failure can be replayed). "Just" is 0.001 of the unit
 * (ms, dB, Hz, samples, Q) or one band.
 */
const SEED = 20261202;
const RUNS = 60;
const EPS = 1e-3;

const WIDE_PROFILE: ProcessorProfileSettings = {
  sampleRatesHz: [44100, 48000, 96000],
  delay: { unit: 'ms', min: 0, max: 1000, step: 0 },
  trimDb: { min: -60, max: 24, step: 0 },
  eq: {
    bandsPerChannel: 64,
    filterTypes: [...FILTER_TYPES],
    frequencyHz: { min: 1, max: 96000, step: 0 },
    frequencyStepUnit: 'hz',
    gainDb: { min: -48, max: 24, step: 0 },
    q: { min: 0.025, max: 100, step: 0 },
  },
  coefficients: { order: ['b0', 'b1', 'b2', 'a1', 'a2'], feedbackSign: 'plus', numberFormat: 'float32' },
};

const channel = (over: Partial<TuningChannel> = {}): TuningChannel => ({
  id: 'M+030',
  delayMs: 0,
  trimDb: 0,
  polarity: 'normal',
  eq: [],
  highPass: null,
  bassManaged: false,
  ...over,
});
const settingsWith = (over: Partial<TuningChannel>, sampleRateHz = 48000): TuningSettings => ({
  sampleRateHz,
  channels: [channel(over)],
  subwoofer: null,
});
const peak = (frequencyHz: number, gainDb: number, q = 1): FilterSpec => ({
  type: 'peaking',
  frequencyHz,
  gainDb,
  q,
});
const withProfile = (change: (p: ProcessorProfileSettings) => void): ProcessorProfileSettings => {
  const p = structuredClone(WIDE_PROFILE);
  change(p);
  return p;
};

type Side = 'inside' | 'outside';
interface Case {
  settings: TuningSettings;
  room?: RoomLimits;
  profile?: ProcessorProfileSettings;
}
interface LimitKind {
  name: string;
  /** The limit's value, drawn at random. */
  limit: fc.Arbitrary<number>;
  build: (limit: number, side: Side) => Case;
  setting: string;
  source: 'room' | 'profile';
}

const towards = (side: Side, limit: number, outward: 1 | -1) =>
  limit + outward * (side === 'outside' ? EPS : -EPS);

const KINDS: LimitKind[] = [
  {
    name: 'delayMaxMs',
    limit: fc.double({ min: 1, max: 900, noNaN: true }),
    build: (l, s) => ({ settings: settingsWith({ delayMs: towards(s, l, 1) }), room: { delayMaxMs: l } }),
    setting: '/channels/0/delayMs',
    source: 'room',
  },
  {
    name: 'trimMinDb',
    limit: fc.double({ min: -50, max: -1, noNaN: true }),
    build: (l, s) => ({ settings: settingsWith({ trimDb: towards(s, l, -1) }), room: { trimMinDb: l } }),
    setting: '/channels/0/trimDb',
    source: 'room',
  },
  {
    name: 'trimMaxDb',
    limit: fc.double({ min: 0, max: 20, noNaN: true }),
    build: (l, s) => ({ settings: settingsWith({ trimDb: towards(s, l, 1) }), room: { trimMaxDb: l } }),
    setting: '/channels/0/trimDb',
    source: 'room',
  },
  {
    name: 'eqBandsPerChannel',
    limit: fc.integer({ min: 0, max: 20 }),
    build: (l, s) => ({
      settings: settingsWith({
        eq: Array.from({ length: s === 'outside' ? l + 1 : l }, (_, k) => peak(100 * (k + 1), -1)),
      }),
      room: { eqBandsPerChannel: l },
    }),
    setting: '/channels/0/eq',
    source: 'room',
  },
  {
    name: 'eqMaxBoostDb',
    limit: fc.double({ min: 0.5, max: 20, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ eq: [peak(60, towards(s, l, 1))] }),
      room: { eqMaxBoostDb: l },
    }),
    setting: '/channels/0/eq/0/gainDb',
    source: 'room',
  },
  {
    name: 'eqMaxCutDb',
    limit: fc.double({ min: 0.5, max: 40, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ eq: [peak(60, -towards(s, l, 1))] }),
      room: { eqMaxCutDb: l },
    }),
    setting: '/channels/0/eq/0/gainDb',
    source: 'room',
  },
  {
    name: 'frequencyMinHz',
    limit: fc.double({ min: 10, max: 1000, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ eq: [peak(towards(s, l, -1), -3)] }),
      room: { frequencyMinHz: l },
    }),
    setting: '/channels/0/eq/0/frequencyHz',
    source: 'room',
  },
  {
    name: 'frequencyMaxHz',
    limit: fc.double({ min: 1000, max: 20000, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({
        highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: towards(s, l, 1) },
      }),
      room: { frequencyMaxHz: l },
    }),
    setting: '/channels/0/highPass/frequencyHz',
    source: 'room',
  },
  {
    name: 'sampleRatesHz',
    limit: fc.constantFrom(44100, 48000, 96000),
    // Inside: the rate is one of the profile's; outside: the profile lacks it.
    build: (rate, s) => ({
      settings: settingsWith({}, rate),
      profile: withProfile((p) => {
        p.sampleRatesHz = s === 'inside' ? [rate] : [8000, 192000];
      }),
    }),
    setting: '/sampleRateHz',
    source: 'profile',
  },
  {
    name: 'delay.max',
    limit: fc.integer({ min: 10, max: 9000 }),
    build: (l, s) => ({
      // A delay given in ms checked against a profile that counts samples at 48 kHz.
      settings: settingsWith({ delayMs: (towards(s, l, 1) * 1000) / 48000 }),
      profile: withProfile((p) => {
        p.delay = { unit: 'samples', min: 0, max: l, step: 1 };
      }),
    }),
    setting: '/channels/0/delayMs',
    source: 'profile',
  },
  {
    name: 'delay.min',
    limit: fc.double({ min: 0.01, max: 5, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ delayMs: towards(s, l, -1) }),
      profile: withProfile((p) => {
        p.delay.min = l;
      }),
    }),
    setting: '/channels/0/delayMs',
    source: 'profile',
  },
  {
    name: 'trimDb.max',
    limit: fc.double({ min: 0, max: 20, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ trimDb: towards(s, l, 1) }),
      profile: withProfile((p) => {
        p.trimDb.max = l;
      }),
    }),
    setting: '/channels/0/trimDb',
    source: 'profile',
  },
  {
    name: 'trimDb.min',
    limit: fc.double({ min: -50, max: 0, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ trimDb: towards(s, l, -1) }),
      profile: withProfile((p) => {
        p.trimDb.min = l;
      }),
    }),
    setting: '/channels/0/trimDb',
    source: 'profile',
  },
  {
    name: 'eq.bandsPerChannel',
    limit: fc.integer({ min: 0, max: 16 }),
    build: (l, s) => ({
      settings: settingsWith({
        eq: Array.from({ length: s === 'outside' ? l + 1 : l }, (_, k) => peak(50 * (k + 1), -1)),
      }),
      profile: withProfile((p) => {
        p.eq.bandsPerChannel = l;
      }),
    }),
    setting: '/channels/0/eq',
    source: 'profile',
  },
  {
    name: 'eq.gainDb.max',
    limit: fc.double({ min: 0, max: 20, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ eq: [peak(1000, towards(s, l, 1))] }),
      profile: withProfile((p) => {
        p.eq.gainDb.max = l;
      }),
    }),
    setting: '/channels/0/eq/0/gainDb',
    source: 'profile',
  },
  {
    name: 'eq.gainDb.min',
    limit: fc.double({ min: -40, max: 0, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ eq: [peak(1000, towards(s, l, -1))] }),
      profile: withProfile((p) => {
        p.eq.gainDb.min = l;
      }),
    }),
    setting: '/channels/0/eq/0/gainDb',
    source: 'profile',
  },
  {
    name: 'eq.q.max',
    limit: fc.double({ min: 1, max: 50, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ eq: [peak(1000, -2, towards(s, l, 1))] }),
      profile: withProfile((p) => {
        p.eq.q.max = l;
      }),
    }),
    setting: '/channels/0/eq/0/q',
    source: 'profile',
  },
  {
    name: 'eq.q.min',
    limit: fc.double({ min: 0.1, max: 2, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ eq: [peak(1000, -2, towards(s, l, -1))] }),
      profile: withProfile((p) => {
        p.eq.q.min = l;
      }),
    }),
    setting: '/channels/0/eq/0/q',
    source: 'profile',
  },
  {
    name: 'eq.frequencyHz.max',
    limit: fc.double({ min: 1000, max: 20000, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ eq: [peak(towards(s, l, 1), -2)] }),
      profile: withProfile((p) => {
        p.eq.frequencyHz.max = l;
      }),
    }),
    setting: '/channels/0/eq/0/frequencyHz',
    source: 'profile',
  },
  {
    name: 'eq.frequencyHz.min',
    limit: fc.double({ min: 10, max: 500, noNaN: true }),
    build: (l, s) => ({
      settings: settingsWith({ eq: [peak(towards(s, l, -1), -2)] }),
      profile: withProfile((p) => {
        p.eq.frequencyHz.min = l;
      }),
    }),
    setting: '/channels/0/eq/0/frequencyHz',
    source: 'profile',
  },
];

describe('findLimitViolations: every limit refuses just outside and accepts just inside (property)', () => {
  it.each(KINDS.map((k) => [k.name, k] as const))('%s', (_name, kind) => {
    fc.assert(
      fc.property(kind.limit, (limit) => {
        const inside = kind.build(limit, 'inside');
        expect(findLimitViolations(inside.settings, inside.room, inside.profile)).toEqual([]);
        const outside = kind.build(limit, 'outside');
        const found = findLimitViolations(outside.settings, outside.room, outside.profile);
        expect(found).toHaveLength(1);
        expect(found[0].setting).toBe(kind.setting);
        expect(found[0].limit.name).toBe(kind.name);
        expect(found[0].limit.source).toBe(kind.source);
        expect(found[0].message).toMatch(kind.name);
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });

  it('a filter type the profile lacks is refused with the types it takes', () => {
    const types = FILTER_TYPES.filter((t): t is FilterType => t !== 'notch');
    const profile = withProfile((p) => {
      p.eq.filterTypes = types;
    });
    const notch: FilterSpec = { type: 'notch', frequencyHz: 100, q: 4 };
    const found = findLimitViolations(settingsWith({ eq: [notch] }), null, profile);
    expect(found).toEqual([
      expect.objectContaining({
        setting: '/channels/0/eq/0/type',
        limit: { name: 'eq.filterTypes', value: types, source: 'profile' },
      }),
    ]);
    expect(
      findLimitViolations(settingsWith({ eq: [{ ...notch, type: 'bandPass' }] }), null, profile),
    ).toEqual([]);
  });

  it('the subwoofer low-pass is held to the frequency range', () => {
    const settings: TuningSettings = {
      sampleRateHz: 48000,
      channels: [channel({ id: 'LFE1' })],
      subwoofer: {
        channel: 'LFE1',
        lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 15 },
        lfeGainDb: 10,
      },
    };
    expect(findLimitViolations(settings, { frequencyMinHz: 20 }).map((v) => v.setting)).toEqual([
      '/subwoofer/lowPass/frequencyHz',
    ]);
  });
});

describe('bands that each fit can still add up beyond the boost limit', () => {
  // Two +3 dB peaks at the same frequency are +6 dB there: 20·log10(A²·A²) with A = 10^(3/40)
  // (Audio EQ Cookbook peaking gain at f0 is exactly the band's gain).
  it('two +3 dB peaks at 40 Hz against a +3 dB limit: refused on the channel EQ with the summed figure', () => {
    const found = findLimitViolations(settingsWith({ eq: [peak(40, 3), peak(40, 3)] }), { eqMaxBoostDb: 3 });
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ setting: '/channels/0/eq', limit: { name: 'eqMaxBoostDb', value: 3 } });
    expect(found[0].message).toMatch(/together boost 6 dB at 40 Hz/);
  });

  it('the same two peaks against a +6 dB limit are accepted; bands apart by four octaves too', () => {
    expect(
      findLimitViolations(settingsWith({ eq: [peak(40, 3), peak(40, 3)] }), { eqMaxBoostDb: 6 }),
    ).toEqual([]);
    expect(
      findLimitViolations(settingsWith({ eq: [peak(40, 3, 4), peak(640, 3, 4)] }), { eqMaxBoostDb: 3.01 }),
    ).toEqual([]);
  });

  it('two −8 dB dips together cut 16 dB: allowed by a 12 dB cut limit, which is per band', () => {
    expect(
      findLimitViolations(settingsWith({ eq: [peak(63, -8), peak(63, -8)] }), { eqMaxCutDb: 12 }),
    ).toEqual([]);
  });
});
