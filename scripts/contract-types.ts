/**
 * Generates `shared/contract/api-types.ts` from the OpenAPI contract (`openapi/`) with openapi-typescript.
 *
 *   tsx scripts/contract-types.ts          writes the file
 *   tsx scripts/contract-types.ts --check  fails (exit 1) when the file on disk is not what the contract gives
 */
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import openapiTS, { astToString } from 'openapi-typescript';
import type { OpenAPIV3_1 } from 'openapi-types';
import {
  listOperations,
  loadOpenApiDocument,
  resolveParameter,
  resolveRef,
  type OpenApiDocument,
} from '../api/openapi/document';

const TARGET = path.join(__dirname, '..', 'shared', 'contract', 'api-types.ts');

const HEADER = `/**
 * Generated from the OpenAPI contract in openapi/ by scripts/contract-types.ts (openapi-typescript).
 * Do not edit: change the contract and run \`npm run contract:types\`. \`npm run check\` fails when
 * this file is stale.
 */
/* eslint-disable */
`;

type Schema = OpenAPIV3_1.SchemaObject | OpenAPIV3_1.ReferenceObject;

/** Names of the properties that carry their own `default` (ajv fills those in; it does not follow `$ref` for defaults). */
function defaultedProperties(document: OpenApiDocument, schema: Schema | undefined): string[] {
  if (!schema) return [];
  const resolved = '$ref' in schema ? resolveRef<OpenAPIV3_1.SchemaObject>(document, schema.$ref) : schema;
  return Object.entries(resolved.properties ?? {})
    .filter(([, property]) => !('$ref' in property) && property.default !== undefined)
    .map(([name]) => name);
}

const union = (names: string[]): string =>
  names.length === 0 ? 'never' : names.map((n) => JSON.stringify(n)).join(' | ');

/**
 * Per operation, the query parameters and top-level body properties that request validation fills in
 * with the contract's default, so that handlers see them as present.
 */
function defaultsMap(document: OpenApiDocument): string {
  const lines = listOperations(document).map(({ operation }) => {
    const query = (operation.parameters ?? [])
      .map((p) => resolveParameter(document, p))
      .filter((p) => p.in === 'query' && p.schema && !('$ref' in p.schema) && p.schema.default !== undefined)
      .map((p) => p.name);
    const requestBody = operation.requestBody;
    const content = requestBody && !('$ref' in requestBody) ? requestBody.content : {};
    const body = [
      ...defaultedProperties(document, content['application/json']?.schema),
      ...defaultedProperties(document, content['multipart/form-data']?.schema),
    ];
    return `  ${operation.operationId}: { query: ${union(query)}; body: ${union(body)} };`;
  });
  return [
    '',
    '/** Per operation, the query parameters and top-level body properties that validation fills in with their default. */',
    'export type ValidatedDefaults = {',
    ...lines.sort(),
    '};',
    '',
  ].join('\n');
}

async function generate(): Promise<string> {
  // The contract is one root file plus fragments merged by the service's own loader; generate from that.
  const document = loadOpenApiDocument();
  // defaultNonNullable off: the types say what a client may send and what an answer may leave out.
  const ast = await openapiTS(document as never, {
    alphabetize: true,
    exportType: true,
    defaultNonNullable: false,
  });
  return HEADER + astToString(ast) + defaultsMap(document);
}

async function main(): Promise<void> {
  const text = await generate();
  if (process.argv.includes('--check')) {
    let current = '';
    try {
      current = readFileSync(TARGET, 'utf8');
    } catch {
      // missing counts as stale
    }
    if (current !== text) {
      console.error(
        `${path.relative(process.cwd(), TARGET)} is stale: the OpenAPI contract changed. Run \`npm run contract:types\` and commit the result.`,
      );
      process.exit(1);
    }
    return;
  }
  writeFileSync(TARGET, text);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
