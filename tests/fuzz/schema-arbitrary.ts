import fc from 'fast-check';

type Schema = Record<string, unknown>;

/** Values that have broken parsers, validators and databases before; mixed into every generated request. */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(
    '',
    ' ',
    '\u0000',
    'a\u0000b',
    '%00',
    '💥',
    '\u202e',
    '__proto__',
    'constructor',
    '../../etc/passwd',
    'NaN',
    '1e309',
    '-0',
    "'; DROP TABLE rooms; --",
    '=1+1',
    'x'.repeat(5000),
    -0,
    1e308,
    -1e308,
    5e-324,
    2 ** 53 + 2,
    -(2 ** 31),
    null,
    true,
    [],
    {},
  ),
  fc.string({ maxLength: 30 }),
  fc.double(),
  fc.integer(),
  fc.jsonValue({ maxDepth: 3 }),
  // Deep nesting: the validator's depth guard and stack.
  fc.integer({ min: 30, max: 200 }).map((depth) => {
    let value: unknown = 1;
    for (let i = 0; i < depth; i += 1) value = { a: value };
    return value;
  }),
);

export const hostileString: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(
    '',
    '\u0000',
    'a\u0000b',
    '%00',
    '..',
    '💥',
    ' ',
    'null',
    '-1',
    '1.5',
    '9'.repeat(40),
    'x'.repeat(300),
  ),
  fc.string({ maxLength: 20 }),
  fc.string({ unit: 'binary', maxLength: 12 }),
);

/** Resolves `#/...` references against the OpenAPI document. */
function resolve(document: Schema, ref: string): Schema {
  let node: unknown = document;
  for (const part of ref.replace(/^#\//, '').split('/')) {
    node = (node as Record<string, unknown>)[part.replace(/~1/g, '/').replace(/~0/g, '~')];
  }
  return (node ?? {}) as Schema;
}

/** Small sizes keep the cost of each generated request low: the fuzz test looks for 5xx, not for slowness. */
const MAX_ITEMS = 4;
const MAX_STRING = 40;

/**
 * Values that satisfy a JSON Schema (2020-12, as the contract uses it), most of the time: formats and
 * patterns are followed where fast-check can, and numbers stay inside their ranges. Recursion is cut at
 * a small depth.
 */
export function fromSchema(document: Schema, schema: unknown, depth = 0): fc.Arbitrary<unknown> {
  if (!schema || typeof schema !== 'object') return fc.jsonValue({ maxDepth: 2 });
  let s = schema as Schema;
  if (typeof s.$ref === 'string') s = { ...resolve(document, s.$ref), ...omit(s, '$ref') };
  if (depth > 8) return fc.constant(null);
  if ('const' in s) return fc.constant(s.const);
  if (Array.isArray(s.enum)) return fc.constantFrom(...(s.enum as unknown[]));
  const alternatives = (s.oneOf ?? s.anyOf) as unknown[] | undefined;
  if (alternatives) {
    const rest = omit(omit(s, 'oneOf'), 'anyOf');
    return fc.oneof(
      ...alternatives.map((alt) => fromSchema(document, { ...rest, ...(alt as Schema) }, depth + 1)),
    );
  }
  if (Array.isArray(s.allOf)) {
    const merged = (s.allOf as Schema[]).reduce<Schema>(
      (acc, part) => {
        const p = typeof part.$ref === 'string' ? resolve(document, part.$ref) : part;
        return {
          ...acc,
          ...p,
          properties: { ...(acc.properties as object), ...(p.properties as object) },
          required: [...((acc.required as string[]) ?? []), ...((p.required as string[]) ?? [])],
        };
      },
      omit(s, 'allOf'),
    );
    return fromSchema(document, merged, depth + 1);
  }
  const types = Array.isArray(s.type) ? (s.type as string[]) : s.type ? [s.type as string] : [];
  if (types.length > 1) return fc.oneof(...types.map((type) => fromSchema(document, { ...s, type }, depth)));
  const type = types[0] ?? (s.properties ? 'object' : s.items ? 'array' : undefined);
  switch (type) {
    case 'object': {
      const properties = (s.properties ?? {}) as Record<string, unknown>;
      const required = ((s.required as string[]) ?? []).filter((name) => name in properties);
      const record = fc.record(
        Object.fromEntries(
          Object.entries(properties).map(([name, sub]) => [name, fromSchema(document, sub, depth + 1)]),
        ),
        { requiredKeys: required },
      );
      return record as fc.Arbitrary<unknown>;
    }
    case 'array': {
      const minLength = Math.min((s.minItems as number) ?? 0, 16);
      const maxLength = Math.max(minLength, Math.min((s.maxItems as number) ?? MAX_ITEMS, MAX_ITEMS));
      return fc.array(fromSchema(document, s.items, depth + 1), { minLength, maxLength });
    }
    case 'string':
      return stringFor(s);
    case 'integer': {
      const min = Math.ceil(Math.max(bound(s, 'min') ?? -1e6, -1e9));
      const max = Math.floor(Math.min(bound(s, 'max') ?? 1e6, 1e9));
      return fc.integer({ min, max: Math.max(min, max) });
    }
    case 'number': {
      const min = bound(s, 'min') ?? -1e6;
      const max = bound(s, 'max') ?? 1e6;
      return fc.double({ min, max: Math.max(min, max), noNaN: true, noDefaultInfinity: true });
    }
    case 'boolean':
      return fc.boolean();
    case 'null':
      return fc.constant(null);
    default:
      return fc.jsonValue({ maxDepth: 2 });
  }
}

function bound(s: Schema, side: 'min' | 'max'): number | undefined {
  const inclusive = s[side === 'min' ? 'minimum' : 'maximum'] as number | undefined;
  const exclusive = s[side === 'min' ? 'exclusiveMinimum' : 'exclusiveMaximum'] as number | undefined;
  if (exclusive !== undefined) return side === 'min' ? exclusive + 1e-6 : exclusive - 1e-6;
  return inclusive;
}

function stringFor(s: Schema): fc.Arbitrary<string> {
  if (s.format === 'date-time') {
    return fc
      .date({
        min: new Date('2000-01-01T00:00:00Z'),
        max: new Date('2100-01-01T00:00:00Z'),
        noInvalidDate: true,
      })
      .map((d) => d.toISOString());
  }
  if (s.format === 'email') return fc.emailAddress();
  if (typeof s.pattern === 'string') {
    try {
      return fc.stringMatching(new RegExp(s.pattern), { size: 'xsmall' });
    } catch {
      // A pattern fast-check cannot generate from: plain strings then.
    }
  }
  const minLength = Math.min((s.minLength as number) ?? 0, MAX_STRING);
  const maxLength = Math.max(minLength, Math.min((s.maxLength as number) ?? MAX_STRING, MAX_STRING));
  return fc.string({ minLength, maxLength });
}

function omit(s: Schema, key: string): Schema {
  const { [key]: _dropped, ...rest } = s;
  return rest;
}

/** Replaces one value somewhere inside `value` (chosen by `path`), or drops a key, or adds one. */
export function mutate(value: unknown, path: number[], replacement: unknown, action: number): unknown {
  if (path.length === 0 || value === null || typeof value !== 'object') return replacement;
  const copy: Record<string, unknown> | unknown[] = Array.isArray(value) ? [...value] : { ...value };
  const keys = Object.keys(copy);
  if (keys.length === 0) return Array.isArray(copy) ? [replacement] : { unexpected: replacement };
  const key = keys[path[0] % keys.length];
  if (path.length === 1 && !Array.isArray(copy)) {
    if (action % 3 === 1) {
      return Object.fromEntries(Object.entries(copy).filter(([name]) => name !== key));
    }
    if (action % 3 === 2) {
      copy[`extra${action}`] = replacement;
      return copy;
    }
  }
  (copy as Record<string, unknown>)[key] = mutate(
    (copy as Record<string, unknown>)[key],
    path.slice(1),
    replacement,
    action,
  );
  return copy;
}
