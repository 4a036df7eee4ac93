import type { ErrorRequestHandler, Express, NextFunction, Request, RequestHandler, Response } from 'express';
import { chain } from './chain';
import { notFound } from './problem';

/** Express's `app.handle`: not in its published types, but what `app(req, res)` calls. */
type AppHandle = (req: Request, res: Response, callback?: NextFunction) => void;

export interface DirectMount {
  /** The mount path, lower case, without a trailing slash (`/v1`). */
  path: string;
  /** What the app runs for every path before the mount (its first `app.use`). */
  before: RequestHandler;
  /** What is mounted at `path` (`app.use(path, mounted)`); it ends every request itself. */
  mounted: RequestHandler;
  /** The app's error handler, which every error under the mount reaches. */
  errors: ErrorRequestHandler;
  /** What happens when the error handler passes an error on, as Express's final handler would. */
  lastResort(err: unknown, req: Request, res: Response): void;
}

/**
 * Hands a request under `mount.path` to that mount's handlers without Express's app router, which is
 * what the app would do anyway: the app's layers are `before` (every path), then the mount, which ends
 * every request it gets (the API's last stage answers 404), so every other layer is one an API request
 * only passes (none matches it, or none handles errors) until the error handler. The router would find
 * that out layer by layer, with a closure, a path match and a prefix trim per layer (`npm run
 * bench:profile`: about a tenth of the API's CPU per request, and a sixth of its garbage).
 *
 * The request is set up as `app.handle` sets it up (the app's request and response prototypes,
 * `res.locals`, `X-Powered-By` when enabled), `before` runs at the root, and the mounted handlers see
 * the URL and `baseUrl` as under `app.use(path, …)`. An error leaves the mount as it would leave the
 * router's layer (URL and `baseUrl` restored) for the error handler. Only a URL that starts with the
 * mount path in lower case and a slash is taken (`/v1/…`): `/v1`, `/V1/…` and a request into a mounted
 * app (with a callback) take the router's way, so the app must also mount the same handlers with
 * `app.use` (`direct-mount.spec.ts` sends the same requests both ways). Call after the app's last layer.
 */
export function mountDirectly(app: Express, mount: DirectMount): void {
  const expressHandle = (app as unknown as { handle: AppHandle }).handle;
  const prefix = `${mount.path}/`;
  const cut = mount.path.length;
  const enter: RequestHandler = (req, _res, next) => {
    req.baseUrl = mount.path;
    req.url = req.url.slice(cut);
    req.params = {};
    next();
  };
  const stages = chain(mount.before, enter, mount.mounted);

  const handle: AppHandle = function handle(this: Express, req, res, callback) {
    const url = req.url;
    if (callback !== undefined || !url.startsWith(prefix)) {
      expressHandle.call(this, req, res, callback);
      return;
    }
    if (this.enabled('x-powered-by')) res.setHeader('X-Powered-By', 'Express');
    req.res = res;
    res.req = req;
    Object.setPrototypeOf(req, this.request);
    Object.setPrototypeOf(res, this.response);
    if (!res.locals) res.locals = Object.create(null) as Response['locals'];
    req.originalUrl = url;
    req.baseUrl = '';
    stages(req, res, (err?: unknown) => {
      // As the router leaves the mount's layer: the request's own URL again, at the root.
      req.url = url;
      req.baseUrl = '';
      // The mounted handlers end every request; were one to pass it on, nothing else at the root
      // answers an API path, so it is not found.
      const error = err === undefined || err === 'route' || err === 'router' ? null : err;
      mount.errors(
        error ?? notFound(`No route for ${req.method} ${req.path}`),
        req,
        res,
        (passed?: unknown) => mount.lastResort(passed, req, res),
      );
    });
  };
  (app as unknown as { handle: AppHandle }).handle = handle;
}
