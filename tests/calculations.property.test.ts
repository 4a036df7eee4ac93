/**
 * Property-based checks of the calculation endpoints (fast-check): for any request the OpenAPI schema
 * accepts, the answer is a 200 whose numbers are all finite (JSON would turn NaN or Infinity into
 * null) and which matches the documented response schema, or a 422 problem naming a field — never a
 * 500, and never a 400 (the generators only build schema-valid bodies).
 */
import fc from 'fast-check';
import { MAX_EQ_BANDS } from '../shared/limits';
import request from 'supertest';
import { expectToMatchContract } from './support/contract';
import { createTestContext, type TestContext } from './support/test-context';

let ctx: TestContext;
beforeAll(async () => {
  // Hundreds of requests per minute from one key: lift the per-key rate limit for this file.
  ctx = await createTestContext({ env: { DEFAULT_RATE_LIMIT_PER_MINUTE: '1000000' } });
});
afterAll(async () => {
  await ctx.close();
});

const RUNS = 150;
// A fixed seed keeps CI repeatable; FUZZ_SEED explores others (npm run fuzz sets one from the clock).
const SEED = Number(process.env.FUZZ_SEED ?? 20261202);

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
/** A number the schema accepts under `exclusiveMinimum: 0`. */
const positive = (max: number) =>
  fc.double({ min: Number.MIN_VALUE, max, noNaN: true, noDefaultInfinity: true });

const LABELS = [
  'M+030',
  'M-030',
  'M+000',
  'LFE1',
  'LFE2',
  'M+090',
  'M-090',
  'M+135',
  'M-135',
  'U+045',
  'U-045',
  'U+135',
  'U-135',
  'T+000',
];
const label = fc.oneof(fc.constantFrom(...LABELS), fc.string({ minLength: 1, maxLength: 32 }));
const channelLabels = (max: number) => fc.uniqueArray(label, { minLength: 1, maxLength: max });

/** Mostly lengths the core accepts, sometimes strings it must refuse with a 422. */
const distance = fc.oneof(
  { weight: 4, arbitrary: positive(1000) },
  {
    weight: 4,
    arbitrary: fc
      .tuple(num(0.01, 300), fc.constantFrom('m', 'cm', 'mm', 'ft', 'in', 'yd'))
      .map(([v, unit]) => `${v.toPrecision(6)} ${unit}`),
  },
  {
    weight: 1,
    arbitrary: fc
      .tuple(num(-5000, 5000), fc.constantFrom('km', 'kg', 's', 'm^2', '', 'Hz'))
      .map(([v, unit]) => `${v} ${unit}`.slice(0, 40)),
  },
  { weight: 1, arbitrary: fc.string({ minLength: 1, maxLength: 40 }) },
);
const sampleRateHz = fc.oneof(fc.constantFrom(44100, 48000, 96000), fc.integer({ min: 8000, max: 384000 }));
const limits = fc.record(
  {
    delayMaxMs: num(0, 10000),
    trimMinDb: num(-100, 0),
    trimMaxDb: num(0, 40),
    eqBandsPerChannel: fc.integer({ min: 0, max: MAX_EQ_BANDS }),
    eqMaxBoostDb: num(0, 24),
    eqMaxCutDb: num(0, 48),
  },
  { requiredKeys: [] },
);
/** A frequency the schema accepts for filters (1..192000 Hz), mostly below Nyquist at `fs`. */
const filterFrequency = (fs: number) =>
  fc.oneof({ weight: 9, arbitrary: num(1, fs / 2 - 1e-6) }, { weight: 1, arbitrary: num(1, 192000) });
const responseGrid = (fs: number) =>
  fc.oneof(
    fc.record({ frequenciesHz: fc.array(positive(fs / 2), { minLength: 1, maxLength: 40 }) }),
    fc
      .tuple(positive(fs / 2), positive(fs / 2), fc.integer({ min: 1, max: 96 }))
      .map(([a, b, pointsPerOctave]) => ({ fromHz: Math.min(a, b), toHz: Math.max(a, b), pointsPerOctave })),
    fc.record(
      { fromHz: positive(200000), toHz: positive(200000), pointsPerOctave: fc.integer({ min: 1, max: 96 }) },
      { requiredKeys: ['fromHz', 'toHz'] },
    ),
  );
const crossoverPart = (fs: number) =>
  fc.record(
    {
      family: fc.constantFrom('linkwitzRiley', 'butterworth'),
      order: fc.oneof(fc.constantFrom(2, 4, 8), fc.integer({ min: 1, max: 8 })),
      frequencyHz: filterFrequency(fs),
    },
    { requiredKeys: [] },
  );

const delaysBody = fc
  .record(
    {
      channels: channelLabels(40).chain((labels) =>
        fc.tuple(
          ...labels.map((l) =>
            fc.oneof(
              fc.record({ id: fc.constant(l), distance }),
              fc.record({ id: fc.constant(l), arrivalMs: num(0, 1000) }),
            ),
          ),
        ),
      ),
      air: fc.oneof(
        fc.constant({}),
        fc.record({ temperatureC: num(-40, 60) }),
        fc.record({ speedOfSoundMps: num(300, 400) }),
      ),
      sampleRateHz,
      limits,
    },
    { requiredKeys: ['channels', 'air'] },
  )
  .map(({ air, ...rest }) => ({ ...rest, ...air }));

const levelsBody = fc.record(
  {
    channels: channelLabels(40).chain((labels) =>
      fc.tuple(
        ...labels.map((l) =>
          fc
            .record(
              {
                id: fc.constant(l),
                source: fc.oneof(fc.record({ measuredDb: num(-150, 150) }), fc.record({ distance })),
                targetOffsetDb: num(-40, 40),
              },
              { requiredKeys: ['id', 'source'] },
            )
            .map(({ source, ...rest }) => ({ ...rest, ...source })),
        ),
      ),
    ),
    targetDb: num(-150, 150),
    levelAt1mDb: num(-150, 150),
    limits,
  },
  { requiredKeys: ['channels'] },
);

/** A filter of one type with the parameters that type takes, or (rarely) any schema-valid mix. */
const filterSpec = (fs: number) =>
  fc.oneof(
    {
      weight: 9,
      arbitrary: fc
        .constantFrom(
          'peaking',
          'lowShelf',
          'highShelf',
          'lowPass',
          'highPass',
          'bandPass',
          'notch',
          'allPass',
        )
        .chain((type) => {
          const gained = type === 'peaking' || type === 'lowShelf' || type === 'highShelf';
          const shape =
            type === 'lowShelf' || type === 'highShelf'
              ? fc.oneof(
                  fc.constant({}),
                  fc.record({ q: num(0.025, 100) }),
                  fc.record({ shelfSlope: num(0.01, 1) }),
                )
              : type === 'peaking' || type === 'bandPass' || type === 'notch'
                ? fc.oneof(
                    fc.constant({}),
                    fc.record({ q: num(0.025, 100) }),
                    fc.record({ bandwidthOctaves: num(0.01, 8) }),
                  )
                : fc.oneof(fc.constant({}), fc.record({ q: num(0.025, 100) }));
          return fc.tuple(filterFrequency(fs), num(-48, 24), shape).map(([frequencyHz, gainDb, extra]) => ({
            type,
            frequencyHz,
            ...(gained ? { gainDb } : {}),
            ...extra,
          }));
        }),
    },
    {
      weight: 1,
      arbitrary: fc.record(
        {
          type: fc.constantFrom(
            'peaking',
            'lowShelf',
            'highShelf',
            'lowPass',
            'highPass',
            'bandPass',
            'notch',
            'allPass',
          ),
          frequencyHz: num(1, 192000),
          gainDb: num(-48, 24),
          q: num(0.025, 100),
          bandwidthOctaves: num(0.01, 8),
          shelfSlope: num(0.01, 1),
        },
        { requiredKeys: ['type', 'frequencyHz'] },
      ),
    },
  );
const biquadsBody = sampleRateHz.chain((fs) =>
  fc.record(
    {
      filters: fc.array(filterSpec(fs), { minLength: 1, maxLength: 8 }),
      sampleRateHz: fc.constant(fs),
      response: responseGrid(fs),
      limits,
    },
    { requiredKeys: ['filters', 'sampleRateHz'] },
  ),
);

const crossoversBody = sampleRateHz.chain((fs) =>
  fc.record(
    {
      family: fc.constantFrom('linkwitzRiley', 'butterworth'),
      order: fc.oneof(fc.constantFrom(2, 4, 8), fc.integer({ min: 1, max: 8 })),
      frequencyHz: filterFrequency(fs),
      sampleRateHz: fc.constant(fs),
      response: responseGrid(fs),
    },
    { requiredKeys: ['family', 'order', 'frequencyHz', 'sampleRateHz'] },
  ),
);

const bassBody = sampleRateHz.chain((fs) =>
  fc.record(
    {
      channels: channelLabels(40).chain((labels) =>
        fc.tuple(
          ...labels.map((l) =>
            fc
              .record(
                {
                  id: fc.constant(l),
                  bassManaged: l.startsWith('LFE') ? fc.constant(false) : fc.boolean(),
                  crossover: fc.oneof(
                    { weight: 4, arbitrary: fc.constant(undefined) },
                    { weight: 1, arbitrary: crossoverPart(fs) },
                  ),
                },
                { requiredKeys: ['id'] },
              )
              .map((c) =>
                c.crossover === undefined || !c.bassManaged ? { id: c.id, bassManaged: c.bassManaged } : c,
              ),
          ),
        ),
      ),
      crossover: crossoverPart(fs),
      lfeGainDb: num(-40, 20),
      subwooferCount: fc.integer({ min: 1, max: 16 }),
      sampleRateHz: fc.constant(fs),
      headroomWarningDb: num(0, 60),
    },
    { requiredKeys: ['channels', 'sampleRateHz'] },
  ),
);

/** Every number in the document is finite and nothing is null. */
function allFinite(value: unknown, path = ''): string | null {
  if (value === null) return `${path} is null`;
  if (typeof value === 'number') return Number.isFinite(value) ? null : `${path} is ${value}`;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const bad = allFinite(value[i], `${path}/${i}`);
      if (bad) return bad;
    }
  } else if (typeof value === 'object' && value !== undefined) {
    for (const [key, v] of Object.entries(value as object)) {
      const bad = allFinite(v, `${path}/${key}`);
      if (bad) return bad;
    }
  }
  return null;
}

const endpoints = [
  ['/v1/delays', 'computeDelays', delaysBody],
  ['/v1/levels', 'computeLevels', levelsBody],
  ['/v1/biquads', 'designBiquads', biquadsBody],
  ['/v1/crossovers', 'designCrossover', crossoversBody],
  ['/v1/bass-management', 'planBassManagement', bassBody],
] as const;

describe.each(endpoints)('POST %s with any schema-valid body', (path, operationId, body) => {
  it('answers 200 with finite numbers matching the contract, or 422 naming a field — never 400 or 500', async () => {
    const statuses = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(body as fc.Arbitrary<object>, async (payload) => {
        const res = await request(ctx.app)
          .post(path)
          .set('Authorization', `Bearer ${ctx.keys.calculate}`)
          .send(payload);
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
        if (res.status === 200) {
          const bad = allFinite(res.body);
          if (bad) throw new Error(`${bad} in ${JSON.stringify(payload).slice(0, 400)}`);
          expectToMatchContract(operationId, 200, res.body);
          return;
        }
        if (res.status !== 422) {
          throw new Error(
            `${res.status} ${JSON.stringify(res.body).slice(0, 300)} for ${JSON.stringify(payload).slice(0, 400)}`,
          );
        }
        expect(res.body.errors?.[0]?.pointer).toMatch(/^\/body\//);
      }),
      { numRuns: RUNS, seed: SEED },
    );
    // The generators must reach the calculation: most bodies should compute, not all be refused.
    expect(statuses.get(200) ?? 0).toBeGreaterThan(RUNS / 10);
  });
});
