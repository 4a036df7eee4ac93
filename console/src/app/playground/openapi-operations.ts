import type {
  JsonSchema,
  OpenApiDocument,
  OpenApiExample,
  OpenApiMediaType,
  OpenApiOperation,
  OpenApiParameter,
} from './openapi-types';

const METHODS = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options'] as const;

/** A documented example a person can load into the editor. */
export interface NamedExample {
  name: string;
  summary: string;
  value: unknown;
}

export interface PlaygroundParameter {
  name: string;
  in: 'path' | 'query' | 'header';
  required: boolean;
  description: string;
  schema?: JsonSchema;
  /** The documented example, or the default, as text for a form field. */
  example: string;
}

/** One operation of the API as the playground offers it. */
export interface PlaygroundOperation {
  id: string;
  method: string;
  path: string;
  summary: string;
  description: string;
  tag: string;
  parameters: PlaygroundParameter[];
  /** Media type of the request body when there is one. */
  bodyType?: string;
  bodyRequired: boolean;
  bodySchema?: JsonSchema;
  examples: NamedExample[];
  /** True when the operation needs no credentials (`security: []`). */
  open: boolean;
  /** Why the playground cannot send this one (a file upload, for instance). */
  unsupported?: string;
}

/** Follows a local `#/...` reference inside the document; undefined when it does not resolve. */
export function resolvePointer(document: unknown, ref: string): unknown {
  if (!ref.startsWith('#')) return undefined;
  const path = ref.slice(1).split('/').filter(Boolean);
  let node: unknown = document;
  for (const raw of path) {
    const key = decodeURIComponent(raw).replace(/~1/g, '/').replace(/~0/g, '~');
    if (typeof node !== 'object' || node === null || !(key in node)) return undefined;
    node = (node as Record<string, unknown>)[key];
  }
  return node;
}

function deref<T>(document: OpenApiDocument, value: T | { $ref?: string } | undefined): T | undefined {
  let current: unknown = value;
  for (let hops = 0; hops < 16; hops++) {
    if (typeof current !== 'object' || current === null) return current as T | undefined;
    const ref = (current as { $ref?: unknown }).$ref;
    if (typeof ref !== 'string') return current as T;
    current = resolvePointer(document, ref);
  }
  return undefined;
}

function exampleText(value: unknown): string {
  if (value === undefined || value === null) return '';
  return typeof value === 'string' ? value : JSON.stringify(value);
}

function parameterOf(document: OpenApiDocument, raw: OpenApiParameter): PlaygroundParameter | null {
  const parameter = deref<OpenApiParameter>(document, raw);
  if (!parameter || parameter.in === 'cookie') return null;
  const schema = deref<JsonSchema>(document, parameter.schema);
  const schemaObject = typeof schema === 'object' ? schema : undefined;
  const firstNamed = parameter.examples ? Object.values(parameter.examples)[0] : undefined;
  const example =
    parameter.example ??
    deref<OpenApiExample>(document, firstNamed)?.value ??
    schemaObject?.examples?.[0] ??
    schemaObject?.example ??
    schemaObject?.default;
  return {
    name: parameter.name,
    in: parameter.in,
    required: parameter.in === 'path' ? true : Boolean(parameter.required),
    description: parameter.description ?? schemaObject?.description ?? '',
    schema: parameter.schema,
    example: exampleText(example),
  };
}

function examplesOf(document: OpenApiDocument, media: OpenApiMediaType): NamedExample[] {
  const named = Object.entries(media.examples ?? {}).flatMap(([name, raw]) => {
    const example = deref<OpenApiExample>(document, raw);
    return example && 'value' in example
      ? [{ name, summary: example.summary ?? name, value: example.value }]
      : [];
  });
  if (named.length) return named;
  if (media.example !== undefined)
    return [{ name: 'example', summary: 'Documented example', value: media.example }];
  const schema = deref<JsonSchema>(document, media.schema);
  if (typeof schema === 'object' && Array.isArray(schema.examples) && schema.examples.length) {
    return [{ name: 'schema', summary: 'Example from the schema', value: schema.examples[0] }];
  }
  return [];
}

/**
 * Every operation of the document in document order, with parameters merged from the path item and
 * the operation (the operation wins), its JSON request schema and its documented examples.
 */
export function listOperations(document: OpenApiDocument): PlaygroundOperation[] {
  const operations: PlaygroundOperation[] = [];
  for (const [path, item] of Object.entries(document.paths ?? {})) {
    const shared = (item['parameters'] as OpenApiParameter[] | undefined) ?? [];
    for (const method of METHODS) {
      const operation = item[method] as OpenApiOperation | undefined;
      if (!operation) continue;
      const byKey = new Map<string, PlaygroundParameter>();
      for (const raw of [...shared, ...(operation.parameters ?? [])]) {
        const parameter = parameterOf(document, raw);
        if (parameter) byKey.set(`${parameter.in}:${parameter.name}`, parameter);
      }
      const body = deref<NonNullable<OpenApiOperation['requestBody']>>(document, operation.requestBody);
      const content = body?.content ?? {};
      const jsonType = Object.keys(content).find(
        (type) => type === 'application/json' || type.endsWith('+json'),
      );
      const otherType = Object.keys(content)[0];
      const media = jsonType ? content[jsonType] : undefined;
      operations.push({
        id: operation.operationId ?? `${method} ${path}`,
        method: method.toUpperCase(),
        path,
        summary: operation.summary ?? `${method.toUpperCase()} ${path}`,
        description: operation.description ?? '',
        tag: operation.tags?.[0] ?? 'Other',
        parameters: [...byKey.values()],
        bodyType: jsonType ?? otherType,
        bodyRequired: Boolean(body?.required),
        bodySchema: media?.schema,
        examples: media ? examplesOf(document, media) : [],
        open: Array.isArray(operation.security) && operation.security.length === 0,
        unsupported:
          !jsonType && otherType
            ? `This operation takes ${otherType}; send it from code (see the snippets) rather than from the playground.`
            : undefined,
      });
    }
  }
  return operations;
}

/** Operations grouped by their first tag, in the order the document lists its tags. */
export function groupByTag(
  operations: readonly PlaygroundOperation[],
  tagOrder: readonly string[] = [],
): Array<{ tag: string; operations: PlaygroundOperation[] }> {
  const groups = new Map<string, PlaygroundOperation[]>();
  for (const operation of operations)
    groups.set(operation.tag, [...(groups.get(operation.tag) ?? []), operation]);
  const rank = (tag: string) => {
    const index = tagOrder.indexOf(tag);
    return index === -1 ? tagOrder.length : index;
  };
  return [...groups.entries()]
    .sort(([a], [b]) => rank(a) - rank(b) || a.localeCompare(b))
    .map(([tag, list]) => ({ tag, operations: list }));
}
