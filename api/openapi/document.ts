import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import YAML from 'yaml';
import { projectRoot } from '../config';

export type OpenApiDocument = {
  openapi: string;
  paths: Record<string, Record<string, OpenApiOperation>>;
  components: Record<string, Record<string, unknown>>;
} & Record<string, unknown>;

export interface OpenApiParameter {
  name: string;
  in: 'query' | 'path' | 'header' | 'cookie';
  required?: boolean;
  schema?: object;
  $ref?: string;
}

export interface OpenApiOperation {
  operationId: string;
  parameters?: OpenApiParameter[];
  requestBody?: { required?: boolean; content: Record<string, { schema?: object }> };
  responses: Record<string, unknown>;
  [key: string]: unknown;
}

export const HTTP_METHODS = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options'] as const;

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
  const fragmentDir = path.join(dir, 'paths');
  const fragments = readdirSync(fragmentDir)
    .filter((name) => name.endsWith('.yaml'))
    .sort();
  for (const name of fragments) {
    const fragment = YAML.parse(readFileSync(path.join(fragmentDir, name), 'utf8')) ?? {};
    for (const [route, item] of Object.entries(fragment.paths ?? {})) {
      if (root.paths[route]) throw new Error(`openapi/paths/${name}: path ${route} is already defined`);
      root.paths[route] = item as Record<string, OpenApiOperation>;
    }
    for (const [section, entries] of Object.entries(fragment.components ?? {})) {
      const target = (root.components[section] ??= {});
      for (const [key, value] of Object.entries(entries as Record<string, unknown>)) {
        if (key in target)
          throw new Error(`openapi/paths/${name}: components.${section}.${key} is already defined`);
        target[key] = value;
      }
    }
  }
  return root;
}

/** Every operation of the document with its method and path template. */
export function listOperations(
  document: OpenApiDocument,
): Array<{ method: (typeof HTTP_METHODS)[number]; route: string; operation: OpenApiOperation }> {
  const result = [];
  for (const [route, item] of Object.entries(document.paths)) {
    for (const method of HTTP_METHODS) {
      const operation = item[method];
      if (operation) result.push({ method, route, operation });
    }
  }
  return result;
}
