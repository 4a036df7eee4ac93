import Ajv2020 from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import fc from 'fast-check';
import { loadOpenApiDocument } from '../../../../api/openapi/document';
import { listOperations } from './openapi-operations';
import type { JsonSchema, OpenApiDocument } from './openapi-types';
import { checkAgainstSchema } from './schema-check';

// The reference validator is ajv 8 in JSON Schema 2020-12 mode with ajv-formats — the same engine the
// server validates requests with. The console's checker must give the same verdict on the contract.
const document = loadOpenApiDocument() as unknown as OpenApiDocument;
const ajv = new Ajv2020({ strict: false, allErrors: true });
addFormats(ajv);
ajv.addSchema(document as object, 'contract');

function ajvAccepts(pointer: string, value: unknown): boolean {
  return ajv.validate({ $ref: `contract#${pointer}` }, value) as boolean;
}

function escape(segment: string): string {
  return segment.replace(/~/g, '~0').replace(/\//g, '~1');
}

const bodies = listOperations(document).flatMap((operation) => {
  if (!operation.bodySchema || operation.unsupported || !operation.bodyType) return [];
  const pointer = `/paths/${escape(operation.path)}/${operation.method.toLowerCase()}/requestBody/content/${escape(operation.bodyType)}/schema`;
  return [{ operation, pointer }];
});

describe('checkAgainstSchema on hand-made cases', () => {
  const schema: JsonSchema = {
    type: 'object',
    additionalProperties: false,
    required: ['sampleRateHz', 'filters'],
    properties: {
      sampleRateHz: { type: 'integer', minimum: 8000, maximum: 384000 },
      filters: {
        type: 'array',
        minItems: 1,
        maxItems: 2,
        items: {
          type: 'object',
          required: ['type'],
          properties: {
            type: { enum: ['peaking', 'lowShelf'] },
            frequencyHz: { type: 'number', exclusiveMinimum: 0 },
            q: { oneOf: [{ type: 'number', minimum: 0.1 }, { type: 'null' }] },
            note: { type: 'string', minLength: 1, maxLength: 5, pattern: '^[a-z]+$' },
          },
        },
      },
    },
  };

  it('accepts a valid request', () => {
    expect(
      checkAgainstSchema(
        { sampleRateHz: 48000, filters: [{ type: 'peaking', frequencyHz: 63, q: null }] },
        schema,
        {},
      ),
    ).toEqual([]);
  });

  it('names every bad field with a JSON pointer and a plain message', () => {
    const problems = checkAgainstSchema(
      {
        sampleRateHz: 44100.5,
        extra: 1,
        filters: [{ type: 'notch', frequencyHz: 0, q: 0.01, note: 'ABCDEFG' }, {}, {}],
      },
      schema,
      {},
    );
    expect(problems).toEqual(
      expect.arrayContaining([
        { pointer: '/sampleRateHz', message: 'must be integer, not number' },
        { pointer: '/extra', message: 'is not a known field' },
        { pointer: '/filters', message: 'must have at most 2 items' },
        { pointer: '/filters/0/type', message: 'must be one of "peaking", "lowShelf"' },
        { pointer: '/filters/0/frequencyHz', message: 'must be > 0' },
        { pointer: '/filters/0/q', message: 'must be ≥ 0.1' },
        { pointer: '/filters/0/note', message: 'must have at most 5 characters' },
        { pointer: '/filters/0/note', message: 'must match ^[a-z]+$' },
        { pointer: '/filters/1/type', message: 'is required' },
      ]),
    );
  });

  it('names the allowed forms when a value matches none of a oneOf by type', () => {
    expect(
      checkAgainstSchema({ sampleRateHz: 48000, filters: [{ type: 'peaking', q: 'wide' }] }, schema, {}),
    ).toEqual([{ pointer: '/filters/0/q', message: 'must be number or null' }]);
  });

  it('checks a full date as ajv-formats does: the form and a day that exists', () => {
    const day: JsonSchema = { type: 'string', format: 'date' };
    for (const value of ['2026-03-14', '2024-02-29', '2000-02-29']) {
      expect({ value, problems: checkAgainstSchema(value, day, {}) }).toEqual({ value, problems: [] });
      expect(ajv.validate(day, value)).toBe(true);
    }
    for (const value of ['3.2 m', '2026-3-14', '2026-02-29', '1900-02-29', '2026-13-01', '2026-04-31', '']) {
      expect({ value, problems: checkAgainstSchema(value, day, {}) }).toEqual({
        value,
        problems: [{ pointer: '', message: 'must be an RFC 3339 date such as 2026-03-14' }],
      });
      expect(ajv.validate(day, value)).toBe(false);
    }
  });

  it('resolves local references against the root document', () => {
    const root = { components: { schemas: { Rate: { type: 'integer', minimum: 8000 } } } };
    expect(checkAgainstSchema(4000, { $ref: '#/components/schemas/Rate' }, root)).toEqual([
      { pointer: '', message: 'must be ≥ 8000' },
    ]);
  });

  it('escapes ~ and / in field names as RFC 6901 requires', () => {
    expect(checkAgainstSchema({ 'a/b': 1, 'c~d': 2 }, { additionalProperties: false }, {})).toEqual([
      { pointer: '/a~1b', message: 'is not a known field' },
      { pointer: '/c~0d', message: 'is not a known field' },
    ]);
  });
});

describe('checkAgainstSchema on the contract', () => {
  it('finds request bodies with examples to check', () => {
    expect(bodies.filter(({ operation }) => operation.examples.length > 0).length).toBeGreaterThanOrEqual(3);
  });

  it('accepts every documented request example, as ajv does', () => {
    for (const { operation, pointer } of bodies) {
      for (const example of operation.examples) {
        expect({ id: operation.id, example: example.name, ajv: ajvAccepts(pointer, example.value) }).toEqual({
          id: operation.id,
          example: example.name,
          ajv: true,
        });
        expect({
          id: operation.id,
          problems: checkAgainstSchema(example.value, operation.bodySchema, document),
        }).toEqual({
          id: operation.id,
          problems: [],
        });
      }
    }
  });

  it('gives the same verdict as ajv on damaged examples', () => {
    const withExamples = bodies.filter(({ operation }) => operation.examples.length > 0);
    const damage = fc.record({
      body: fc.constantFrom(...withExamples),
      exampleIndex: fc.nat(),
      pathChoice: fc.nat(),
      replacement: fc.oneof(
        fc.jsonValue({ maxDepth: 2 }),
        fc.double({ noNaN: true, noDefaultInfinity: true }),
        fc.integer({ min: -1_000_000, max: 1_000_000 }),
        fc.constantFrom(null, '', 'peaking', '3.2 m', 0, -1, 48000, 1e9),
      ),
      remove: fc.boolean(),
    });
    fc.assert(
      fc.property(damage, ({ body, exampleIndex, pathChoice, replacement, remove }) => {
        const example = body.operation.examples[exampleIndex % body.operation.examples.length];
        const value = structuredClone(example.value) as unknown;
        const paths = collectPaths(value);
        const target = paths[pathChoice % paths.length];
        const damaged = target.length === 0 ? replacement : setAt(value, target, replacement, remove);
        const mine = checkAgainstSchema(damaged, body.operation.bodySchema, document).length === 0;
        expect({ id: body.operation.id, damaged, verdict: mine }).toEqual({
          id: body.operation.id,
          damaged,
          verdict: ajvAccepts(body.pointer, damaged),
        });
      }),
      { numRuns: 400 },
    );
  });
});

function collectPaths(value: unknown, prefix: Array<string | number> = []): Array<Array<string | number>> {
  const paths: Array<Array<string | number>> = [prefix];
  if (Array.isArray(value)) value.forEach((item, i) => paths.push(...collectPaths(item, [...prefix, i])));
  else if (value && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) paths.push(...collectPaths(item, [...prefix, key]));
  }
  return paths;
}

function setAt(root: unknown, path: Array<string | number>, replacement: unknown, remove: boolean): unknown {
  let node = root as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  const last = path[path.length - 1];
  if (remove && Array.isArray(node)) node.splice(last as number, 1);
  else if (remove) Reflect.deleteProperty(node, last);
  else node[last] = replacement;
  return root;
}
