import Ajv2020, { type ValidateFunction } from 'ajv/dist/2020';
import type { RequestHandler } from 'express';
import multer from 'multer';
import { SignalProblemError, type SignalProblemCode } from '../../shared/analysis/signal-problem';
import { badRequest, ProblemError } from '../http/problem';
import { getContract } from '../http/validate';
import { toFieldErrors } from '../openapi/validators';

/** Largest WAV upload, bytes (20 MiB); the decoder also refuses files longer than 30 s. */
export const MAX_WAV_BYTES = 20 * 1024 * 1024;

/** multer limits for one WAV file and a few short text fields. */
export const WAV_UPLOAD_LIMITS: multer.Options['limits'] = {
  fileSize: MAX_WAV_BYTES,
  files: 1,
  fields: 16,
  fieldSize: 4096,
  parts: 18,
};

/** Turns a multer or multipart-parser failure into a problem document; passes anything else through. */
export function multerProblem(err: unknown): unknown {
  if (err === undefined || err === null) return undefined;
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return new ProblemError({
        status: 413,
        title: 'File too large',
        detail: `The file is larger than ${MAX_WAV_BYTES / 1024 / 1024} MiB, the upload limit.`,
        type: 'payload-too-large',
        errors: [{ pointer: '/body/file', message: `must be at most ${MAX_WAV_BYTES} bytes` }],
      });
    }
    if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
      return badRequest('Send exactly one file, in the multipart field `file`.', [
        { pointer: `/body/${err.field ?? 'file'}`, message: 'is not the file field, or is a second file' },
      ]);
    }
    return badRequest(`The multipart form was refused: ${err.message}.`);
  }
  if (
    err instanceof Error &&
    !(err instanceof ProblemError) &&
    /multipart|boundary|unexpected end of form/i.test(err.message)
  ) {
    return badRequest(`The multipart body could not be read: ${err.message}.`);
  }
  return err;
}

const compiled = new Map<string, ValidateFunction>();

/**
 * Validates multipart text fields against a schema in the contract's components (without its `file`
 * property), coercing the strings to numbers as the schema says, and hands the copy on `req.valid.body`.
 */
export function validateFormFields(schemaName: string): RequestHandler {
  return (req, _res, next) => {
    let check = compiled.get(schemaName);
    if (!check) {
      const schemas = getContract().document.components.schemas as Record<string, Record<string, unknown>>;
      const { properties, required, ...rest } = schemas[schemaName] as {
        properties: Record<string, unknown>;
        required?: string[];
      };
      const { file: _file, ...fields } = properties;
      const ajv = new Ajv2020({ strict: true, allErrors: true, coerceTypes: true, useDefaults: true });
      ajv.addVocabulary(['example']);
      check = ajv.compile({
        ...rest,
        properties: fields,
        required: (required ?? []).filter((r) => r !== 'file'),
      });
      compiled.set(schemaName, check);
    }
    const body: Record<string, unknown> = { ...(req.body as Record<string, unknown>) };
    if (!check(body)) {
      const errors = toFieldErrors(check.errors, '/body');
      throw badRequest(
        `The form has ${errors.length} invalid field${errors.length === 1 ? '' : 's'}.`,
        errors,
      );
    }
    req.valid = { body, query: {}, params: { ...req.params } };
    next();
  };
}

const TITLES: Record<SignalProblemCode, string> = {
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

/** A SignalProblemError as a 422 problem of type `unusable-audio` with the reason; anything else passes. */
export function audioProblem(err: unknown): unknown {
  if (!(err instanceof SignalProblemError)) return err;
  return new ProblemError({
    status: 422,
    title: TITLES[err.code],
    detail: err.message,
    type: 'unusable-audio',
    errors: [{ pointer: `/body${err.field}`, message: err.message }],
    extensions: { reason: err.code },
  });
}
