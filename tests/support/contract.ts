import Ajv2020, { type ValidateFunction } from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import { listOperations, loadOpenApiDocument, type OpenApiDocument } from '../../api/openapi/document';
import { expectPresentable } from './presentation';

const DOCUMENT_ID = 'isochron:contract';

interface ResponseContent {
  content?: Record<string, { schema?: object }>;
  $ref?: string;
}

let cached: { document: OpenApiDocument; ajv: Ajv2020 } | undefined;

function contract() {
  if (!cached) {
    const document = loadOpenApiDocument();
    const ajv = new Ajv2020({ strict: false, allErrors: true });
    addFormats(ajv);
    ajv.addSchema(document, DOCUMENT_ID);
    cached = { document, ajv };
  }
  return cached;
}

function escape(segment: string): string {
  return segment.replace(/~/g, '~0').replace(/\//g, '~1');
}

/**
 * The response schema documented for an operation and status, compiled from the contract itself.
 * Returns null when the operation documents no JSON schema for that status.
 */
export function responseValidator(operationId: string, status: number): ValidateFunction | null {
  const { document, ajv } = contract();
  const found = listOperations(document).find((o) => o.operation.operationId === operationId);
  if (!found) throw new Error(`No operation ${operationId}`);
  const responses = found.operation.responses as Record<string, ResponseContent>;
  const key =
    String(status) in responses
      ? String(status)
      : `${String(status)[0]}XX` in responses
        ? `${String(status)[0]}XX`
        : null;
  if (!key) throw new Error(`${operationId} does not document status ${status}`);
  let response = responses[key];
  let pointer = `${DOCUMENT_ID}#/paths/${escape(found.route)}/${found.method}/responses/${key}`;
  if (response.$ref) {
    pointer = `${DOCUMENT_ID}${response.$ref}`;
    const name = response.$ref.split('/').pop()!;
    response = (document.components.responses as Record<string, ResponseContent>)[name];
  }
  const media = Object.keys(response.content ?? {}).find((m) => m.includes('json'));
  if (!media || !response.content![media].schema) return null;
  return ajv.compile({ $ref: `${pointer}/content/${escape(media)}/schema` });
}

/**
 * Fails with the schema errors when a response body does not match the documented schema, or when it
 * breaks the contract's rule for numbers in answers (tests/support/presentation.ts). Refusals are
 * checked for their schema only: a problem quotes the caller's own value as it was sent.
 */
export function expectToMatchContract(operationId: string, status: number, body: unknown): void {
  if (status < 400) expectPresentable(body);
  const validate = responseValidator(operationId, status);
  if (!validate) return;
  if (!validate(body)) {
    throw new Error(
      `${operationId} ${status} response does not match the contract: ${JSON.stringify(validate.errors?.slice(0, 5), null, 1)}`,
    );
  }
}
