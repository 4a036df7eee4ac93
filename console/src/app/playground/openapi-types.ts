/** The parts of an OpenAPI 3.1 document the playground reads. */
export type JsonSchema = boolean | SchemaObject;

export interface SchemaObject {
  $ref?: string;
  type?: string | string[];
  enum?: unknown[];
  const?: unknown;
  properties?: Record<string, JsonSchema>;
  required?: string[];
  additionalProperties?: JsonSchema;
  items?: JsonSchema;
  prefixItems?: JsonSchema[];
  minItems?: number;
  maxItems?: number;
  minProperties?: number;
  maxProperties?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  multipleOf?: number;
  minLength?: number;
  maxLength?: number;
  pattern?: string;
  format?: string;
  oneOf?: JsonSchema[];
  anyOf?: JsonSchema[];
  allOf?: JsonSchema[];
  not?: JsonSchema;
  default?: unknown;
  description?: string;
  examples?: unknown[];
  example?: unknown;
  title?: string;
  [keyword: string]: unknown;
}

export interface OpenApiExample {
  summary?: string;
  description?: string;
  value?: unknown;
  $ref?: string;
}

export interface OpenApiMediaType {
  schema?: JsonSchema;
  example?: unknown;
  examples?: Record<string, OpenApiExample>;
}

export interface OpenApiParameter {
  $ref?: string;
  name: string;
  in: 'path' | 'query' | 'header' | 'cookie';
  required?: boolean;
  description?: string;
  schema?: JsonSchema;
  example?: unknown;
  examples?: Record<string, OpenApiExample>;
}

export interface OpenApiOperation {
  operationId?: string;
  summary?: string;
  description?: string;
  tags?: string[];
  parameters?: OpenApiParameter[];
  requestBody?: { $ref?: string; required?: boolean; content?: Record<string, OpenApiMediaType> };
  responses?: Record<string, unknown>;
  security?: Array<Record<string, string[]>>;
}

export interface OpenApiDocument {
  openapi: string;
  info?: { title?: string; version?: string };
  paths?: Record<string, Record<string, unknown>>;
  components?: Record<string, Record<string, unknown>>;
  tags?: Array<{ name: string; description?: string }>;
}
