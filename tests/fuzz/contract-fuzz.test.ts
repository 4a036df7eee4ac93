import fc from 'fast-check';
import request from 'supertest';
import type { OpenAPIV3_1 } from 'openapi-types';
import {
  listOperations,
  resolveParameter as resolveDocumentParameter,
  type OpenApiOperation,
  type OpenApiParameter,
} from '../../api/openapi/document';
import { getContract } from '../../api/http/validate';
import { STAGE3_ROOM } from '../../seeds/demo-stage3-room';
import { CONSOLE_HEADERS, givePasswords, signedInAgent } from '../support/console-session';
import { createTestContext, type TestContext } from '../support/test-context';
import { fromSchema, hostileString, hostileValue, mutate } from './schema-arbitrary';

/**
 * Drives every operation of the OpenAPI contract with generated requests (fast-check): path and query
 * parameters from their schemas or hostile strings, bodies generated from the schemas and then mutated
 * (a value replaced, a key dropped or added), random JSON, random files for uploads, as every kind of
 * caller. Any 5xx fails, with the request that caused it after shrinking. A fixed seed and a few runs per
 * operation in CI (`FUZZ_RUNS`, default 12); `npm run fuzz` runs many more with a seed of its own.
 */

const SEED = Number(process.env.FUZZ_SEED ?? 20261202);
const RUNS = Number(process.env.FUZZ_RUNS ?? 12);

const { document } = getContract();
const doc = document as unknown as Record<string, unknown>;
const operations = listOperations(document);

let ctx: TestContext;
let sessions: Record<'viewer' | 'developer' | 'admin', ReturnType<typeof request.agent>>;

beforeAll(async () => {
  ctx = await createTestContext({
    env: {
      // Thousands of calls from a few keys: no rate limit may hide a handler behind a 429.
      DEFAULT_RATE_LIMIT_PER_MINUTE: '1000000',
      USER_RATE_LIMIT_PER_MINUTE: '10000000',
      MAX_ACTIVE_KEYS_PER_USER: '10000',
      // Generated requests come from addresses of their own (X-Forwarded-For), so the sign-in throttle
      // they trip never holds up the test's own sign-ins from 127.0.0.1.
      TRUST_PROXY_HOPS: '1',
    },
  });
  await givePasswords(ctx);
  sessions = {
    viewer: await signedInAgent(ctx, 'viewer'),
    developer: await signedInAgent(ctx, 'developer'),
    admin: await signedInAgent(ctx, 'admin'),
  };
}, 60_000);
afterAll(async () => {
  await ctx.close();
});

interface Fixtures {
  roomId: string;
  tuningId: string;
  measurementId: string;
  keyId: string;
  userId: string;
}

/** Fresh things for the path parameters to name; destructive operations only ever hit these. */
async function fixtures(): Promise<Fixtures> {
  const tuningKey = { Authorization: `Bearer ${ctx.keys.tuning}` };
  const admin = { Authorization: `Bearer ${ctx.keys.admin}` };
  const room = await request(ctx.app).post('/v1/rooms').set(tuningKey).send(structuredClone(STAGE3_ROOM));
  const tuning = await request(ctx.app)
    .post(`/v1/rooms/${room.body.id}/tunings`)
    .set(tuningKey)
    .send({ name: 'Fuzz', channels: [{ id: 'M+030', trimDb: -1 }] });
  const measurement = await request(ctx.app)
    .post(`/v1/rooms/${room.body.id}/measurements`)
    .set(tuningKey)
    .send({ kind: 'spl', channel: 'M+030', splDb: 80 });
  const key = await request(ctx.app)
    .post('/v1/keys')
    .set(admin)
    .send({ name: 'Sacrificial', role: 'calculate', ownerId: ctx.users.other });
  const user = await request(ctx.app)
    .post('/v1/users')
    .set(admin)
    .send({ email: `fuzz-${Date.now()}-${Math.random()}@test.example`.slice(0, 60), role: 'developer' });
  return {
    roomId: room.body.id,
    tuningId: tuning.body.id,
    measurementId: measurement.body.id,
    keyId: key.body.id,
    userId: user.body.user.id,
  };
}

type Caller =
  'none' | 'calculate' | 'tuning' | 'admin' | 'otherTuning' | 'viewer' | 'developer' | 'adminSession';
const CALLERS: Caller[] = [
  'none',
  'calculate',
  'tuning',
  'admin',
  'otherTuning',
  'viewer',
  'developer',
  'adminSession',
];

interface GeneratedRequest {
  caller: Caller;
  consoleHeader: boolean;
  path: Record<string, string>;
  query: Record<string, unknown>;
  body: { kind: 'none' } | { kind: 'json'; value: unknown } | { kind: 'raw'; text: string } | UploadBody;
}
interface UploadBody {
  kind: 'upload';
  fields: Record<string, unknown>;
  file: Uint8Array | null;
  fileName: string;
}

function pathValues(name: string, fix: Fixtures): string[] {
  switch (name) {
    case 'roomId':
      return [fix.roomId, 'room_0000000000000000000000'];
    case 'tuningId':
      return [fix.tuningId, 'tun_0000000000000000000000'];
    case 'measurementId':
      return [fix.measurementId, 'meas_000000000000000000000'];
    case 'keyId':
      return [fix.keyId, 'key_0000000000000000000000'];
    case 'userId':
      return [fix.userId, 'usr_0000000000000000000000'];
    case 'version':
      return ['1', '2', '999999', '0', '-1', '1.5'];
    case 'layoutId':
      return ['7.1.4', 'J', 'bs2051-j', '9.1.6', 'stereo'];
    default:
      return ['x'];
  }
}

const resolveParameter = (p: OpenApiParameter | OpenAPIV3_1.ReferenceObject): OpenApiParameter =>
  resolveDocumentParameter(document, p);

function requestArbitrary(
  route: string,
  operation: OpenApiOperation,
  fix: Fixtures,
): fc.Arbitrary<GeneratedRequest> {
  const pathNames = [...route.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
  const path = fc.record(
    Object.fromEntries(
      pathNames.map((name) => [
        name,
        fc.oneof({ weight: 8, arbitrary: fc.constantFrom(...pathValues(name, fix)) }, hostileString),
      ]),
    ),
  ) as fc.Arbitrary<Record<string, string>>;

  const queryParameters = (operation.parameters ?? []).map(resolveParameter).filter((p) => p.in === 'query');
  // Each parameter is left out a third of the time; an unknown one comes one time in ten.
  const query = fc.record({
    ...Object.fromEntries(
      queryParameters.map((p) => [
        p.name,
        fc.option(
          fc.oneof(
            { weight: 3, arbitrary: fromSchema(doc, p.schema) },
            { weight: 1, arbitrary: hostileString },
            ...(p.name === 'tuningId' || p.name === 'left' || p.name === 'right'
              ? [{ weight: 4, arbitrary: fc.constant(fix.tuningId) }]
              : []),
          ),
          { nil: undefined, freq: 3 },
        ),
      ]),
    ),
    unexpected: fc.oneof(
      { weight: 9, arbitrary: fc.constant(undefined) },
      { weight: 1, arbitrary: hostileString },
    ),
  }) as fc.Arbitrary<Record<string, unknown>>;

  const content = (operation.requestBody as OpenAPIV3_1.RequestBodyObject | undefined)?.content ?? {};
  const bodies: Array<fc.WeightedArbitrary<GeneratedRequest['body']>> = [
    // An operation without a body mostly gets none, so that its parameters and callers are what varies.
    { weight: operation.requestBody ? 1 : 12, arbitrary: fc.constant({ kind: 'none' as const }) },
    {
      weight: 1,
      arbitrary: fc.jsonValue({ maxDepth: 3 }).map((value) => ({ kind: 'json' as const, value })),
    },
    {
      weight: 1,
      arbitrary: fc
        .constantFrom('{', '[1,2', '{"a":1}}', 'null', '"text"', '{"__proto__":{"polluted":1}}', '\u0000')
        .map((text) => ({ kind: 'raw' as const, text })),
    },
  ];
  const json = content['application/json'];
  if (json?.schema) {
    // The documented examples are valid requests that reach the handlers; schema-generated bodies reach
    // corners the examples do not. Both are sent as they are and with one thing broken.
    const examples = Object.values(
      (json as { examples?: Record<string, { value?: unknown }> }).examples ?? {},
    )
      .map((example) => example.value)
      .filter((value) => value !== undefined);
    const valid = fc.oneof(
      ...(examples.length > 0 ? [{ weight: 2, arbitrary: fc.constantFrom(...examples) }] : []),
      { weight: 1, arbitrary: fromSchema(doc, json.schema) },
    );
    bodies.push({ weight: 5, arbitrary: valid.map((value) => ({ kind: 'json' as const, value })) });
    bodies.push({
      weight: 6,
      arbitrary: fc
        .tuple(valid, fc.array(fc.nat(), { minLength: 1, maxLength: 5 }), hostileValue, fc.nat())
        .map(([value, at, replacement, action]) => ({
          kind: 'json' as const,
          value: mutate(value, at, replacement, action),
        })),
    });
  }
  const multipart = content['multipart/form-data']?.schema;
  if (multipart) {
    const fields = fromSchema(doc, multipart).map((value) => {
      const { file: _file, ...rest } = (value ?? {}) as Record<string, unknown>;
      return rest;
    });
    const wavHeader = Buffer.from('RIFF\u00ff\u00ff\u00ff\u00ffWAVEfmt ', 'latin1');
    const file = fc.oneof(
      fc.constant(null),
      fc.uint8Array({ maxLength: 512 }),
      fc.uint8Array({ maxLength: 512 }).map((tail) => new Uint8Array([...wavHeader, ...tail])),
      fc
        .array(fc.tuple(fc.double({ min: 1, max: 40000, noNaN: true }), fc.double({ noNaN: true })), {
          maxLength: 6,
        })
        .map((rows) => new Uint8Array(Buffer.from(rows.map(([f, db]) => `${f} ${db}`).join('\n')))),
    );
    bodies.push({
      weight: 6,
      arbitrary: fc
        .record({ fields, file, fileName: fc.constantFrom('ir.wav', 'response.txt', 'x', '../../x.wav') })
        .map((upload) => ({ kind: 'upload' as const, ...upload })),
    });
  }
  return fc.record({
    caller: fc.constantFrom(...CALLERS),
    consoleHeader: fc.boolean(),
    path,
    query,
    body: fc.oneof(...bodies),
  });
}

function urlOf(route: string, generated: GeneratedRequest): string {
  return (
    route.replace(/\{(\w+)\}/g, (_m, name: string) => encodeURIComponent(generated.path[name] ?? '')) +
    queryString(generated.query)
  );
}

function send(method: string, route: string, generated: GeneratedRequest): request.Test {
  const url = urlOf(route, generated);
  const sessionCaller = { viewer: 'viewer', developer: 'developer', adminSession: 'admin' } as const;
  const agent =
    generated.caller in sessionCaller
      ? sessions[sessionCaller[generated.caller as keyof typeof sessionCaller]]
      : request(ctx.app);
  let req = (agent as unknown as Record<string, (url: string) => request.Test>)[method](url);
  if (generated.caller in ctx.keys) {
    req = req.set('Authorization', `Bearer ${ctx.keys[generated.caller as keyof TestContext['keys']]}`);
  }
  if (generated.consoleHeader) req = req.set(CONSOLE_HEADERS);
  req = req.set('X-Forwarded-For', '203.0.113.77');
  const body = generated.body;
  if (body.kind === 'json')
    req = req.set('Content-Type', 'application/json').send(JSON.stringify(body.value));
  if (body.kind === 'raw') req = req.set('Content-Type', 'application/json').send(body.text);
  if (body.kind === 'upload') {
    for (const [name, value] of Object.entries(body.fields)) {
      req = req.field(name, typeof value === 'string' ? value : (JSON.stringify(value) ?? ''));
    }
    if (body.file) req = req.attach('file', Buffer.from(body.file), body.fileName);
    else req = req.field('nothing', '');
  }
  return req;
}

function queryString(query: Record<string, unknown>): string {
  const params = new URLSearchParams();
  for (const [name, value] of Object.entries(query)) {
    if (value === undefined) continue;
    params.append(name, typeof value === 'string' ? value : JSON.stringify(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}

describe('every operation of the contract under generated and hostile requests', () => {
  it.each(operations.map((o, i) => [`${o.method.toUpperCase()} ${o.route}`, o, i] as const))(
    '%s never answers 5xx',
    async (_name, { method, route, operation }, index) => {
      const fix = await fixtures();
      const statuses = new Map<number, number>();
      // Sessions may have been signed out by an earlier operation's generated request.
      if (route.startsWith('/auth')) {
        sessions.viewer = await signedInAgent(ctx, 'viewer');
        sessions.developer = await signedInAgent(ctx, 'developer');
        sessions.admin = await signedInAgent(ctx, 'admin');
      }
      await fc.assert(
        fc.asyncProperty(requestArbitrary(route, operation, fix), async (generated) => {
          const res = await send(method, route, generated);
          statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
          if (res.status >= 500) {
            throw new Error(
              `${method.toUpperCase()} ${urlOf(route, generated)} answered ${res.status}: ${res.text.slice(0, 300)}`,
            );
          }
        }),
        { seed: SEED + index, numRuns: RUNS, endOnFailure: false },
      );
      if (process.env.FUZZ_VERBOSE) {
        console.log(
          `${method.toUpperCase()} ${route}: ${JSON.stringify(Object.fromEntries([...statuses].sort()))}`,
        );
      }
    },
    600_000,
  );
});
