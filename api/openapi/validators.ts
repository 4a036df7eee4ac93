import Ajv2020, { type ErrorObject, type ValidateFunction } from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import type { OpenAPIV3_1 } from 'openapi-types';
import type { FieldError } from '../http/problem';
import {
  listOperations,
  resolveParameter,
  resolveRef,
  type HttpMethod,
  type OpenApiDocument,
  type OpenApiParameter,
} from './document';

/** OpenAPI words that may appear beside JSON Schema keywords; declared so that strict mode accepts them. */
const OPENAPI_VOCABULARY = [
  'example',
  'discriminator',
  'xml',
  'externalDocs',
  'openapi',
  'info',
  'servers',
  'security',
  'tags',
  'paths',
  'components',
  'webhooks',
  'jsonSchemaDialect',
];

const DOCUMENT_ID = 'isochron:openapi';

/**
 * A body schema compiled twice. `first` stops at the first error, so its cost is linear in the body
 * whatever the body holds; `all` lists every bad field but collects errors in time that grows with the
 * square of their number (ajv concatenates the error list of every `$ref` call), so it only runs on a
 * small body that `first` already refused.
 */
export interface BodyValidator {
  first: ValidateFunction;
  all: ValidateFunction;
  /** False when some object in the schema accepts any property, so a body could nest without bound. */
  closed: boolean;
}

export interface OperationValidators {
  operationId: string;
  method: HttpMethod;
  route: string;
  /** Media types the operation accepts for its body; empty when it takes none. */
  bodyMediaTypes: string[];
  bodyRequired: boolean;
  json?: BodyValidator;
  /** The text fields of a `multipart/form-data` body (everything but `file`), coerced from strings. */
  form?: ValidateFunction;
  query: ValidateFunction;
  params: ValidateFunction;
}

function newAjv(options: { coerce: boolean; allErrors: boolean }): Ajv2020 {
  const ajv = new Ajv2020({
    strict: true,
    allErrors: options.allErrors,
    useDefaults: true,
    coerceTypes: options.coerce ? 'array' : false,
  });
  addFormats(ajv);
  ajv.addVocabulary(OPENAPI_VOCABULARY);
  return ajv;
}

function pointerSegment(value: string): string {
  return value.replace(/~/g, '~0').replace(/\//g, '~1');
}

function parameterSchema(parameters: OpenApiParameter[], location: 'query' | 'path'): object {
  const selected = parameters.filter((p) => p.in === location);
  return {
    type: 'object',
    properties: Object.fromEntries(selected.map((p) => [p.name, anchoredRefs(p.schema ?? {})])),
    required: selected.filter((p) => p.required || location === 'path').map((p) => p.name),
    // Unknown query parameters are refused; Express adds nothing to the path parameters but the route's own.
    additionalProperties: location === 'path',
  };
}

/** A copy of a schema fragment whose local `$ref`s point into the registered document. */
function anchoredRefs(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(anchoredRefs);
  if (typeof node !== 'object' || node === null) return node;
  return Object.fromEntries(
    Object.entries(node).map(([key, value]) => [
      key,
      key === '$ref' && typeof value === 'string' && value.startsWith('#/')
        ? DOCUMENT_ID + value
        : anchoredRefs(value),
    ]),
  );
}

type Schema = OpenAPIV3_1.SchemaObject | OpenAPIV3_1.ReferenceObject | boolean;

/**
 * True when every object the schema can reach lists its properties and refuses others: then the schema
 * itself bounds how deep a valid body can nest.
 */
export function schemaIsClosed(document: OpenApiDocument, root: Schema): boolean {
  const seen = new Set<object>();
  const stack: Schema[] = [root];
  while (stack.length > 0) {
    const schema = stack.pop() as Schema;
    if (typeof schema === 'boolean') {
      if (schema) return false;
      continue;
    }
    if (seen.has(schema)) continue;
    seen.add(schema);
    if ('$ref' in schema && schema.$ref) {
      stack.push(resolveRef<Schema>(document, schema.$ref));
      continue;
    }
    const s = schema as OpenAPIV3_1.SchemaObject & Record<string, unknown>;
    const types = Array.isArray(s.type) ? s.type : s.type ? [s.type] : [];
    const composed = [...(s.oneOf ?? []), ...(s.anyOf ?? []), ...(s.allOf ?? [])] as Schema[];
    if (types.length === 0 && composed.length === 0 && s.enum === undefined && s.const === undefined) {
      return false; // accepts anything
    }
    if (types.includes('object') || s.properties) {
      if (s.additionalProperties !== false) return false;
      stack.push(...(Object.values(s.properties ?? {}) as Schema[]));
    }
    if (types.includes('array')) {
      if (s.items === undefined) return false;
      stack.push(s.items as Schema);
      stack.push(...((s.prefixItems as Schema[] | undefined) ?? []));
    }
    stack.push(...composed);
  }
  return true;
}

/** The multipart schema's fields without `file`, with its references anchored in the document. */
function formFieldsSchema(document: OpenApiDocument, schema: Schema): object {
  const resolved =
    typeof schema === 'object' && '$ref' in schema
      ? resolveRef<OpenAPIV3_1.SchemaObject>(document, schema.$ref)
      : (schema as OpenAPIV3_1.SchemaObject);
  const { properties = {}, required = [], ...rest } = resolved;
  const { file: _file, ...fields } = properties;
  return anchoredRefs({
    ...rest,
    properties: fields,
    required: required.filter((r) => r !== 'file'),
  }) as object;
}

/** Compiles every operation's request schemas once, at start-up. */
export function compileValidators(document: OpenApiDocument): Map<string, OperationValidators> {
  const firstAjv = newAjv({ coerce: false, allErrors: false });
  const allAjv = newAjv({ coerce: false, allErrors: true });
  const coercingAjv = newAjv({ coerce: true, allErrors: true });
  for (const ajv of [firstAjv, allAjv, coercingAjv]) ajv.addSchema(document, DOCUMENT_ID);

  const result = new Map<string, OperationValidators>();
  for (const { method, route, operation } of listOperations(document)) {
    const { operationId } = operation;
    if (result.has(operationId)) throw new Error(`operationId ${operationId} is used twice`);
    const parameters = (operation.parameters ?? []).map((p) => resolveParameter(document, p));
    const requestBody = operation.requestBody as OpenAPIV3_1.RequestBodyObject | undefined;
    const content = requestBody?.content ?? {};
    const jsonSchema = content['application/json']?.schema;
    const formSchema = content['multipart/form-data']?.schema;
    const pointer = `${DOCUMENT_ID}#/paths/${pointerSegment(route)}/${method}/requestBody/content/application~1json/schema`;
    result.set(operationId, {
      operationId,
      method,
      route,
      bodyMediaTypes: Object.keys(content),
      bodyRequired: requestBody?.required ?? false,
      json: jsonSchema
        ? {
            first: firstAjv.compile({ $ref: pointer }),
            all: allAjv.compile({ $ref: pointer }),
            closed: schemaIsClosed(document, jsonSchema),
          }
        : undefined,
      form: formSchema ? coercingAjv.compile(formFieldsSchema(document, formSchema)) : undefined,
      query: coercingAjv.compile(parameterSchema(parameters, 'query')),
      params: coercingAjv.compile(parameterSchema(parameters, 'path')),
    });
  }
  return result;
}

/** Turns ajv's errors into one readable message per bad field, each with a JSON pointer into the request. */
export function toFieldErrors(errors: ErrorObject[] | null | undefined, prefix: string): FieldError[] {
  if (!errors) return [];
  // Inside a oneOf every failed branch reports; keep only the summary at the oneOf itself.
  const oneOfPaths = new Set(errors.filter((e) => e.keyword === 'oneOf').map((e) => e.schemaPath));
  const insideFailedOneOf = (schemaPath: string): boolean => {
    for (let at = schemaPath.indexOf('/oneOf/'); at >= 0; at = schemaPath.indexOf('/oneOf/', at + 1)) {
      if (oneOfPaths.has(schemaPath.slice(0, at + '/oneOf'.length))) return true;
    }
    return false;
  };
  const seen = new Set<string>();
  const fieldErrors: FieldError[] = [];
  for (const error of errors) {
    if (error.keyword !== 'oneOf' && oneOfPaths.size > 0 && insideFailedOneOf(error.schemaPath)) continue;
    let pointer = prefix + error.instancePath;
    let message = error.message ?? 'is invalid';
    if (error.keyword === 'required') {
      pointer += '/' + pointerSegment(String(error.params.missingProperty));
      message = 'is required';
    } else if (error.keyword === 'additionalProperties') {
      pointer += '/' + pointerSegment(String(error.params.additionalProperty));
      message = 'is not an allowed property';
    } else if (error.keyword === 'oneOf') {
      message = 'does not match any of the allowed forms (see the schema for this field)';
    }
    const key = `${pointer}\u0000${message}`;
    if (!seen.has(key)) {
      seen.add(key);
      fieldErrors.push({ pointer, message });
    }
  }
  return fieldErrors;
}
