import type { Request } from 'express';
import type { StorageEngine } from 'multer';
import { MAX_UPLOAD_BYTES } from '../../shared/limits';

/** First size of the buffer when the request does not say its length (chunked), bytes. */
const INITIAL_BYTES = 64 * 1024;

/**
 * multer's memory storage, but copying each piece of the file into one growing buffer as it arrives
 * instead of joining them all at the end: multer's own `Buffer.concat` of a 20 MiB file is one copy of
 * tens of milliseconds on the event loop, which every other request then waits behind; a 64 KiB
 * piece at a time is microseconds. The buffer starts at the request's declared length (never more than
 * the upload limit, and uninitialised memory that the system commits only as it is written), so a file
 * sent with a Content-Length is copied exactly once. The file's `buffer` is a view of memory no other
 * Buffer shares, so it can be moved to a worker thread instead of copied (`HeavyWork.run`'s `transfer`).
 */
export class ContiguousMemoryStorage implements StorageEngine {
  _handleFile(
    req: Request,
    file: Express.Multer.File,
    callback: (error?: unknown, info?: Partial<Express.Multer.File>) => void,
  ): void {
    const declared = Number(req.headers['content-length']);
    let store = Buffer.allocUnsafeSlow(
      Number.isSafeInteger(declared) && declared > 0 ? Math.min(declared, MAX_UPLOAD_BYTES) : INITIAL_BYTES,
    );
    let size = 0;
    file.stream.on('data', (chunk: Buffer) => {
      if (size + chunk.length > store.length) {
        const grown = Buffer.allocUnsafeSlow(Math.max(size + chunk.length, 2 * store.length));
        store.copy(grown, 0, 0, size);
        store = grown;
      }
      chunk.copy(store, size);
      size += chunk.length;
    });
    file.stream.on('error', (error: Error) => callback(error));
    file.stream.on('end', () => callback(null, { buffer: store.subarray(0, size), size }));
  }

  _removeFile(_req: Request, file: Express.Multer.File, callback: (error: Error | null) => void): void {
    Reflect.deleteProperty(file, 'buffer');
    callback(null);
  }
}
