import type { NextFunction, Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import type { operations, ValidatedDefaults } from '../../shared/contract/api-types';
import { UPLOAD_LIMITS } from '../../shared/limits';
import { loadOpenApiDocument, type OpenApiDocument } from '../openapi/document';
import {
  compileValidators,
  toFieldErrors,
  type BodyValidator,
  type OperationValidators,
} from '../openapi/validators';
import { badRequest, ProblemError, type FieldError } from './problem';
import { multerProblem } from './upload';

/** Every operationId of the contract. */
export type OperationId = keyof operations;

type Operation<K extends OperationId> = operations[K];
type Defaults<K extends OperationId, Part extends 'query' | 'body'> = K extends keyof ValidatedDefaults
  ? ValidatedDefaults[K][Part]
  : never;
/** `T` with the named properties present: validation fills them in from the contract's defaults. */
type Filled<T, Names> = [T] extends [never]
  ? Record<string, never>
  : T extends object
    ? Omit<T, Names & keyof T> & Required<Pick<T, Names & keyof T>>
    : T;

type ContentOf<B> = B extends { content: infer C } ? C : never;
/** The body as a JSON document, or as a multipart upload's text fields plus its file. */
type BodyForms<C, D> =
  | (C extends { 'application/json': infer J } ? { body: Filled<J, D>; file?: undefined } : never)
  | (C extends { 'multipart/form-data': infer F }
      ? { body: Filled<Omit<F, 'file'>, D>; file: UploadedFile }
      : never);
type BodyPart<K extends OperationId> =
  Operation<K> extends { requestBody: infer B }
    ? BodyForms<ContentOf<B>, Defaults<K, 'body'>>
    : Operation<K> extends { requestBody?: infer B }
      ? [NonNullable<B>] extends [never]
        ? { body: undefined; file?: undefined }
        : BodyForms<ContentOf<NonNullable<B>>, Defaults<K, 'body'>> | { body: undefined; file?: undefined }
      : { body: undefined; file?: undefined };
type Parameters<K extends OperationId> = Operation<K> extends { parameters: infer P } ? P : never;
type QueryOf<K extends OperationId> = NonNullable<Parameters<K> extends { query?: infer Q } ? Q : never>;
type PathOf<K extends OperationId> = NonNullable<Parameters<K> extends { path?: infer P } ? P : never>;

/** An uploaded file of a `multipart/form-data` operation. */
export type UploadedFile = Express.Multer.File;

/**
 * What a handler of operation `K` receives: the request as the contract describes it, with the
 * contract's defaults filled in; for an upload, its text fields as `body` and its `file`.
 */
export type ValidInput<K extends OperationId> = {
  query: Filled<QueryOf<K>, Defaults<K, 'query'>>;
  params: Filled<PathOf<K>, never>;
} & BodyPart<K>;

export type OperationHandler<K extends OperationId> = (
  input: ValidInput<K>,
  req: Request,
  res: Response,
) => unknown;

declare module 'express-serve-static-core' {
  interface Request {
    /** Set by `validate()`: which operation the request was checked against, and the checked copy. */
    validated?: { operationId: string; input: unknown };
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

/** Deeper than any request the contract describes; also keeps validation off the stack limit. */
const MAX_BODY_DEPTH = 32;
/** A refused body up to this many JSON values gets every bad field listed; a larger one, the first. */
const LIST_EVERY_ERROR_UP_TO_VALUES = 4096;
/** At most this many field errors go into one problem document. */
const MAX_REPORTED_ERRORS = 50;

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

/** True when a parsed JSON value holds more than `limit` values; stops counting there. */
export function jsonSizeExceeds(value: unknown, limit: number): boolean {
  const stack: unknown[] = [value];
  let count = 0;
  while (stack.length > 0) {
    const node = stack.pop();
    if (++count > limit) return true;
    if (typeof node !== 'object' || node === null) continue;
    for (const child of Object.values(node)) stack.push(child);
  }
  return false;
}

function hasBody(headers: Record<string, unknown>): boolean {
  return headers['transfer-encoding'] !== undefined || Number(headers['content-length'] ?? 0) > 0;
}

function refuse(errors: FieldError[], what: string): ProblemError {
  const shown = errors.slice(0, MAX_REPORTED_ERRORS);
  const count = `${errors.length} invalid field${errors.length === 1 ? '' : 's'}`;
  return badRequest(
    errors.length > shown.length
      ? `The ${what} has ${count}; the first ${shown.length} are listed.`
      : `The ${what} has ${count}.`,
    shown,
  );
}

/** Field errors of a JSON body, in time linear in its size (see `BodyValidator`). */
function jsonBodyErrors(json: BodyValidator, body: unknown): FieldError[] {
  if (json.first(body)) {
    if (!json.closed && jsonDepthExceeds(body, MAX_BODY_DEPTH)) {
      return [{ pointer: '/body', message: `is nested more than ${MAX_BODY_DEPTH} levels deep` }];
    }
    return [];
  }
  if (jsonSizeExceeds(body, LIST_EVERY_ERROR_UP_TO_VALUES)) return toFieldErrors(json.first.errors, '/body');
  json.all(body);
  return toFieldErrors(json.all.errors ?? json.first.errors, '/body');
}

const uploads = new Map<string, RequestHandler>();
function receiveFile(operationId: string): RequestHandler {
  let upload = uploads.get(operationId);
  if (!upload) {
    upload = multer({ storage: multer.memoryStorage(), limits: UPLOAD_LIMITS }).single('file');
    uploads.set(operationId, upload);
  }
  return upload;
}

/**
 * Checks a request against one operation of the contract: media type, path and query parameters, and
 * the body (JSON, or a multipart upload's file and text fields). The checked copy, with the contract's
 * defaults filled in, is what the handler gets.
 */
function check(validators: OperationValidators): RequestHandler {
  const { operationId } = validators;
  const finish = (req: Request, errors: FieldError[], input: unknown, next: NextFunction) => {
    if (errors.length > 0) return next(refuse(errors, 'request'));
    req.validated = { operationId, input };
    next();
  };
  // Whether a Content-Type is one the operation takes depends on the header's text alone: worked out
  // once per distinct text (a few; beyond 64 it is worked out every time, so hostile texts cost no memory).
  const acceptedMediaType = new Map<string | undefined, boolean>();
  const takesMediaType = (req: Request): boolean => {
    const contentType = req.headers['content-type'];
    let accepted = acceptedMediaType.get(contentType);
    if (accepted === undefined) {
      accepted = Boolean(req.is(validators.bodyMediaTypes));
      if (acceptedMediaType.size < 64) acceptedMediaType.set(contentType, accepted);
    }
    return accepted;
  };
  return (req, res, next) => {
    const bodyPresent = hasBody(req.headers);
    if (bodyPresent && validators.bodyMediaTypes.length > 0 && !takesMediaType(req)) {
      throw new ProblemError({
        status: 415,
        title: 'Unsupported media type',
        detail: `Send the body as ${validators.bodyMediaTypes.join(' or ')}.`,
      });
    }
    const errors: FieldError[] = [];
    // Express 5's req.query is a getter that parses again on every read: validate a copy, once. Without
    // a query string it is empty; most calls have none, and are spared the parse.
    const query: Record<string, unknown> = req.url.includes('?')
      ? { ...(req.query as Record<string, unknown>) }
      : {};
    if (!validators.query(query)) errors.push(...toFieldErrors(validators.query.errors, '/query'));
    const params: Record<string, unknown> = { ...req.params };
    if (!validators.params(params)) errors.push(...toFieldErrors(validators.params.errors, '/params'));
    const input: { body: unknown; query: object; params: object; file?: UploadedFile } = {
      body: undefined,
      query,
      params,
    };

    const { form, json } = validators;
    if (form && bodyPresent && req.is('multipart/form-data')) {
      if (errors.length > 0) return next(refuse(errors, 'request'));
      receiveFile(operationId)(req, res, (err?: unknown) => {
        if (err) return next(multerProblem(err));
        const fields: Record<string, unknown> = { ...(req.body as Record<string, unknown>) };
        if (!form(fields)) return next(refuse(toFieldErrors(form.errors, '/body'), 'form'));
        if (!req.file) {
          return next(
            badRequest('Send the file in the multipart field `file`.', [
              { pointer: '/body/file', message: 'is required' },
            ]),
          );
        }
        finish(req, errors, { ...input, body: fields, file: req.file }, next);
      });
      return;
    }
    if (json) {
      if (!bodyPresent || req.body === undefined) {
        if (validators.bodyRequired)
          errors.push({ pointer: '/body', message: 'is required (a JSON request body)' });
      } else {
        // Validated in place (ajv only fills defaults): cloning first would recurse through hostile nesting.
        errors.push(...jsonBodyErrors(json, req.body));
        input.body = req.body;
      }
    } else if (form && validators.bodyRequired) {
      errors.push({ pointer: '/body/file', message: 'is required (a multipart/form-data upload)' });
    }
    finish(req, errors, input, next);
  };
}

/**
 * The checked input of a request that went through `validate(operationId, …)`, typed by the contract.
 * For middleware that runs between the check and the handler (a throttle that reads the body).
 */
export function validInput<K extends OperationId>(req: Request, operationId: K): ValidInput<K> {
  if (req.validated?.operationId !== operationId) {
    throw new Error(`The request was not validated as ${operationId}`);
  }
  return req.validated.input as ValidInput<K>;
}

/**
 * Validates requests against one operation of the contract and hands its handler the checked input,
 * typed from the generated contract types (`shared/contract/api-types.ts`):
 *
 *   router.post('/delays', requirePermission('calculate'), validate('computeDelays', ({ body }, _req, res) => …));
 *
 * Middleware given between the operation id and the handler runs after the check.
 */
export function validate<K extends OperationId>(
  operationId: K,
  ...steps: [...RequestHandler[], OperationHandler<K>]
): RequestHandler[] {
  const validators = getContract().validators.get(operationId);
  if (!validators) throw new Error(`No operation ${operationId} in the OpenAPI document`);
  const handler = steps.pop() as OperationHandler<K>;
  const run: RequestHandler = (req, res) => handler(validInput(req, operationId), req, res);
  return [check(validators), ...(steps as RequestHandler[]), run];
}
