import type { Request, RequestHandler } from 'express';
import { ProblemError } from '../http/problem';

export const CONSOLE_HEADER = 'X-Requested-With';
export const CONSOLE_HEADER_VALUE = 'isochron-console';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export const isStateChanging = (method: string): boolean => !SAFE_METHODS.has(method.toUpperCase());

function refuse(detail: string): ProblemError {
  return new ProblemError({ status: 403, title: 'Request refused', detail, type: 'cross-site-request' });
}

/**
 * Cross-site request forgery check for requests that a browser authenticates by cookie. A page on
 * another site cannot add a custom header without a CORS preflight, which this service never grants;
 * and a browser always names the page's origin in `Origin` on such requests, which must be ours.
 * Returns the refusal, or null when the request may go on.
 */
export function crossSiteProblem(req: Request, publicOrigin: string): ProblemError | null {
  if (req.get(CONSOLE_HEADER) !== CONSOLE_HEADER_VALUE) {
    return refuse(
      `Console requests that change something must carry the header \`${CONSOLE_HEADER}: ${CONSOLE_HEADER_VALUE}\`.`,
    );
  }
  const origin = req.get('Origin');
  if (origin !== undefined) {
    const ownOrigins = [publicOrigin, `${req.protocol}://${req.get('Host')}`];
    if (!ownOrigins.includes(origin)) return refuse('The request comes from a page on another origin.');
  }
  if (req.get('Sec-Fetch-Site') === 'cross-site')
    return refuse('The request comes from a page on another site.');
  return null;
}

/** Middleware form for routers whose every state-changing request is a console request (`/auth`). */
export function consoleRequestGuard(publicUrl: string): RequestHandler {
  const publicOrigin = new URL(publicUrl).origin;
  return (req, _res, next) => {
    if (isStateChanging(req.method)) {
      const problem = crossSiteProblem(req, publicOrigin);
      if (problem) throw problem;
    }
    next();
  };
}
