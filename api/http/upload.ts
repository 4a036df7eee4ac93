import multer from 'multer';
import { MAX_UPLOAD_BYTES } from '../../shared/limits';
import { badRequest, ProblemError } from './problem';

/** A multer or multipart-parser failure as a problem document; anything else passes through unchanged. */
export function multerProblem(err: unknown): unknown {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return new ProblemError({
        status: 413,
        title: 'File too large',
        detail: `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MiB, the upload limit.`,
        type: 'payload-too-large',
        errors: [{ pointer: '/body/file', message: `must be at most ${MAX_UPLOAD_BYTES} bytes` }],
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
