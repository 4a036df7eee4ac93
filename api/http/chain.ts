import type { NextFunction, Request, RequestHandler, Response } from 'express';

/**
 * Several middleware run as one: each is called as Express calls a layer's handler — a synchronous
 * throw or a rejected returned promise goes to `next(err)`, `next()` runs the following one — but
 * without a router layer per step. Express 5 spends a few microseconds on every layer a request passes
 * (path matching, `req.url`/`req.baseUrl` bookkeeping, closures); on the `/v1` path that was the largest
 * share of the chain's routing cost (`npm run bench:profile`).
 */
export function chain(...handlers: RequestHandler[]): RequestHandler {
  if (handlers.length === 1) return handlers[0];
  return (req: Request, res: Response, done: NextFunction) =>
    new ChainRun(handlers, false, req, res, done).next();
}

/**
 * A route's handlers run as its `dispatch` runs them (router/lib/route.js): `next('route')` leaves the
 * route, an error skips the handlers left (a route of plain handlers has no error handler), and the
 * route is in `req.route`. Built once from the handlers for one method, it spares the route's layer
 * walk and its closures per request.
 */
export function routeRunner(
  route: object,
  handlers: RequestHandler[],
): (req: Request, res: Response, done: NextFunction) => void {
  return (req, res, done) => {
    req.route = route;
    new ChainRun(handlers, true, req, res, done).next();
  };
}

/**
 * One request's way through a chain. A class rather than a closure per request: under tsx (the bench,
 * the tests) a closure bound to a name is wrapped in esbuild's `__name()`, which redefines its `name`
 * property on every request; a property assignment is not.
 */
class ChainRun {
  private index = 0;
  readonly next: NextFunction;

  constructor(
    private readonly handlers: RequestHandler[],
    /** A route's handlers: `next('route')` leaves them, rather than going on with the next one. */
    private readonly asRoute: boolean,
    private readonly req: Request,
    private readonly res: Response,
    private readonly done: NextFunction,
  ) {
    this.next = (err?: unknown) => this.step(err);
  }

  private step(err: unknown): void {
    // As in a router: `next('route')` goes on with the next handler, `next('router')` leaves. In a
    // route, `next('route')` leaves the route.
    if (err === 'route' && this.asRoute) {
      this.done();
      return;
    }
    if (err !== undefined && err !== null && err !== false && err !== 'route') {
      this.done(err);
      return;
    }
    const at = this.index;
    if (at === this.handlers.length) {
      this.done(); // a route's last handler called next()
      return;
    }
    this.index += 1;
    // In a chain the last handler passes straight on; a route's goes through `step`, for 'route'.
    const last = !this.asRoute && at === this.handlers.length - 1;
    run(this.handlers[at], this.req, this.res, last ? this.done : this.next);
  }
}

/** One handler, called the way Express 5's router calls it (router/lib/layer.js `handleRequest`). */
export function run(handler: RequestHandler, req: Request, res: Response, next: NextFunction): void {
  try {
    const returned: unknown = handler(req, res, next);
    if (isPromise(returned)) {
      returned.then(undefined, (error: unknown) => next(error || new Error('Rejected promise')));
    }
  } catch (error) {
    next(error);
  }
}

function isPromise(value: unknown): value is Promise<unknown> {
  return (
    value !== null && typeof value === 'object' && typeof (value as { then?: unknown }).then === 'function'
  );
}
