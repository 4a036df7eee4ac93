import express from 'express';
import request from 'supertest';
import { problemHandler } from '../http/problem';
import { consoleRequestGuard } from './console-request-guard';

// OWASP CSRF Prevention Cheat Sheet: a custom request header, and the Origin header checked against
// the target origin. Safe methods pass untouched.

const app = express();
app.use(consoleRequestGuard('https://isochron.test.example/console/'));
app.all('/thing', (_req, res) => {
  res.status(204).end();
});
app.use(problemHandler({ error: () => undefined }));

const header = { 'X-Requested-With': 'isochron-console' };

describe('consoleRequestGuard', () => {
  it.each(['get', 'head', 'options'] as const)('lets %s through without any header', async (method) => {
    expect((await request(app)[method]('/thing')).status).toBe(204);
  });

  it.each(['post', 'put', 'patch', 'delete'] as const)(
    'refuses %s without the console header',
    async (method) => {
      const res = await request(app)[method]('/thing');
      expect(res.status).toBe(403);
      expect(res.body.type).toBe('https://isochron.dev/problems/cross-site-request');
    },
  );

  it('wants the exact header value', async () => {
    expect((await request(app).post('/thing').set('X-Requested-With', 'XMLHttpRequest')).status).toBe(403);
    expect((await request(app).post('/thing').set(header)).status).toBe(204);
  });

  it('compares Origin with the public origin (scheme, host and port; never the path)', async () => {
    const post = (origin: string) => request(app).post('/thing').set(header).set('Origin', origin);
    expect((await post('https://isochron.test.example')).status).toBe(204);
    for (const origin of [
      'https://isochron.test.example:8443',
      'http://isochron.test.example',
      'https://evil.example',
      'null',
    ]) {
      expect([origin, (await post(origin)).status]).toEqual([origin, 403]);
    }
  });

  it('accepts the origin the request itself was addressed to', async () => {
    const res = await request(app)
      .post('/thing')
      .set(header)
      .set('Host', 'studio-box:8080')
      .set('Origin', 'http://studio-box:8080');
    expect(res.status).toBe(204);
  });

  it('refuses what the browser marks as cross-site', async () => {
    expect((await request(app).post('/thing').set(header).set('Sec-Fetch-Site', 'cross-site')).status).toBe(
      403,
    );
    expect((await request(app).post('/thing').set(header).set('Sec-Fetch-Site', 'same-origin')).status).toBe(
      204,
    );
  });
});
