import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import {
  listOperations,
  loadOpenApiDocument,
  resolveParameter,
  resolveRef,
  type OpenApiDocument,
} from '../../api/openapi/document';
import { MAX_CHANNELS } from '../../shared/limits';
import { createTestContext, type TestContext } from '../support/test-context';

let ctx: TestContext;
const document = loadOpenApiDocument();
const asAdmin = () => ({ Authorization: `Bearer ${ctx.keys.admin}` });

beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

type Errors = Array<{ pointer: string; message: string }>;
const pointers = (body: { errors?: Errors }) => (body.errors ?? []).map((e) => e.pointer);

/** 65,536 copies of one value: far past every `maxItems` in the contract. */
const many = (value: unknown) => Array.from({ length: 65_536 }, () => value);

describe('a request body with a huge array (validation time linear in the body)', () => {
  it.each([
    ['/v1/delays', { channels: many(1) }, '/body/channels'],
    ['/v1/delays', { channels: many({ id: 'M+030', distance: 3 }) }, '/body/channels'],
    ['/v1/levels', { channels: many(1) }, '/body/channels'],
    ['/v1/biquads', { filters: many(1) }, '/body/filters'],
    ['/v1/plans', { layout: '7.1.4', channels: many(1) }, '/body/channels'],
    ['/v1/bass-management', { channels: many({ id: 'M+030' }) }, '/body/channels'],
    [
      '/v1/geometry',
      { room: { widthM: 5, lengthM: 6, heightM: 3 }, listener: { x: 2, y: 2, z: 1 }, speakers: many(1) },
      '/body/speakers',
    ],
    [
      '/v1/eq/fit',
      { measured: { frequenciesHz: many(100), magnitudeDb: many(0) }, maxBands: 4 },
      '/body/measured',
    ],
    [
      '/v1/rooms',
      {
        name: 'Hostile',
        layout: '7.1.4',
        dimensions: { widthM: 5, lengthM: 6, heightM: 3 },
        listener: { x: 2, y: 2, z: 1 },
        loudspeakers: many(1),
      },
      '/body/loudspeakers',
    ],
  ])('POST %s answers 400 naming the array, with a short error list', async (path, body, field) => {
    const res = await request(ctx.app).post(path).set(asAdmin()).send(body);
    expect(res.status).toBe(400);
    expect(res.body.errors.length).toBeGreaterThan(0);
    expect(res.body.errors.length).toBeLessThanOrEqual(50);
    expect(pointers(res.body).every((p) => p.startsWith(field))).toBe(true);
  });

  it('lists every bad field of a small body', async () => {
    const res = await request(ctx.app)
      .post('/v1/delays')
      .set(asAdmin())
      .send({ temperatureC: 999, channels: [{ id: 'M+030', distance: -1 }, { id: '' }], extra: 1 });
    expect(res.status).toBe(400);
    expect(pointers(res.body)).toEqual(
      expect.arrayContaining(['/body/temperatureC', '/body/channels/1/id', '/body/extra']),
    );
  });

  it('caps the listed errors at 50 and says how many there were', async () => {
    const res = await request(ctx.app)
      .post('/v1/delays')
      .set(asAdmin())
      .send({ channels: Array.from({ length: MAX_CHANNELS }, () => ({ id: '' })) });
    expect(res.status).toBe(400);
    expect(res.body.errors).toHaveLength(50);
    expect(res.body.detail).toMatch(/ (\d+) invalid fields; the first 50 are listed/);
  });
});

describe('a request body with 130,000 unknown keys', () => {
  const hostile = () => Object.fromEntries(Array.from({ length: 130_000 }, (_, i) => [`k${i}`, 1]));

  it.each([
    ['/v1/delays', () => ({ channels: [{ id: 'M+030', distance: 3 }], ...hostile() })],
    ['/v1/delays', () => ({ channels: [{ id: 'M+030', distance: 3, ...hostile() }] })],
    ['/v1/biquads', () => ({ filters: [{ type: 'peaking', frequencyHz: 100 }], ...hostile() })],
    ['/v1/keys', () => ({ name: 'k', role: 'calculate', ...hostile() })],
    ['/v1/rooms', () => hostile()],
  ])('POST %s answers 400, not 500', async (path, body) => {
    const res = await request(ctx.app).post(path).set(asAdmin()).send(body());
    expect(res.status).toBe(400);
    expect(res.body.errors.length).toBeLessThanOrEqual(50);
  });
});

describe('the contract bounds every array of a request', () => {
  it('gives every array reachable from a request body or parameter a maxItems', () => {
    const unbounded: string[] = [];
    const seen = new Set<object>();
    const walk = (node: unknown, where: string): void => {
      if (typeof node !== 'object' || node === null || seen.has(node)) return;
      seen.add(node);
      const schema = node as Record<string, unknown>;
      if (typeof schema.$ref === 'string') return walk(resolveRef(document, schema.$ref), schema.$ref);
      const types = ([] as unknown[]).concat(schema.type ?? []);
      if (types.includes('array') && schema.maxItems === undefined) unbounded.push(where);
      for (const [key, value] of Object.entries(schema)) {
        if (key !== 'examples' && key !== 'example') walk(value, `${where}/${key}`);
      }
    };
    for (const { method, route, operation } of listOperations(document)) {
      walk(operation.requestBody, `${method} ${route}`);
      walk(operation.parameters, `${method} ${route}`);
    }
    expect(unbounded).toEqual([]);
  });
});

/** An id parameter: a path parameter, a cursor, or a query parameter naming a stored resource. */
function isIdParameter(parameter: OpenApiParameter): boolean {
  return (
    parameter.in === 'path' ||
    parameter.name === 'startingAfter' ||
    /Id$/.test(parameter.name) ||
    ['left', 'right', 'channel'].includes(parameter.name)
  );
}
type OpenApiParameter = OpenAPIV3_1.ParameterObject;

function schemaOf(doc: OpenApiDocument, parameter: OpenApiParameter): OpenAPIV3_1.SchemaObject {
  const schema = parameter.schema as OpenAPIV3_1.SchemaObject | OpenAPIV3_1.ReferenceObject;
  return '$ref' in schema ? resolveRef<OpenAPIV3_1.SchemaObject>(doc, schema.$ref) : schema;
}

/** A value each id parameter accepts, so that only the parameter under test is wrong. */
const VALID: Record<string, string> = {
  roomId: 'room_0mf3x1c2a9f8a7b6c5d4e',
  tuningId: 'tun_0mf3x2a1b9f8a7b6c5d4e',
  measurementId: 'meas_0mf3x1c2a9f8a7b6c5d4e',
  userId: 'usr_0mf3x1c1z1a2b3c4d5e6f',
  keyId: 'key_0mf3x1c1z1a2b3c4d5e6f',
  layoutId: '7.1.4',
  version: '1',
};

const idCases = listOperations(document)
  .filter(({ route }) => route.startsWith('/v1/'))
  .flatMap(({ method, route, operation }) =>
    (operation.parameters ?? [])
      .map((p) => resolveParameter(document, p))
      .filter(isIdParameter)
      .map((parameter) => ({ method, route, operation, parameter })),
  );

describe('every id parameter and cursor', () => {
  it('has a pattern (or is an integer) in the contract', () => {
    const loose = idCases
      .filter(({ parameter }) => {
        const schema = schemaOf(document, parameter);
        return schema.type !== 'integer' && schema.pattern === undefined;
      })
      .map(({ method, route, parameter }) => `${method} ${route} ${parameter.name}`);
    expect(loose).toEqual([]);
  });

  it.each(
    idCases.flatMap(({ method, route, parameter }) =>
      // A channel is a free label (`M+030`); ids and cursors allow only their own characters.
      (parameter.name === 'channel'
        ? ['\u0000', 'M\u0000', '\u001b[2J']
        : ['\u0000', 'x\u0000y', '../..', '\u202e']
      ).map(
        (bad) =>
          [
            `${method.toUpperCase()} ${route} ${parameter.in} ${parameter.name} = ${JSON.stringify(bad)}`,
            method,
            route,
            parameter,
            bad,
          ] as const,
      ),
    ),
  )('%s answers 400 naming the field', async (_name, method, route, parameter, bad) => {
    const path = route.replace(/\{(\w+)\}/g, (_m, name: string) =>
      encodeURIComponent(name === parameter.name ? bad : VALID[name]),
    );
    const query = parameter.in === 'query' ? `?${parameter.name}=${encodeURIComponent(bad)}` : '';
    const agent = request(ctx.app);
    const res = await agent[method as 'get'](path + query).set(asAdmin());
    expect(res.status).toBe(400);
    const field = `/${parameter.in === 'path' ? 'params' : 'query'}/${parameter.name}`;
    // A NUL in the path is refused before routing (api/http/nul-guard.ts), which names the path.
    const named = bad.includes('\u0000') && parameter.in === 'path' ? ['/path', field] : [field];
    expect(pointers(res.body).some((p) => named.includes(p))).toBe(true);
  });
});
