import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { authenticate } from './auth/authenticate';
import { chain } from './http/chain';
import { mountDirectly } from './http/direct-mount';
import { refuseNulInUrl } from './http/nul-guard';
import { fixedSecurityHeaders, securityHeaders } from './http/security-headers';
import { requestId } from './http/request-id';
import { notFoundHandler, problemHandler } from './http/problem';
import { presentNumbersInAnswers } from './http/present';
import { createRateLimits } from './rate-limit/rate-limits';
import { getContract } from './http/validate';
import { storageProblem } from './db/storage-errors';
import { docsRouter } from './service/docs.router';
import { healthRouter, sharedStateProblem } from './service/health.router';
import { isRedisFailure } from './shared-state/shared-state';
import { sessionRouter } from './session/session.router';
import { v1Router } from './v1-router';
import type { Services } from './services';

/** JSON bodies above this size get 413; 128 channels with measured responses fit well inside it. */
const JSON_BODY_LIMIT = '2mb';

export interface AppOptions {
  /**
   * Whether `/v1/…` requests skip the app router's walk (`mountDirectly`); on by default. Off only in
   * the spec that checks both ways answer alike.
   */
  directApi?: boolean;
}

export function createApp(services: Services, options: AppOptions = {}): Express {
  const { config } = services;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxyHops);
  app.set('json spaces', 0);
  // No ETag on JSON answers: an API answer is never cached (Cache-Control: no-store), so the SHA-1 of
  // every body was work for nobody. Static files (the console) keep theirs, from express.static.
  app.set('etag', false);
  presentNumbersInAnswers(app);

  // Every response carries a request id and the security headers: a page helmet's set, an API answer
  // the few a JSON answer needs.
  const pageHeaders = fixedSecurityHeaders(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
        },
      },
    }),
  );
  // With the JSON body parser as one layer: every request passes them all.
  const everyRequest = chain(
    requestId,
    refuseNulInUrl,
    securityHeaders(pageHeaders),
    express.json({ limit: JSON_BODY_LIMIT, strict: true }),
  );
  app.use(everyRequest);

  // The API first and as one layer: its requests pass no other router's layers, and its stages run as
  // plain calls (see `chain`), in this order; `v1Router` picks the resource routers by path segment.
  const api = chain(
    authenticate(services.keys, services.sessionPrincipal),
    // Counted in this process, or in Redis shared by every instance (services.shared).
    createRateLimits(services, {
      key: services.shared.rateLimitStore('key'),
      user: services.shared.rateLimitStore('user'),
    }),
    services.usage.middleware,
    v1Router(services),
    notFoundHandler,
  );
  app.use('/v1', api);

  app.use(healthRouter(services));
  app.use(docsRouter(getContract().document));
  app.use('/auth', sessionRouter(services));

  serveConsole(app, config.consoleDir);
  app.use(notFoundHandler);
  const problems = problemHandler(
    services.logger,
    (err) => storageProblem(err) ?? (isRedisFailure(err) ? sharedStateProblem() : null),
  );
  app.use(problems);

  // `/v1/…` reaches the same stages without the app router's walk (see `mountDirectly`).
  if (options.directApi !== false) {
    mountDirectly(app, {
      path: '/v1',
      before: everyRequest,
      mounted: api,
      errors: problems,
      // As Express's final handler: an error once the answer has begun can only end the connection.
      lastResort: (err, req, res) => {
        services.logger.error(
          { err, requestId: res.getHeader('Request-Id'), path: req.path },
          'error after the answer began',
        );
        if (res.headersSent) req.socket.destroy();
        else res.status(500).end();
      },
    });
  }
  return app;
}

/** The built console, with its client-side routes answered by index.html. */
function serveConsole(app: Express, consoleDir: string): void {
  const index = path.join(consoleDir, 'index.html');
  if (!existsSync(index)) return;
  app.use(express.static(consoleDir, { index: false, maxAge: '1h' }));
  app.get(/^\/(?!v1\/|auth\/|docs|openapi\.json|healthz|readyz).*/, (req, res, next) => {
    if (!req.accepts('html')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
