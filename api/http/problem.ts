import type { ErrorRequestHandler, RequestHandler } from 'express';
import { SignalProblemError, type SignalProblemCode } from '../../shared/analysis/signal-problem';
import { CalculationInputError } from '../../shared/errors';

export interface FieldError {
  /** JSON pointer (RFC 6901) into the request: `/body/channels/2/distance`, `/query/limit`. */
  pointer: string;
  message: string;
  /** For a tuning refused by a limit: the setting, as a JSON pointer into the tuning. */
  setting?: string;
  /** For a tuning refused by a limit: which limit, its value, and whether the room or its profile set it. */
  limit?: { name: string; value: number | string | Array<number | string>; source: 'room' | 'profile' };
}

export interface ProblemInit {
  status: number;
  title: string;
  detail?: string;
  /** Short problem-type name; becomes `https://isochron.dev/problems/<type>`. */
  type?: string;
  errors?: FieldError[];
  headers?: Record<string, string>;
  /** Extra members of the problem document (RFC 9457 extensions). */
  extensions?: Record<string, unknown>;
}

const PROBLEM_BASE = 'https://isochron.dev/problems/';

/** An error that becomes an RFC 9457 problem document. Throw it from any handler. */
export class ProblemError extends Error {
  readonly status: number;
  readonly title: string;
  readonly detail?: string;
  readonly type: string;
  readonly errors?: FieldError[];
  readonly headers: Record<string, string>;
  readonly extensions: Record<string, unknown>;

  constructor(init: ProblemInit) {
    super(init.detail ?? init.title);
    this.status = init.status;
    this.title = init.title;
    this.detail = init.detail;
    this.type = init.type ?? defaultType(init.status);
    this.errors = init.errors;
    this.headers = init.headers ?? {};
    this.extensions = init.extensions ?? {};
  }
}

function defaultType(status: number): string {
  const names: Record<number, string> = {
    400: 'bad-request',
    401: 'unauthorized',
    403: 'forbidden',
    404: 'not-found',
    405: 'method-not-allowed',
    409: 'conflict',
    413: 'payload-too-large',
    415: 'unsupported-media-type',
    422: 'unprocessable-content',
    429: 'too-many-requests',
    500: 'internal-error',
    503: 'unavailable',
  };
  return names[status] ?? 'error';
}

export const notFound = (detail: string): ProblemError =>
  new ProblemError({ status: 404, title: 'Not found', detail });

export const badRequest = (detail: string, errors?: FieldError[]): ProblemError =>
  new ProblemError({ status: 400, title: 'Invalid request', detail, type: 'validation', errors });

export const forbidden = (detail: string): ProblemError =>
  new ProblemError({ status: 403, title: 'Forbidden', detail, type: 'insufficient-scope' });

export const conflict = (detail: string, errors?: FieldError[]): ProblemError =>
  new ProblemError({ status: 409, title: 'Conflict', detail, errors });

export function sendProblem(
  res: Parameters<RequestHandler>[1],
  problem: ProblemError,
  instance: string,
): void {
  for (const [name, value] of Object.entries(problem.headers)) res.setHeader(name, value);
  const requestId = res.getHeader('Request-Id');
  res
    .status(problem.status)
    .type('application/problem+json')
    .json({
      type: PROBLEM_BASE + problem.type,
      title: problem.title,
      status: problem.status,
      ...(problem.detail !== undefined && { detail: problem.detail }),
      instance,
      ...(requestId !== undefined && { requestId: String(requestId) }),
      ...(problem.errors && { errors: problem.errors }),
      ...problem.extensions,
    });
}

/** The last route: anything not matched is a JSON 404, never an HTML page. */
export const notFoundHandler: RequestHandler = (req) => {
  throw notFound(`No route for ${req.method} ${req.path}`);
};

interface HttpLikeError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  message?: string;
}

/** Errors thrown by body parsers and other middleware carry `status` and `type`. */
function fromHttpError(err: HttpLikeError): ProblemError | null {
  const status = err.status ?? err.statusCode;
  if (!status || status < 400 || status >= 500) return null;
  switch (err.type) {
    case 'entity.parse.failed':
      return new ProblemError({
        status: 400,
        title: 'Malformed JSON',
        detail: 'The request body is not valid JSON.',
        type: 'malformed-json',
      });
    case 'entity.too.large':
      return new ProblemError({ status: 413, title: 'Request body too large', detail: err.message });
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new ProblemError({ status: 415, title: 'Unsupported encoding', detail: err.message });
    default:
      return new ProblemError({
        status,
        title: 'Request refused',
        detail: err.expose ? err.message : undefined,
      });
  }
}

const SIGNAL_TITLES: Record<SignalProblemCode, string> = {
  emptyFile: 'The file is empty',
  notWav: 'The file is not a WAV file',
  truncated: 'The file is truncated',
  malformed: 'The WAV file is malformed',
  unsupportedEncoding: 'The WAV encoding is not supported',
  unsupportedSampleRate: 'The sample rate is not supported',
  tooLong: 'The recording is too long',
  tooShort: 'The recording is too short',
  channelRequired: 'Choose a channel',
  channelOutOfRange: 'No such channel',
  invalidSamples: 'The file holds invalid samples',
  silent: 'The recording is silent',
};

/**
 * The problem document for an error the calculation core threw: a 422 naming the field. The core names
 * fields relative to the input it was given; `base` is where that input sits in the request (the body,
 * unless a handler passed a part of it: see `calculateAt`). This is the one place core fields become
 * request pointers.
 */
function calculationProblem(err: CalculationInputError, base = '/body'): ProblemError {
  const pointer = base + (err.field.startsWith('/') || err.field === '' ? err.field : `/${err.field}`);
  if (err instanceof SignalProblemError) {
    return new ProblemError({
      status: 422,
      title: SIGNAL_TITLES[err.code],
      detail: err.message,
      type: 'unusable-audio',
      errors: [{ pointer, message: err.message }],
      extensions: { reason: err.code },
    });
  }
  return new ProblemError({
    status: 422,
    title: 'Value cannot be used',
    detail: err.message,
    type: 'calculation-input',
    errors: [{ pointer, message: err.message }],
  });
}

/**
 * Runs a calculation on a part of the request at `base` (e.g. `/body/plan`), so its errors name that
 * part. A calculation that returns a promise (one run on a worker thread) has its rejection mapped too.
 */
export function calculateAt<T>(base: string, calculation: () => T): T {
  const rethrow = (error: unknown): never => {
    throw error instanceof CalculationInputError ? calculationProblem(error, base) : error;
  };
  try {
    const result = calculation();
    return (result instanceof Promise ? result.catch(rethrow) : result) as T;
  } catch (error) {
    return rethrow(error);
  }
}

export interface ErrorLogger {
  error(details: object, message: string): void;
}

/**
 * One error path: every error becomes a problem document; unexpected ones are logged, never shown.
 * `translate` turns errors of lower layers (the database) into problems before the 500 fallback.
 */
export function problemHandler(
  logger: ErrorLogger,
  translate: (err: unknown) => ProblemError | null = () => null,
): ErrorRequestHandler {
  return (err: unknown, req, res, next) => {
    if (res.headersSent) return next(err);
    let problem: ProblemError;
    if (err instanceof ProblemError) {
      problem = err;
    } else if (err instanceof CalculationInputError) {
      problem = calculationProblem(err);
    } else {
      problem =
        (typeof err === 'object' && err !== null && fromHttpError(err as HttpLikeError)) ||
        translate(err) ||
        new ProblemError({
          status: 500,
          title: 'Internal error',
          detail: 'The server could not complete the request.',
        });
      if (problem.status >= 500) {
        logger.error({ err, requestId: res.getHeader('Request-Id'), path: req.path }, 'unhandled error');
      }
    }
    sendProblem(res, problem, req.originalUrl.split('?')[0]);
  };
}
