import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import request from 'supertest';
import { fixedSecurityHeaders } from './security-headers';

const headersOf = async (middleware: RequestHandler) => {
  const app = express();
  app.use(middleware);
  app.post('/x', (_req, res) => res.json({}));
  const res = await request(app).post('/x').set('X-Forwarded-Proto', 'https').send({});
  const { date: _date, etag: _etag, ...rest } = res.headers;
  return rest;
};

describe('fixedSecurityHeaders', () => {
  it('sets what helmet sets, with the same values and in the same order', async () => {
    const options = {
      contentSecurityPolicy: { directives: { defaultSrc: ["'self'"], frameAncestors: ["'none'"] } },
    };
    const fromHelmet = await headersOf(helmet(options));
    const fixed = await headersOf(fixedSecurityHeaders(helmet(options)));
    expect(Object.entries(fixed)).toEqual(Object.entries(fromHelmet));
    expect(fixed['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(fixed['x-powered-by']).toBeUndefined();
  });

  it('refuses helmet options with a value per request (a CSP nonce)', () => {
    let n = 0;
    const perRequest = helmet({
      contentSecurityPolicy: { directives: { scriptSrc: ["'self'", () => `'nonce-${(n += 1)}'`] } },
    });
    expect(() => fixedSecurityHeaders(perRequest)).toThrow(/different headers per request/);
  });
});
