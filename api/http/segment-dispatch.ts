import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import { chain, routeRunner } from './chain';

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

/** The parts of a route layer (`router` package) read here. */
interface RouteLayer {
  route?: Route;
  match?(path: string): unknown;
}
interface Route {
  methods?: Record<string, boolean>;
  _handlesMethod?(method: string): boolean;
  dispatch: RouteDispatch;
  /** One layer per handler, with the method it answers (none: every method). */
  stack?: Array<{ method?: string; handle?: unknown }>;
}
type RouteDispatch = (req: Request, res: Response, done: NextFunction) => void;

/**
 * How a route runs a request of one method: its handlers for that method, resolved once (`routeRunner`),
 * or its own `dispatch` when it holds something else (an error handler, a layer this cannot read).
 */
function runnerFor(route: Route, method: string): RouteDispatch {
  const handlers: RequestHandler[] = [];
  for (const layer of route.stack ?? []) {
    if (layer.method !== undefined && layer.method !== method) continue;
    if (typeof layer.handle !== 'function' || layer.handle.length > 3) return route.dispatch.bind(route);
    handlers.push(layer.handle as RequestHandler);
  }
  return handlers.length > 0 ? routeRunner(route, handlers) : route.dispatch.bind(route);
}

/** A path of plain segments only (no escapes, no empty segment, no trailing slash): routes are looked up by it as it is. */
const PLAIN_PATH = /^(?:\/[A-Za-z0-9._~-]+)+$/;

/**
 * The routes a request can be handed to directly, by `METHOD /path` (lower-case path): each has a path
 * of plain segments, is the only route of the routers (`chain`, in order) that answers that method and
 * path, and no other layer of theirs matches the path. Express would find that route and nothing else, so
 * the resource router's own dispatch (its layer-by-layer path matching and bookkeeping) is skipped. A
 * router whose layers cannot be read, or that matches case or trailing slashes strictly, rules out every
 * path.
 */
export function exactRoutes(routers: readonly Router[]): Map<string, Map<string, RouteDispatch>> {
  const layers: RouteLayer[] = [];
  // A router mounted at the root of another (`use(router)`) is its layers, in place.
  const add = (router: unknown): boolean => {
    const { stack, caseSensitive, strict } = router as {
      stack?: unknown;
      caseSensitive?: boolean;
      strict?: boolean;
    };
    // Paths are looked up regardless of case and without a trailing slash, as a default router matches them.
    if (!Array.isArray(stack) || caseSensitive === true || strict === true) return false;
    for (const layer of stack as Array<RouteLayer & RouterLayer>) {
      if (
        !layer.route &&
        layer.slash === true &&
        Array.isArray((layer.handle as { stack?: unknown }).stack)
      ) {
        if (!add(layer.handle)) return false;
      } else {
        layers.push(layer);
      }
    }
    return true;
  };
  for (const router of routers) if (!add(router)) return new Map();
  // By method, then by lower-case path.
  const exact = new Map<string, Map<string, RouteDispatch>>();
  for (const layer of layers) {
    const route = layer.route;
    const path: unknown = (route as { path?: unknown } | undefined)?.path;
    if (!route || typeof path !== 'string' || !PLAIN_PATH.test(path)) continue;
    for (const method of Object.keys(route.methods ?? {})) {
      if (method === '_all') continue;
      const verb = method.toUpperCase();
      const answering = layers.filter((other) => {
        if (typeof other.match !== 'function' || !other.match(path)) return false;
        // Middleware (no route) that matches the path would run first: not a direct route.
        return !other.route || other.route._handlesMethod?.(verb) !== false;
      });
      if (answering.length === 1 && answering[0] === layer) {
        let byPath = exact.get(verb);
        if (!byPath) exact.set(verb, (byPath = new Map()));
        byPath.set(path.toLowerCase(), runnerFor(route, method));
      }
    }
  }
  return exact;
}

/**
 * Runs a list of routers as `router.use(a, b, c, …)` would, but hands each request only to the routers
 * that can answer its first path segment, in their order. Express tries every layer of every router in
 * turn; for `/v1/biquads` that was a few dozen path matches before the one that answered. A router that
 * may answer any path (see `firstSegments`) is kept for every request, and a segment that is not plain
 * (escaped or unusual characters) goes through every router, so what answers a request never changes;
 * only routers that could not have matched are skipped. A request nobody answers reaches `next()`.
 *
 * A request whose method and plain path name exactly one route (see `exactRoutes`) goes straight to it:
 * the route runs its handlers as it would under its router, and whatever it passes on (`next()`, an
 * error) goes where the router would have sent it, since no other layer could have matched. HEAD,
 * OPTIONS, trailing slashes and escaped paths take the routers' way. Routers are read once, here: add
 * routes before calling this.
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
  const exact = exactRoutes(routers);

  return (req: Request, res: Response, next: NextFunction) => {
    const { url } = req;
    const query = url.indexOf('?');
    const path = query === -1 ? url : url.slice(0, query);
    const byPath = exact.get(req.method);
    if (byPath) {
      // A path equal to a key is plain (keys are); only the look-up regardless of case needs the check.
      const route = byPath.get(path) ?? (PLAIN_PATH.test(path) ? byPath.get(path.toLowerCase()) : undefined);
      if (route) {
        req.params = {};
        // 'route' and 'router' leave the route and its router alike: nothing else there answers.
        route(req, res, (err?: unknown) => next(err === 'route' || err === 'router' ? undefined : err));
        return;
      }
    }
    const segment = firstSegmentOf(url);
    const handler = PLAIN_SEGMENT.test(segment) ? (table.get(segment.toLowerCase()) ?? noneMatch) : all;
    handler(req, res, next);
  };
}
