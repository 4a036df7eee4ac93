import type { OpenApiDocument } from '../../api/openapi/document';

/** The keywords that bound a value; a number `default` is one of the shared defaults too. */
export const BOUND_KEYWORDS = [
  'minimum',
  'maximum',
  'exclusiveMinimum',
  'exclusiveMaximum',
  'minItems',
  'maxItems',
  'minLength',
  'maxLength',
  'default',
] as const;

export interface FoundBound {
  /** `Schema.property` (or `Schema` itself, or `operationId.property` inline, or a parameter's name). */
  key: string;
  /** The shorter key: the property or parameter name alone. */
  name: string;
  where: string;
  bounds: Record<string, unknown>;
}

/** Every schema of the contract that carries a bound, named by where it sits. */
export function contractBounds(document: OpenApiDocument): FoundBound[] {
  const found: FoundBound[] = [];
  const visit = (node: unknown, owner: string, name: string, where: string): void => {
    if (Array.isArray(node)) return node.forEach((n, i) => visit(n, owner, name, `${where}/${i}`));
    if (typeof node !== 'object' || node === null) return;
    const schema = node as Record<string, unknown>;
    const bounds = Object.fromEntries(
      BOUND_KEYWORDS.filter(
        (k) =>
          k in schema &&
          (typeof schema[k] === 'number' || (k === 'default' && typeof schema[k] !== 'object')),
      ).map((k) => [k, schema[k]]),
    );
    const isSchema = 'type' in schema || 'items' in schema || 'enum' in schema;
    if (
      isSchema &&
      Object.keys(bounds).length > 0 &&
      !(Object.keys(bounds).length === 1 && typeof bounds.default !== 'number' && 'default' in bounds)
    ) {
      found.push({ key: name === owner ? owner : `${owner}.${name}`, name, where, bounds });
    }
    for (const [key, value] of Object.entries(schema)) {
      if (key === 'example' || key === 'examples' || key === 'description') continue;
      if (key === 'properties' && typeof value === 'object' && value !== null) {
        for (const [property, sub] of Object.entries(value))
          visit(sub, owner, property, `${where}/properties/${property}`);
      } else if (key === 'items') {
        // The items of an array are named `name[]`: `frequenciesHz[]` bounds each frequency.
        visit(value, owner === name ? `${owner}[]` : owner, `${name}[]`, `${where}/items`);
      } else if ((key === 'oneOf' || key === 'anyOf') && Array.isArray(value)) {
        // Each alternative by its type: `Distance|number`, `Distance|string`.
        value.forEach((alternative, i) => {
          const type = (alternative as { type?: unknown }).type;
          const alt = typeof type === 'string' ? `${name}|${type}` : name;
          visit(alternative, owner === name ? alt : owner, alt, `${where}/${key}/${i}`);
        });
      } else {
        visit(value, owner, name, `${where}/${key}`);
      }
    }
  };
  for (const [name, schema] of Object.entries(document.components.schemas ?? {}))
    visit(schema, name, name, `#/components/schemas/${name}`);
  const parameters = (list: unknown[], where: string) =>
    list.forEach((p) => {
      const parameter = p as { name?: string; schema?: unknown };
      if (parameter.name)
        visit(parameter.schema, parameter.name, parameter.name, `${where}/${parameter.name}`);
    });
  parameters(Object.values(document.components.parameters ?? {}), '#/components/parameters');
  for (const [route, item] of Object.entries(document.paths)) {
    for (const [method, operation] of Object.entries(item ?? {})) {
      const op = operation as {
        operationId?: string;
        parameters?: unknown[];
        requestBody?: unknown;
        responses?: unknown;
      };
      if (!op?.operationId) continue;
      parameters(
        (op.parameters ?? []).filter((p) => !(p as { $ref?: string }).$ref),
        `${method} ${route}`,
      );
      visit(op.requestBody, op.operationId, op.operationId, `${method} ${route} body`);
      visit(op.responses, op.operationId, op.operationId, `${method} ${route} responses`);
    }
  }
  return found;
}
