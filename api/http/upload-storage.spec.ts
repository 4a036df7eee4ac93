import { randomBytes } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import multer from 'multer';
import request from 'supertest';
import { UPLOAD_LIMITS } from '../../shared/limits';
import { ContiguousMemoryStorage } from './upload-storage';

/** An app that answers what it received: the file's length, digest of its bytes, and whether it owns its memory. */
function echoApp() {
  const app = express();
  const upload = multer({ storage: new ContiguousMemoryStorage(), limits: UPLOAD_LIMITS }).single('file');
  app.post('/', upload, (req, res) => {
    const file = req.file as Express.Multer.File;
    res.json({
      size: file.size,
      hex: file.buffer.toString('hex'),
      ownMemory: file.buffer.buffer.byteLength > Buffer.poolSize,
      field: (req.body as { note?: string }).note,
    });
  });
  app.use(
    (
      err: Error & { code?: string },
      _req: express.Request,
      res: express.Response,
      _next: express.NextFunction,
    ) => {
      res.status(413).json({ code: err.code });
    },
  );
  return app;
}

describe('ContiguousMemoryStorage', () => {
  it('keeps the file byte for byte, in memory of its own, beside the text fields', async () => {
    const bytes = randomBytes(300_000);
    const res = await request(echoApp()).post('/').field('note', 'left').attach('file', bytes, 'a.bin');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      size: bytes.length,
      hex: bytes.toString('hex'),
      ownMemory: true,
      field: 'left',
    });
  });

  it('keeps an empty file and a file of one byte', async () => {
    for (const bytes of [Buffer.alloc(0), Buffer.from([7])]) {
      const res = await request(echoApp()).post('/').attach('file', bytes, 'a.bin');
      expect(res.body).toMatchObject({ size: bytes.length, hex: bytes.toString('hex') });
    }
  });

  it('grows the buffer when the request gives no length (chunked)', async () => {
    const bytes = randomBytes(1_000_000);
    const boundary = 'x-boundary-0123';
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.bin"\r\n\r\n`),
      bytes,
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    const server = echoApp().listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    try {
      const { port } = server.address() as AddressInfo;
      const answer = await new Promise<{ size: number; hex: string }>((resolve, reject) => {
        const req = http.request(
          {
            port,
            method: 'POST',
            headers: {
              'content-type': `multipart/form-data; boundary=${boundary}`,
              'transfer-encoding': 'chunked',
            },
          },
          (res) => {
            const chunks: Buffer[] = [];
            res.on('data', (c: Buffer) => chunks.push(c));
            res.on('end', () => resolve(JSON.parse(Buffer.concat(chunks).toString('utf8'))));
          },
        );
        req.on('error', reject);
        // In pieces of varied sizes, as a network delivers them.
        for (let at = 0; at < body.length; at += 40_000 + (at % 7_000))
          req.write(body.subarray(at, at + 40_000 + (at % 7_000)));
        req.end();
      });
      expect(answer.size).toBe(bytes.length);
      expect(answer.hex).toBe(bytes.toString('hex'));
    } finally {
      server.close();
    }
  });

  it('still refuses a file over the upload limit', async () => {
    const res = await request(echoApp())
      .post('/')
      .attach('file', Buffer.alloc(UPLOAD_LIMITS.fileSize + 1), 'big.bin');
    expect(res.status).toBe(413);
    expect(res.body.code).toBe('LIMIT_FILE_SIZE');
  });
});
