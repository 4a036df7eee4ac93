import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import request from 'supertest';
import { API_SECURITY_HEADERS, fixedSecurityHeaders, isApiUrl, securityHeaders } from './security-headers';

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

describe('securityHeaders', () => {
  const pages = fixedSecurityHeaders(
    helmet({ contentSecurityPolicy: { directives: { defaultSrc: ["'self'"], scriptSrc: ["'self'"] } } }),
  );
  const headersAt = async (path: string) => {
    const app = express();
    app.use(securityHeaders(pages));
    app.use((_req, res) => res.json({}));
    return (await request(app).get(path)).headers;
  };

  it.each(['/v1/biquads', '/V1/Biquads', '/v1', '/v1?x=1', '/auth/session', '/auth'])(
    'gives the API answer at %s the API set only',
    async (path) => {
      const headers = await headersAt(path);
      for (const [name, value] of API_SECURITY_HEADERS) expect(headers[name.toLowerCase()]).toBe(value);
      // A page's policy (scripts, styles) is not an answer's, nor are the page-only headers.
      expect(headers['content-security-policy']).not.toContain('script-src');
      expect(headers['x-dns-prefetch-control']).toBeUndefined();
      expect(headers['origin-agent-cluster']).toBeUndefined();
    },
  );

  it.each(['/', '/rooms/abc', '/docs', '/v1x', '/authority', '/index.html'])(
    "gives the page at %s helmet's set",
    async (path) => {
      const headers = await headersAt(path);
      expect(headers['content-security-policy']).toContain("script-src 'self'");
      expect(headers['x-dns-prefetch-control']).toBe('off');
      expect(headers['cache-control']).toBeUndefined();
    },
  );

  it('reads the API prefixes as Express routes them, regardless of case, and no further', () => {
    expect(['/v1/a', '/V1/a', '/AUTH/x', '/auth?next=1'].map(isApiUrl)).toEqual([true, true, true, true]);
    expect(['/v10', '/v1a', '/authx', '/', '/docs/v1/'].map(isApiUrl)).toEqual([
      false,
      false,
      false,
      false,
      false,
    ]);
  });
});
