import type { IncomingMessage } from 'node:http';
import type { RequestHandler } from 'express';

type HeaderStep = { set: string; value: string | number | readonly string[] } | { remove: string };

/** What a header-setting middleware does to a response, recorded on a stand-in. */
function record(middleware: RequestHandler, req: Partial<IncomingMessage>): HeaderStep[] {
  const steps: HeaderStep[] = [];
  const res = {
    setHeader(name: string, value: string | number | readonly string[]) {
      steps.push({ set: name, value });
      return res;
    },
    removeHeader(name: string) {
      steps.push({ remove: name });
    },
  };
  let passed = false;
  void middleware(req as never, res as never, (err?: unknown) => {
    if (err) throw err instanceof Error ? err : new Error(String(err));
    passed = true;
  });
  if (!passed) throw new Error('The security-header middleware did not finish synchronously');
  return steps;
}

/**
 * helmet's headers, worked out once and set on every response as they are. With options that hold no
 * per-request values (no CSP nonces, no directive functions), helmet sets the same headers with the same
 * values on every response; running its thirteen middleware per request cost more than setting the
 * result (`npm run bench:profile`). Checked at start-up: two different requests must give the same
 * headers, or this refuses to start, so a later per-request option cannot be frozen by mistake.
 */
export function fixedSecurityHeaders(helmetMiddleware: RequestHandler): RequestHandler {
  const steps = record(helmetMiddleware, { method: 'GET', url: '/', headers: {} });
  const other = record(helmetMiddleware, {
    method: 'POST',
    url: '/v1/x?y=1',
    headers: { host: 'example.test', 'user-agent': 'x', 'x-forwarded-proto': 'https' },
  });
  if (JSON.stringify(steps) !== JSON.stringify(other)) {
    throw new Error('helmet sets different headers per request; its headers cannot be worked out once');
  }
  return (_req, res, next) => {
    for (const step of steps) {
      if ('set' in step) res.setHeader(step.set, step.value);
      else res.removeHeader(step.remove);
    }
    next();
  };
}

/**
 * The headers of an API answer (`/v1`, `/auth`): JSON, never a page, so it needs the few that
 * OWASP's REST Security Cheat Sheet ("Security Headers") lists for APIs rather than a page's policy —
 * no cache may keep it (answers hold key secrets and people's addresses), nothing may frame it or run it
 * as a document, no other site may embed it, and the browser must not guess its type. Each header costs
 * about a microsecond and a half per response (`npm run bench:profile`), so answers do not carry the
 * twelve of an HTML page.
 */
export const API_SECURITY_HEADERS: ReadonlyArray<readonly [name: string, value: string]> = [
  ['Cache-Control', 'no-store'],
  ['Content-Security-Policy', "default-src 'none'; frame-ancestors 'none'"],
  ['Cross-Origin-Resource-Policy', 'same-origin'],
  ['Strict-Transport-Security', 'max-age=31536000; includeSubDomains'],
  ['X-Content-Type-Options', 'nosniff'],
  ['X-Frame-Options', 'DENY'],
];

/** Whether a URL is the API's (`/v1…`, `/auth…`, as Express matches them: regardless of case). */
export function isApiUrl(url: string): boolean {
  const first = url.slice(0, 6).toLowerCase();
  return (
    first === '/v1' ||
    first.startsWith('/v1/') ||
    first.startsWith('/v1?') ||
    first === '/auth' ||
    first.startsWith('/auth/') ||
    first.startsWith('/auth?')
  );
}

/** API answers get `API_SECURITY_HEADERS`; pages, the console and the docs get `forPages` (helmet's). */
export function securityHeaders(forPages: RequestHandler): RequestHandler {
  return (req, res, next) => {
    if (!isApiUrl(req.url)) {
      forPages(req, res, next);
      return;
    }
    for (const [name, value] of API_SECURITY_HEADERS) res.setHeader(name, value);
    next();
  };
}
