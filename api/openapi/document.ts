import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { OpenAPIV3_1 } from 'openapi-types';
import YAML from 'yaml';
import { projectRoot } from '../config';

/** The merged contract; the loader guarantees `paths` and `components`. */
export type OpenApiDocument = OpenAPIV3_1.Document & {
  paths: OpenAPIV3_1.PathsObject;
  components: OpenAPIV3_1.ComponentsObject;
};
export type OpenApiOperation = OpenAPIV3_1.OperationObject;
export type OpenApiParameter = OpenAPIV3_1.ParameterObject;

export const HTTP_METHODS = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options'] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];

const OPENAPI_DIR = path.join(projectRoot, 'openapi');

/**
 * The contract lives in one root file plus one fragment per resource (`openapi/paths/*.yaml`), so that
 * each resource's owner edits only its own file. Fragments contribute `paths` and `components`; a name
 * defined twice is an error, not a silent override.
 */
export function loadOpenApiDocument(dir: string = OPENAPI_DIR): OpenApiDocument {
  const root = YAML.parse(readFileSync(path.join(dir, 'openapi.yaml'), 'utf8')) as OpenApiDocument;
  root.paths ??= {};
  root.components ??= {};
  const components = root.components as Record<string, Record<string, unknown>>;
  const fragmentDir = path.join(dir, 'paths');
  const fragments = readdirSync(fragmentDir)
    .filter((name) => name.endsWith('.yaml'))
    .sort();
  for (const name of fragments) {
    const fragment = (YAML.parse(readFileSync(path.join(fragmentDir, name), 'utf8')) ??
      {}) as Partial<OpenApiDocument>;
    for (const [route, item] of Object.entries(fragment.paths ?? {})) {
      if (root.paths[route]) throw new Error(`openapi/paths/${name}: path ${route} is already defined`);
      root.paths[route] = item;
    }
    for (const [section, entries] of Object.entries(fragment.components ?? {})) {
      const target = (components[section] ??= {});
      for (const [key, value] of Object.entries(entries as Record<string, unknown>)) {
        if (key in target)
          throw new Error(`openapi/paths/${name}: components.${section}.${key} is already defined`);
        target[key] = value;
      }
    }
  }
  return root;
}

/** The object a local reference (`#/components/schemas/Room`) points to. */
export function resolveRef<T>(document: OpenApiDocument, ref: string): T {
  if (!ref.startsWith('#/')) throw new Error(`Only local references are supported: ${ref}`);
  let node: unknown = document;
  for (const segment of ref.slice(2).split('/')) {
    const key = segment.replace(/~1/g, '/').replace(/~0/g, '~');
    node = (node as Record<string, unknown> | undefined)?.[key];
  }
  if (node === undefined) throw new Error(`Unresolved reference ${ref}`);
  return node as T;
}

/** A parameter, with a `$ref` to `#/components/parameters/...` followed. */
export function resolveParameter(
  document: OpenApiDocument,
  parameter: OpenAPIV3_1.ReferenceObject | OpenApiParameter,
): OpenApiParameter {
  return '$ref' in parameter ? resolveRef<OpenApiParameter>(document, parameter.$ref) : parameter;
}

/** Every operation of the document with its method and path template. */
export function listOperations(
  document: OpenApiDocument,
): Array<{ method: HttpMethod; route: string; operation: OpenApiOperation & { operationId: string } }> {
  const result = [];
  for (const [route, item] of Object.entries(document.paths)) {
    for (const method of HTTP_METHODS) {
      const operation = item?.[method];
      if (!operation) continue;
      if (!operation.operationId) throw new Error(`${method.toUpperCase()} ${route} has no operationId`);
      result.push({ method, route, operation: operation as OpenApiOperation & { operationId: string } });
    }
  }
  return result;
}
