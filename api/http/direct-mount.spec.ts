import express, { type ErrorRequestHandler, type Request, type RequestHandler } from 'express';
import request from 'supertest';
import { chain } from './chain';
import { mountDirectly } from './direct-mount';

/** What a handler under the mount sees of the request. */
const seen = (req: Request) => ({
  url: req.url,
  originalUrl: req.originalUrl,
  baseUrl: req.baseUrl,
  path: req.path,
  params: req.params,
  query: req.query,
  body: req.body as unknown,
  before: res(req).locals.before as unknown,
});
const res = (req: Request) => req.res as express.Response;

/** An app shaped like the service's: a stage for every path, one mount that ends every request, then others. */
function service(direct: boolean, log: unknown[] = []): express.Express {
  const app = express();
  app.disable('x-powered-by');
  const before: RequestHandler = chain((req, response, next) => {
    response.locals.before = req.url;
    response.setHeader('Seen-Before', 'yes');
    next();
  }, express.json());
  const inner = express.Router();
  inner.get('/things/:id', (req, response) => {
    response.json({ ...seen(req), id: req.params.id });
  });
  inner.post('/echo', (req, response) => {
    response.json(seen(req));
  });
  inner.get('/fail', (_req, _res, next) => next(new Error('failed')));
  inner.get('/throw', () => {
    throw new Error('thrown');
  });
  inner.get('/late', (_req, response, next) => {
    response.status(200).write('partial');
    next(new Error('too late'));
  });
  inner.get('/leave', (_req, _res, next) => next('router'));
  const mounted = chain(inner, (req, response) => {
    response.status(404).json({ notFound: seen(req) });
  });
  app.use(before);
  app.use('/v1', mounted);
  app.get('/v1/shadowed', (_req, response) => {
    response.json({ never: true });
  });
  app.use((req, response) => {
    response.status(404).json({ outside: req.url });
  });
  const errors: ErrorRequestHandler = (err: Error, req, response, next) => {
    if (response.headersSent) return next(err);
    response.status(500).json({ error: err.message ?? String(err), at: seen(req) });
  };
  app.use(errors);
  if (direct) {
    mountDirectly(app, {
      path: '/v1',
      before,
      mounted,
      errors,
      lastResort: (err, req, response) => {
        log.push((err as Error).message);
        if (response.headersSent) req.socket.destroy();
      },
    });
  }
  return app;
}

/** The app's router, whose `handle` Express's published types leave out. */
const routerOf = (app: express.Express) => app.router as unknown as { handle: (...args: unknown[]) => void };

describe('mountDirectly', () => {
  const viaRouter = service(false);
  const direct = service(true);

  // Every row has its body (or null): jest would take a missing last argument for a `done` callback.
  const cases: Array<['get' | 'post' | 'head' | 'options' | 'delete', string, object | null]> = [
    ['get', '/v1/things/42', null],
    ['get', '/v1/things/42?x=1&y=two', null],
    ['get', '/v1/things/a%20b', null],
    ['head', '/v1/things/42', null],
    ['options', '/v1/things/42', null],
    ['delete', '/v1/things/42', null],
    ['post', '/v1/echo', { a: 1 }],
    ['post', '/v1/echo?q=1', { b: [1, 2] }],
    ['get', '/v1/nothing', null],
    ['get', '/v1/shadowed', null],
    ['get', '/v1//things/42', null],
    ['get', '/v1/../things/42', null],
    ['get', '/v1/', null],
    ['get', '/v1', null],
    ['get', '/v1?x=1', null],
    ['get', '/V1/things/42', null],
    ['get', '/v10/things/42', null],
    ['get', '/elsewhere', null],
    ['get', '/v1/fail', null],
    ['get', '/v1/throw', null],
    ['get', '/v1/leave', null],
  ];

  it.each(cases)('%s %s answers as under app.use', async (method, url, body) => {
    const send = (app: express.Express) => {
      const call = request(app)[method](url);
      return body ? call.send(body) : call;
    };
    const [expected, actual] = await Promise.all([send(viaRouter), send(direct)]);
    expect(actual.status).toBe(expected.status);
    const headers = (h: Record<string, string>) => {
      const { date: _date, ...rest } = h;
      return rest;
    };
    expect(headers(actual.headers)).toEqual(headers(expected.headers));
    expect(actual.text).toEqual(expected.text);
  });

  it('takes a /v1/ request past the router, and leaves others to it', async () => {
    // The shadowed route is after the mount: only the router would ever try it, and the mount ends every
    // request first either way; what shows the direct way is the handler reached without the router.
    const routerHandle = jest.spyOn(routerOf(direct), 'handle');
    await request(direct).get('/v1/things/1').expect(200);
    expect(routerHandle).not.toHaveBeenCalled();
    await request(direct).get('/elsewhere').expect(404);
    expect(routerHandle).toHaveBeenCalledTimes(1);
    routerHandle.mockRestore();
  });

  it('sets X-Powered-By when the app has it on, as app.handle does', async () => {
    const app = service(true);
    app.enable('x-powered-by');
    const answer = await request(app).get('/v1/things/1').expect(200);
    expect(answer.headers['x-powered-by']).toBe('Express');
  });

  it('ends the connection on an error after the answer began, and says so', async () => {
    const log: unknown[] = [];
    const app = service(true, log);
    await expect(request(app).get('/v1/late')).rejects.toThrow();
    expect(log).toEqual(['too late']);
  });

  it('leaves a request into a mounted app (a callback given) to the router', async () => {
    const outer = express();
    const inner = service(true);
    const routerHandle = jest.spyOn(routerOf(inner), 'handle');
    outer.use(inner);
    await request(outer).get('/v1/things/7').expect(200);
    expect(routerHandle).toHaveBeenCalled();
  });
});
