import http from 'node:http';

export interface BurstRequest {
  method: 'GET' | 'POST' | 'PATCH';
  path: string;
  headers?: Record<string, string>;
  body?: unknown;
}

/** What the client saw: a status for each completed response, or the error that ended the request. */
export type BurstOutcome =
  { status: number; headers?: http.IncomingHttpHeaders; body?: string } | { error: string };

/**
 * Sends every request at once over a keep-alive pool of `sockets` connections, the way a busy client
 * would, and reports each outcome. `onResponse` runs after each completed response (e.g. to stop the
 * server mid-burst).
 */
export async function burst(
  port: number,
  requests: BurstRequest[],
  options: { sockets?: number; onResponse?: (completed: number) => void } = {},
): Promise<BurstOutcome[]> {
  const agent = new http.Agent({ keepAlive: true, maxSockets: options.sockets ?? 32 });
  let completed = 0;
  try {
    return await Promise.all(
      requests.map(
        (spec) =>
          new Promise<BurstOutcome>((resolve) => {
            const payload = spec.body === undefined ? undefined : JSON.stringify(spec.body);
            const req = http.request(
              {
                host: '127.0.0.1',
                port,
                method: spec.method,
                path: spec.path,
                agent,
                headers: {
                  ...spec.headers,
                  ...(payload !== undefined && {
                    'Content-Type': 'application/json',
                    'Content-Length': Buffer.byteLength(payload),
                  }),
                },
              },
              (res) => {
                let body = '';
                res.setEncoding('utf8');
                res.on('data', (chunk: string) => (body += chunk));
                res.on('end', () => {
                  completed += 1;
                  resolve({ status: res.statusCode ?? 0, headers: res.headers, body });
                  options.onResponse?.(completed);
                });
                res.on('error', (err) => resolve({ error: err.message }));
              },
            );
            req.on('error', (err) => resolve({ error: (err as NodeJS.ErrnoException).code ?? err.message }));
            req.end(payload);
          }),
      ),
    );
  } finally {
    agent.destroy();
  }
}

export const completedResponses = (outcomes: BurstOutcome[]): number =>
  outcomes.filter((o) => 'status' in o).length;
