import type { JsonSchema, SchemaObject } from './openapi-types';
import { resolvePointer } from './openapi-operations';

/** One complaint about the request being edited, in the API's own pointer-and-message form. */
export interface SchemaProblem {
  pointer: string;
  message: string;
}

const MAX_PROBLEMS = 50;

function typeOf(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'array';
  if (typeof value === 'number') return Number.isInteger(value) ? 'integer' : 'number';
  return typeof value;
}

function matchesType(value: unknown, type: string): boolean {
  const actual = typeOf(value);
  if (type === 'number') return actual === 'number' || actual === 'integer';
  return actual === type;
}

function pointerJoin(pointer: string, key: string | number): string {
  return `${pointer}/${String(key).replace(/~/g, '~0').replace(/\//g, '~1')}`;
}

function describe(value: unknown): string {
  const text = JSON.stringify(value);
  return text.length > 40 ? `${text.slice(0, 37)}...` : text;
}

function equal(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

class Checker {
  constructor(private readonly root: unknown) {}

  check(value: unknown, schema: JsonSchema | undefined, pointer: string, depth = 0): SchemaProblem[] {
    if (schema === undefined || schema === true) return [];
    if (schema === false) return [{ pointer, message: 'is not allowed here' }];
    if (depth > 64) return [];
    const problems: SchemaProblem[] = [];
    const s: SchemaObject = schema;

    if (typeof s.$ref === 'string') {
      const target = resolvePointer(this.root, s.$ref) as JsonSchema | undefined;
      problems.push(...this.check(value, target, pointer, depth + 1));
    }
    if (s.type !== undefined) {
      const types = Array.isArray(s.type) ? s.type : [s.type];
      if (!types.some((type) => matchesType(value, type))) {
        return [...problems, { pointer, message: `must be ${types.join(' or ')}, not ${typeOf(value)}` }];
      }
    }
    if (s.enum && !s.enum.some((option) => equal(option, value))) {
      problems.push({ pointer, message: `must be one of ${s.enum.map(describe).join(', ')}` });
    }
    if ('const' in s && !equal(s.const, value))
      problems.push({ pointer, message: `must be ${describe(s.const)}` });

    if (typeof value === 'number') problems.push(...this.numberProblems(value, s, pointer));
    if (typeof value === 'string') problems.push(...this.stringProblems(value, s, pointer));
    if (Array.isArray(value)) problems.push(...this.arrayProblems(value, s, pointer, depth));
    if (typeOf(value) === 'object') {
      problems.push(...this.objectProblems(value as Record<string, unknown>, s, pointer, depth));
    }

    for (const part of s.allOf ?? []) problems.push(...this.check(value, part, pointer, depth + 1));
    if (s.anyOf) {
      const branches = s.anyOf.map((part) => this.check(value, part, pointer, depth + 1));
      if (!branches.some((branch) => branch.length === 0)) problems.push(...closest(branches, pointer));
    }
    if (s.oneOf) {
      const branches = s.oneOf.map((part) => this.check(value, part, pointer, depth + 1));
      const passing = branches.filter((branch) => branch.length === 0).length;
      if (passing === 0) problems.push(...closest(branches, pointer));
      if (passing > 1) problems.push({ pointer, message: 'matches more than one of the allowed forms' });
    }
    if (s.not !== undefined && this.check(value, s.not, pointer, depth + 1).length === 0) {
      problems.push({ pointer, message: 'is a form that is not allowed' });
    }
    return problems;
  }

  private numberProblems(value: number, s: SchemaObject, pointer: string): SchemaProblem[] {
    const problems: SchemaProblem[] = [];
    if (s.minimum !== undefined && value < s.minimum)
      problems.push({ pointer, message: `must be ≥ ${s.minimum}` });
    if (s.maximum !== undefined && value > s.maximum)
      problems.push({ pointer, message: `must be ≤ ${s.maximum}` });
    if (s.exclusiveMinimum !== undefined && value <= s.exclusiveMinimum) {
      problems.push({ pointer, message: `must be > ${s.exclusiveMinimum}` });
    }
    if (s.exclusiveMaximum !== undefined && value >= s.exclusiveMaximum) {
      problems.push({ pointer, message: `must be < ${s.exclusiveMaximum}` });
    }
    if (s.multipleOf !== undefined) {
      const ratio = value / s.multipleOf;
      if (Math.abs(ratio - Math.round(ratio)) > 1e-9)
        problems.push({ pointer, message: `must be a multiple of ${s.multipleOf}` });
    }
    return problems;
  }

  private stringProblems(value: string, s: SchemaObject, pointer: string): SchemaProblem[] {
    const problems: SchemaProblem[] = [];
    const length = [...value].length;
    if (s.minLength !== undefined && length < s.minLength) {
      problems.push({
        pointer,
        message: s.minLength === 1 ? 'must not be empty' : `must have at least ${s.minLength} characters`,
      });
    }
    if (s.maxLength !== undefined && length > s.maxLength) {
      problems.push({ pointer, message: `must have at most ${s.maxLength} characters` });
    }
    if (s.pattern !== undefined) {
      try {
        if (!new RegExp(s.pattern, 'u').test(value))
          problems.push({ pointer, message: `must match ${s.pattern}` });
      } catch {
        // A pattern this browser cannot compile is left to the server.
      }
    }
    if (
      s.format === 'date-time' &&
      !/^\d{4}-\d{2}-\d{2}[Tt ]\d{2}:\d{2}:\d{2}(\.\d+)?([Zz]|[+-]\d{2}:\d{2})$/.test(value)
    ) {
      problems.push({ pointer, message: 'must be an RFC 3339 date-time such as 2026-03-14T09:30:00Z' });
    }
    if (s.format === 'date' && !isCalendarDate(value)) {
      problems.push({ pointer, message: 'must be an RFC 3339 date such as 2026-03-14' });
    }
    if (s.format === 'email' && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(value)) {
      problems.push({ pointer, message: 'must be an e-mail address' });
    }
    return problems;
  }

  private arrayProblems(value: unknown[], s: SchemaObject, pointer: string, depth: number): SchemaProblem[] {
    const problems: SchemaProblem[] = [];
    if (s.minItems !== undefined && value.length < s.minItems) {
      problems.push({
        pointer,
        message: `must have at least ${s.minItems} item${s.minItems === 1 ? '' : 's'}`,
      });
    }
    if (s.maxItems !== undefined && value.length > s.maxItems) {
      problems.push({ pointer, message: `must have at most ${s.maxItems} items` });
    }
    if (s['uniqueItems'] === true) {
      const seen = new Set(value.map((item) => JSON.stringify(item)));
      if (seen.size !== value.length) problems.push({ pointer, message: 'must not repeat items' });
    }
    const prefix = s.prefixItems ?? [];
    value.forEach((item, index) => {
      const itemSchema = index < prefix.length ? prefix[index] : s.items;
      problems.push(...this.check(item, itemSchema, pointerJoin(pointer, index), depth + 1));
    });
    return problems;
  }

  private objectProblems(
    value: Record<string, unknown>,
    s: SchemaObject,
    pointer: string,
    depth: number,
  ): SchemaProblem[] {
    const problems: SchemaProblem[] = [];
    for (const name of s.required ?? []) {
      if (!(name in value)) problems.push({ pointer: pointerJoin(pointer, name), message: 'is required' });
    }
    const keys = Object.keys(value);
    if (s.minProperties !== undefined && keys.length < s.minProperties) {
      problems.push({
        pointer,
        message: `must have at least ${s.minProperties} field${s.minProperties === 1 ? '' : 's'}`,
      });
    }
    if (s.maxProperties !== undefined && keys.length > s.maxProperties) {
      problems.push({ pointer, message: `must have at most ${s.maxProperties} fields` });
    }
    const properties = s.properties ?? {};
    for (const key of keys) {
      const child = pointerJoin(pointer, key);
      if (key in properties) {
        problems.push(...this.check(value[key], properties[key], child, depth + 1));
      } else if (s.additionalProperties === false) {
        problems.push({ pointer: child, message: 'is not a known field' });
      } else if (s.additionalProperties !== undefined) {
        problems.push(...this.check(value[key], s.additionalProperties, child, depth + 1));
      }
    }
    return problems;
  }
}

/** The failing branch a person most likely meant: the one with the fewest complaints. */
function closest(branches: SchemaProblem[][], pointer: string): SchemaProblem[] {
  const best = [...branches].sort((a, b) => a.length - b.length)[0];
  if (!best) return [{ pointer, message: 'does not match any allowed form' }];
  // A branch that failed only on its type says nothing useful; name the alternatives instead.
  const typeOnly = best.length === 1 && best[0].pointer === pointer && best[0].message.startsWith('must be ');
  if (typeOnly && branches.length > 1) {
    const expected = branches
      .map((branch) => branch[0]?.message.match(/^must be (.+?), not/)?.[1])
      .filter((type): type is string => Boolean(type));
    if (expected.length === branches.length)
      return [{ pointer, message: `must be ${[...new Set(expected)].join(' or ')}` }];
  }
  return best;
}

/** RFC 3339 full-date: YYYY-MM-DD of a day that exists (leap years by the Gregorian rule), as ajv-formats checks it. */
function isCalendarDate(value: string): boolean {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(value);
  if (!match) return false;
  const [year, month, day] = match.slice(1).map(Number);
  const leap = year % 4 === 0 && (year % 100 !== 0 || year % 400 === 0);
  const days = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
  return month >= 1 && month <= 12 && day >= 1 && day <= days[month - 1];
}

/**
 * Checks a value against a JSON Schema 2020-12 schema from the OpenAPI document, resolving local
 * `$ref`s against `root`. Covers the keywords the contract uses; formats other than date-time, date
 * and e-mail, and patterns the browser cannot compile, are left to the server, which checks everything.
 */
export function checkAgainstSchema(
  value: unknown,
  schema: JsonSchema | undefined,
  root: unknown,
): SchemaProblem[] {
  const problems = new Checker(root).check(value, schema, '');
  const seen = new Set<string>();
  return problems
    .filter((problem) => {
      const key = `${problem.pointer} ${problem.message}`;
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    })
    .slice(0, MAX_PROBLEMS);
}
