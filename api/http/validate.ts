import type { RequestHandler } from 'express';
import { loadOpenApiDocument, type OpenApiDocument } from '../openapi/document';
import { compileValidators, toFieldErrors, type OperationValidators } from '../openapi/validators';
import { badRequest, ProblemError } from './problem';

export interface ValidatedInput {
  body: unknown;
  query: Record<string, unknown>;
  params: Record<string, unknown>;
}

declare module 'express-serve-static-core' {
  interface Request {
    /** The request as validated against the OpenAPI document, with defaults applied. */
    valid: ValidatedInput;
  }
}

interface Contract {
  document: OpenApiDocument;
  validators: Map<string, OperationValidators>;
}

let contract: Contract | undefined;

/** The OpenAPI document and its compiled validators, built once per process. */
export function getContract(): Contract {
  if (!contract) {
    const document = loadOpenApiDocument();
    contract = { document, validators: compileValidators(document) };
  }
  return contract;
}

/** Deeper than any request the contract describes; also keeps cloning and validation off the stack limit. */
const MAX_BODY_DEPTH = 32;

/** Depth of a parsed JSON value, measured without recursion so hostile nesting cannot overflow the stack. */
export function jsonDepthExceeds(value: unknown, limit: number): boolean {
  const stack: Array<[unknown, number]> = [[value, 1]];
  while (stack.length > 0) {
    const [node, depth] = stack.pop() as [unknown, number];
    if (typeof node !== 'object' || node === null) continue;
    if (depth > limit) return true;
    for (const child of Object.values(node)) stack.push([child, depth + 1]);
  }
  return false;
}

function hasBody(headers: Record<string, unknown>): boolean {
  return headers['transfer-encoding'] !== undefined || Number(headers['content-length'] ?? 0) > 0;
}

/**
 * Validates body, query and path parameters against one operation of the contract and hands the
 * handler a validated copy on `req.valid` (Express 5's `req.query` is a getter that re-parses, so
 * coerced values and defaults must live elsewhere).
 */
export function validate(operationId: string): RequestHandler {
  const validators = getContract().validators.get(operationId);
  if (!validators) throw new Error(`No operation ${operationId} in the OpenAPI document`);
  return (req, _res, next) => {
    const errors = [];
    const bodyPresent = hasBody(req.headers);
    if (bodyPresent && validators.bodyMediaTypes.length > 0 && !req.is(validators.bodyMediaTypes)) {
      throw new ProblemError({
        status: 415,
        title: 'Unsupported media type',
        detail: `Send the body as ${validators.bodyMediaTypes.join(' or ')}.`,
      });
    }
    let body: unknown = undefined;
    if (validators.body) {
      if (!bodyPresent || req.body === undefined) {
        if (validators.bodyRequired)
          throw badRequest('A JSON request body is required.', [
            { pointer: '/body', message: 'is required' },
          ]);
      } else {
        // Validated in place (ajv only fills defaults): cloning first would recurse through hostile nesting.
        body = req.body;
        if (!validators.body(body)) {
          errors.push(...toFieldErrors(validators.body.errors, '/body'));
        } else if (jsonDepthExceeds(body, MAX_BODY_DEPTH)) {
          // Only reachable through a schema that leaves an object open; refuse rather than pass it on.
          errors.push({ pointer: '/body', message: `is nested more than ${MAX_BODY_DEPTH} levels deep` });
        }
      }
    }
    const query: Record<string, unknown> = { ...(req.query as Record<string, unknown>) };
    if (!validators.query(query)) errors.push(...toFieldErrors(validators.query.errors, '/query'));
    const params: Record<string, unknown> = { ...req.params };
    if (!validators.params(params)) errors.push(...toFieldErrors(validators.params.errors, '/params'));
    if (errors.length > 0) {
      throw badRequest(
        `The request has ${errors.length} invalid field${errors.length === 1 ? '' : 's'}.`,
        errors,
      );
    }
    req.valid = { body, query, params };
    next();
  };
}
