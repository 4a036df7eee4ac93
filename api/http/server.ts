import http from 'node:http';
import type { Express, NextFunction } from 'express';
import type { Principal } from '../auth/permissions';

/**
 * A request with every field that Express, its router, the body parsers and the service's stages set on
 * an API request declared from construction (undefined until set), in one order. Node builds each request and
 * answer from the classes the server is given (`http.createServer` options `IncomingMessage` and
 * `ServerResponse`, documented for extending them). Fields added one by one as a request passes the
 * stages give every request a chain of hidden-class changes and a property store that is regrown and
 * copied, and leave the code along the way reading objects of many shapes; declared up front, every
 * request has one shape. In `npm run bench`, bare Express doing the same calculation took about half
 * its CPU per request on these classes (target F against E), and the full chain about 0.6 of what it
 * took on Node's own (DEVELOPERS.md, "How a request flows", step 0).
 *
 * Only plain data fields belong here: a field named like one of Express's request getters (`query`,
 * `path`, `ip`, …) would hide the getter, and the console's session middleware replaces methods of an
 * answer (`end`, `writeHead`) that must never be declared. tests/api/http-server.test.ts fails when an
 * API request gains a field not listed.
 */
export class ServiceRequest extends http.IncomingMessage {
  // Express (app.handle, the router, Route#dispatch), and parseurl's caches of the parsed URL.
  res?: http.ServerResponse = undefined;
  originalUrl?: string = undefined;
  baseUrl?: string = undefined;
  next?: NextFunction = undefined;
  params?: Record<string, string> = undefined;
  route?: unknown = undefined;
  _parsedUrl?: unknown = undefined;
  _parsedOriginalUrl?: unknown = undefined;
  // Body parsers: express.json, multer.
  body?: unknown = undefined;
  file?: unknown = undefined;
  // The service's stages (authenticate, validate).
  principal?: Principal = undefined;
  validated?: unknown = undefined;
}

/** An answer with the fields Express and the stages set on it declared from construction (see above). */
export class ServiceResponse extends http.ServerResponse<ServiceRequest> {
  // Node keeps these two on the prototype until an answer sets them.
  override statusCode = 200;
  override statusMessage = undefined as unknown as string;
  locals?: Record<string, unknown> = undefined;
}

/** The service's HTTP server: the app, with requests and answers of one shape each. */
export function createServer(app: Express): http.Server<typeof ServiceRequest, typeof ServiceResponse> {
  return http.createServer(
    { IncomingMessage: ServiceRequest, ServerResponse: ServiceResponse },
    app as unknown as http.RequestListener<typeof ServiceRequest, typeof ServiceResponse>,
  );
}

/**
 * Listens as Express's `app.listen` does: the callback gets a listening error too, instead of it being
 * thrown as an unhandled 'error' event.
 */
export function listen(
  server: http.Server,
  port: number,
  host: string | undefined,
  callback: (error?: Error) => void,
): http.Server {
  let called = false;
  const done = (error?: Error) => {
    if (called) return;
    called = true;
    callback(error);
  };
  server.once('error', done);
  return host === undefined ? server.listen(port, () => done()) : server.listen(port, host, () => done());
}
