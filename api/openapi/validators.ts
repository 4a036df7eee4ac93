import Ajv2020, { type ErrorObject, type ValidateFunction } from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import type { FieldError } from '../http/problem';
import { listOperations, type OpenApiDocument, type OpenApiParameter } from './document';

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

export interface OperationValidators {
  operationId: string;
  /** Media types the operation accepts for its body; empty when it takes none. */
  bodyMediaTypes: string[];
  bodyRequired: boolean;
  body?: ValidateFunction;
  query: ValidateFunction;
  params: ValidateFunction;
}

function newAjv(coerce: boolean): Ajv2020 {
  // Bodies are JSON and must arrive with the right types; only query and path strings are coerced.
  const ajv = new Ajv2020({
    strict: true,
    allErrors: true,
    useDefaults: true,
    coerceTypes: coerce ? 'array' : false,
  });
  addFormats(ajv);
  ajv.addVocabulary(OPENAPI_VOCABULARY);
  return ajv;
}

function pointerSegment(value: string): string {
  return value.replace(/~/g, '~0').replace(/\//g, '~1');
}

function resolveParameter(document: OpenApiDocument, parameter: OpenApiParameter): OpenApiParameter {
  if (!parameter.$ref) return parameter;
  const name = parameter.$ref.replace('#/components/parameters/', '');
  const resolved = document.components.parameters?.[name] as OpenApiParameter | undefined;
  if (!resolved) throw new Error(`Unresolved parameter reference ${parameter.$ref}`);
  return resolved;
}

function parameterSchema(
  parameters: OpenApiParameter[],
  location: 'query' | 'path',
  closed: boolean,
): object {
  const selected = parameters.filter((p) => p.in === location);
  return {
    type: 'object',
    properties: Object.fromEntries(selected.map((p) => [p.name, p.schema ?? {}])),
    required: selected.filter((p) => p.required || location === 'path').map((p) => p.name),
    additionalProperties: !closed,
  };
}

/** Compiles every operation's request schemas once, at start-up. */
export function compileValidators(document: OpenApiDocument): Map<string, OperationValidators> {
  const bodyAjv = newAjv(false);
  const parameterAjv = newAjv(true);
  bodyAjv.addSchema(document, DOCUMENT_ID);
  parameterAjv.addSchema(document, DOCUMENT_ID);

  const result = new Map<string, OperationValidators>();
  for (const { method, route, operation } of listOperations(document)) {
    if (!operation.operationId) throw new Error(`${method.toUpperCase()} ${route} has no operationId`);
    if (result.has(operation.operationId))
      throw new Error(`operationId ${operation.operationId} is used twice`);
    const parameters = (operation.parameters ?? []).map((p) => resolveParameter(document, p));
    const content = operation.requestBody?.content ?? {};
    const json = content['application/json'];
    const pointer = `${DOCUMENT_ID}#/paths/${pointerSegment(route)}/${method}/requestBody/content/application~1json/schema`;
    result.set(operation.operationId, {
      operationId: operation.operationId,
      bodyMediaTypes: Object.keys(content),
      bodyRequired: operation.requestBody?.required ?? false,
      body: json?.schema ? bodyAjv.compile({ $ref: pointer }) : undefined,
      query: parameterAjv.compile(parameterSchema(parameters, 'query', true)),
      params: parameterAjv.compile(parameterSchema(parameters, 'path', false)),
    });
  }
  return result;
}

/** Turns ajv's errors into one readable message per bad field, each with a JSON pointer into the request. */
export function toFieldErrors(errors: ErrorObject[] | null | undefined, prefix: string): FieldError[] {
  if (!errors) return [];
  // Inside a oneOf every failed branch reports; keep only the summary at the oneOf itself.
  const oneOfPaths = errors.filter((e) => e.keyword === 'oneOf').map((e) => e.schemaPath);
  const kept = errors.filter(
    (e) =>
      e.keyword === 'oneOf' ||
      !oneOfPaths.some((p) => e.schemaPath.startsWith(p.slice(0, -'/oneOf'.length) + '/oneOf/')),
  );
  const seen = new Set<string>();
  const fieldErrors: FieldError[] = [];
  for (const error of kept) {
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
