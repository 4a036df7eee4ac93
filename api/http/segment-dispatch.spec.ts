import express, { Router, type ErrorRequestHandler, type RequestHandler } from 'express';
import request from 'supertest';
import { chain } from './chain';
import { dispatchByFirstSegment, exactRoutes, firstSegments } from './segment-dispatch';

/** Routers shaped like the resource routers: full paths, parameters, nested routers, one catch-all. */
function routers(): Router[] {
  const say =
    (what: string): RequestHandler =>
    (req, res) => {
      res.json({
        what,
        params: req.params,
        baseUrl: req.baseUrl,
        path: req.path,
        route: (req.route as { path?: string }).path,
      });
    };
  const calculations = Router();
  calculations.post('/delays', say('delays'));
  calculations.post('/biquads', say('biquads'));
  calculations.post('/eq/fit', say('fit'));
  const rooms = Router();
  rooms.get('/rooms', say('rooms'));
  rooms.get('/rooms/:roomId', say('room'));
  const reports = Router();
  reports.get('/rooms/:roomId/report', say('report'));
  rooms.use(reports);
  const shadow = Router();
  shadow.post('/biquads', say('second biquads'));
  shadow.get('/rooms/:roomId/report', say('second report'));
  const params = Router();
  params.get('/:anything/params', say('params'));
  // Routes that pass the request on, in every way a handler can.
  const passing = Router();
  passing.post('/pass', (_req, _res, next) => next());
  passing.post('/fail', (_req, _res, next) => next(new Error('failed')));
  passing.post('/throw', () => {
    throw new Error('thrown');
  });
  passing.post('/skip', (_req, _res, next) => next('route'), say('never'));
  passing.post('/leave', (_req, _res, next) => next('router'), say('never'));
  passing.post('/two', (_req, _res, next) => next(), say('second handler'));
  passing.post('/last-passes', say('never'));
  passing.post(
    '/last-passes',
    (_req, _res, next) => next(),
    (_req, _res, next) => next('route'),
  );
  // A route with its own error handler: run by its own dispatch.
  const recover: ErrorRequestHandler = (err: Error, req, res, _next) => {
    res.json({ recovered: err.message, route: (req.route as { path?: string }).path });
  };
  const fail: RequestHandler = (_req, _res, next) => next(new Error('recoverable'));
  passing.post('/recover', fail, recover);
  const nested = Router();
  nested.post('/nested/static', say('nested'));
  passing.use(nested);
  return [calculations, rooms, shadow, params, passing];
}

function app(mount: RequestHandler): express.Express {
  const app = express();
  app.use('/v1', mount, (req, res) => {
    res.status(404).json({ what: 'none', path: req.path });
  });
  app.use(((err: Error, _req, res, _next) => {
    res.status(500).json({ error: err.message });
  }) as express.ErrorRequestHandler);
  return app;
}

const viaExpress = (() => {
  const router = Router();
  for (const r of routers()) router.use(r);
  return app(router);
})();
const viaDispatch = app(dispatchByFirstSegment(routers()));

describe('firstSegments', () => {
  it('reads the first segments of routes and nested routers, lower case', () => {
    const [calculations, rooms] = routers();
    expect([...(firstSegments(calculations) ?? [])].sort()).toEqual(['biquads', 'delays', 'eq']);
    expect([...(firstSegments(rooms) ?? [])]).toEqual(['rooms']);
  });

  it('gives up (any path) on a parameter first, on middleware for every path, on a non-router', () => {
    expect(firstSegments(routers()[3])).toBeNull();
    const withMiddleware = Router();
    withMiddleware.use((_req, _res, next) => next());
    expect(firstSegments(withMiddleware)).toBeNull();
    const mounted = Router();
    mounted.use('/docs', Router());
    expect(firstSegments(mounted)).toBeNull();
    expect(firstSegments(() => undefined)).toBeNull();
  });
});

describe('exactRoutes', () => {
  const keys = (exact: ReturnType<typeof exactRoutes>) =>
    [...exact].flatMap(([method, byPath]) => [...byPath.keys()].map((path) => `${method} ${path}`)).sort();

  it('lists the plain-path routes that are the only layer answering their method and path', () => {
    expect(keys(exactRoutes(routers()))).toEqual([
      'GET /rooms',
      'POST /delays',
      'POST /eq/fit',
      'POST /fail',
      'POST /leave',
      'POST /nested/static',
      'POST /pass',
      'POST /recover',
      'POST /skip',
      'POST /throw',
      'POST /two',
    ]);
  });

  it('leaves out a path that middleware or a second route also matches, and routers it cannot read', () => {
    const first = Router();
    first.post('/biquads', (_req, res) => res.end());
    first.get('/levels', (_req, res) => res.end());
    const second = Router();
    second.use('/levels', (_req, _res, next) => next());
    expect(keys(exactRoutes([first]))).toEqual(['GET /levels', 'POST /biquads']);
    expect(keys(exactRoutes([first, second]))).toEqual(['POST /biquads']);
    expect(exactRoutes([first, (() => undefined) as unknown as Router]).size).toBe(0);
    const caseSensitive = Router({ caseSensitive: true });
    caseSensitive.post('/Fit', (_req, res) => res.end());
    expect(exactRoutes([first, caseSensitive]).size).toBe(0);
  });
});

describe('dispatchByFirstSegment', () => {
  const cases: Array<['get' | 'post' | 'head' | 'options', string]> = [
    ['post', '/v1/biquads'],
    ['post', '/v1/BiQuads/'],
    ['post', '/v1/biquads?x=1'],
    ['post', '/v1/delays'],
    ['post', '/v1/eq/fit'],
    ['post', '/v1/eq'],
    ['get', '/v1/rooms'],
    ['get', '/v1/rooms/r1'],
    ['get', '/v1/ROOMS/r1/report'],
    ['get', '/v1/rooms/r1/params'],
    ['get', '/v1/x/params'],
    ['get', '/v1/b%69quads/params'],
    ['post', '/v1/b%69quads'],
    ['get', '/v1'],
    ['get', '/v1/'],
    ['get', '/v1//rooms'],
    ['get', '/v1/nothing'],
    ['get', '/v1/biquads'],
    ['post', '/v1/pass'],
    ['post', '/v1/fail'],
    ['post', '/v1/throw'],
    ['post', '/v1/skip'],
    ['post', '/v1/leave'],
    ['post', '/v1/two'],
    ['post', '/v1/last-passes'],
    ['post', '/v1/recover'],
    ['post', '/v1/Two?x=1'],
    ['post', '/v1/nested/static'],
    ['post', '/v1/nested/static/'],
    ['head', '/v1/rooms'],
    ['options', '/v1/delays'],
  ];
  it.each(cases)('answers %s %s as the same routers mounted one after another do', async (method, url) => {
    const agent = (a: express.Express) => request(a)[method](url);
    const [expected, actual] = await Promise.all([agent(viaExpress), agent(viaDispatch)]);
    expect({ status: actual.status, body: actual.body as unknown }).toEqual({
      status: expected.status,
      body: expected.body as unknown,
    });
  });
});

describe('chain', () => {
  const trace =
    (name: string, log: string[]): RequestHandler =>
    (_req, _res, next) => {
      log.push(name);
      next();
    };

  it('runs the handlers in order, and hands a throw, a rejection or next(err) to the error path', async () => {
    const log: string[] = [];
    const fail: Record<string, RequestHandler> = {
      throw: () => {
        throw new Error('thrown');
      },
      reject: () => Promise.reject(new Error('rejected')),
      next: (_req, _res, next) => next(new Error('passed')),
    };
    const a = express();
    for (const [name, handler] of Object.entries(fail)) {
      a.get(`/${name}`, chain(trace('a', log), handler, trace('never', log)));
    }
    a.get(
      '/ok',
      chain(trace('a', log), trace('b', log), (_req, res) => res.send('ok')),
    );
    a.use(((err: Error, _req, res, _next) => {
      res.status(500).send(err.message);
    }) as express.ErrorRequestHandler);
    expect((await request(a).get('/ok')).text).toBe('ok');
    expect((await request(a).get('/throw')).text).toBe('thrown');
    expect((await request(a).get('/reject')).text).toBe('rejected');
    expect((await request(a).get('/next')).text).toBe('passed');
    expect(log).toEqual(['a', 'b', 'a', 'a', 'a']);
  });

  it("goes on after next('route') and leaves after next('router'), as a router does", async () => {
    const log: string[] = [];
    const a = express();
    a.use(chain((_req, _res, next) => next('route'), trace('after route', log)));
    a.use(chain((_req, _res, next) => next('router'), trace('never', log)));
    a.use((_req, res) => res.send('not reached'));
    expect((await request(a).get('/')).status).toBe(404);
    expect(log).toEqual(['after route']);
  });
});
