import type { IncomingMessage, Server, ServerResponse } from 'node:http';

export interface ShutdownOptions {
  /** How long requests already in flight may take before their connections are cut. */
  deadlineMs: number;
  /** Runs once every connection has ended: flush what is kept in memory, close the database. */
  close: () => Promise<void>;
  log: (message: string) => void;
}

export interface Shutdown {
  /** Stops accepting, lets requests in flight finish until the deadline, then runs `close`. */
  stop(reason: string): Promise<void>;
  readonly stopping: boolean;
}

/**
 * Graceful shutdown for a Node HTTP server under load. `server.close()` alone only stops accepting new
 * connections: keep-alive clients go on sending requests on the ones they have, and one slow body holds
 * its connection for as long as the client likes. So, once stopping: every response (in flight or not
 * yet started) carries `Connection: close`, idle keep-alive connections are closed at once, and after
 * `deadlineMs` whatever is still open is cut. Then `close` runs.
 */
export function gracefulShutdown(server: Server, options: ShutdownOptions): Shutdown {
  let stopping: Promise<void> | null = null;
  const inFlight = new Set<ServerResponse>();

  const closeWhenStopping = (res: ServerResponse) => {
    if (!res.headersSent) res.setHeader('Connection', 'close');
  };
  // Before the app's own listener, so even an answer sent synchronously carries the header.
  server.prependListener('request', (_req: IncomingMessage, res: ServerResponse) => {
    if (stopping) closeWhenStopping(res);
    inFlight.add(res);
    res.once('close', () => inFlight.delete(res));
  });

  const stop = (reason: string): Promise<void> => {
    stopping ??= new Promise<void>((resolve, reject) => {
      options.log(
        `${reason}: no new connections; ${inFlight.size} request(s) in flight get up to ${options.deadlineMs} ms`,
      );
      const allClosed = new Promise<void>((done) => server.close(() => done()));
      for (const res of inFlight) closeWhenStopping(res);
      server.closeIdleConnections();
      // A keep-alive connection goes idle between requests; close each as soon as it does.
      const sweep = setInterval(() => server.closeIdleConnections(), 50);
      const deadline = setTimeout(() => {
        options.log(`shutdown deadline reached: cutting ${inFlight.size} request(s) still in flight`);
        server.closeAllConnections();
      }, options.deadlineMs);
      allClosed
        .then(() => {
          clearInterval(sweep);
          clearTimeout(deadline);
          return options.close();
        })
        .then(resolve, reject);
    });
    return stopping;
  };

  return {
    stop,
    get stopping() {
      return stopping !== null;
    },
  };
}
