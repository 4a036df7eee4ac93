import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import { chain } from './chain';

/** A plain path segment: what a route's first segment is when it holds no parameter or pattern. */
const PLAIN_SEGMENT = /^[A-Za-z0-9._~-]*$/;

/** The parts of Express 5's router (the `router` package) read here: its layers, their routes and paths. */
interface RouterLayer {
  route?: { path?: unknown };
  handle: unknown;
  /** True when mounted with `use()` at the root: it sees every path. */
  slash?: boolean;
}

/**
 * The first segments a router can answer, lower case (Express matches paths regardless of case), or
 * `null` when it may answer any path: it holds middleware for every path, a route whose first segment
 * is a parameter or pattern, or something this cannot read.
 */
export function firstSegments(router: unknown): Set<string> | null {
  const stack = (router as { stack?: unknown }).stack;
  if (!Array.isArray(stack)) return null;
  const segments = new Set<string>();
  for (const layer of stack as RouterLayer[]) {
    if (layer.route) {
      const path = layer.route.path;
      if (typeof path !== 'string' || !path.startsWith('/')) return null;
      const first = path.slice(1).split('/')[0];
      if (!PLAIN_SEGMENT.test(first)) return null;
      segments.add(first.toLowerCase());
    } else if (layer.slash === true) {
      const nested = firstSegments(layer.handle);
      if (nested === null) return null;
      for (const segment of nested) segments.add(segment);
    } else {
      return null;
    }
  }
  return segments;
}

/** The first segment of a path relative to the mount point (`/biquads?x=1` → `biquads`). */
function firstSegmentOf(url: string): string {
  let end = 1;
  while (end < url.length) {
    const c = url.charCodeAt(end);
    if (c === 47 /* / */ || c === 63 /* ? */) break;
    end += 1;
  }
  return url.slice(1, end);
}

/**
 * Runs a list of routers as `router.use(a, b, c, …)` would, but hands each request only to the routers
 * that can answer its first path segment, in their order. Express tries every layer of every router in
 * turn; for `/v1/biquads` that was a few dozen path matches before the one that answered. A router that
 * may answer any path (see `firstSegments`) is kept for every request, and a segment that is not plain
 * (escaped or unusual characters) goes through every router, so what answers a request never changes;
 * only routers that could not have matched are skipped. A request nobody answers reaches `next()`.
 */
export function dispatchByFirstSegment(routers: Router[]): RequestHandler {
  const readable = routers.map((router) => ({ router, segments: firstSegments(router) }));
  const everySegment = new Set(readable.flatMap((r) => [...(r.segments ?? [])]));
  const table = new Map<string, RequestHandler>();
  for (const segment of everySegment) {
    table.set(
      segment,
      chain(...readable.filter((r) => r.segments === null || r.segments.has(segment)).map((r) => r.router)),
    );
  }
  const all = chain(...routers);
  const anyPath = readable.filter((r) => r.segments === null).map((r) => r.router);
  const noneMatch: RequestHandler = anyPath.length > 0 ? chain(...anyPath) : (_req, _res, next) => next();

  return (req: Request, res: Response, next: NextFunction) => {
    const segment = firstSegmentOf(req.url);
    const handler = PLAIN_SEGMENT.test(segment) ? (table.get(segment.toLowerCase()) ?? noneMatch) : all;
    handler(req, res, next);
  };
}
