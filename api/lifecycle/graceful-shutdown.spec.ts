import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { gracefulShutdown } from './graceful-shutdown';

/** A server whose answers wait until the test releases them. */
function gatedServer() {
  const waiting: Array<() => void> = [];
  const server = http.createServer((_req, res) => {
    waiting.push(() => res.end('done'));
  });
  return { server, waiting };
}

function get(port: number, agent: http.Agent): Promise<{ status: number; connection?: string }> {
  return new Promise((resolve, reject) => {
    http
      .get({ host: '127.0.0.1', port, path: '/', agent }, (res) => {
        res.resume();
        res.on('end', () => resolve({ status: res.statusCode ?? 0, connection: res.headers.connection }));
      })
      .on('error', reject);
  });
}

const until = async (check: () => boolean) => {
  while (!check()) await new Promise((resolve) => setTimeout(resolve, 5));
};

describe('gracefulShutdown', () => {
  it('answers the request in flight with Connection: close, then closes and runs close()', async () => {
    const { server, waiting } = gatedServer();
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as AddressInfo;
    const closed = jest.fn(async () => undefined);
    const shutdown = gracefulShutdown(server, { deadlineMs: 10_000, close: closed, log: () => undefined });
    const agent = new http.Agent({ keepAlive: true });

    const first = get(port, agent);
    await until(() => waiting.length === 1);
    waiting.shift()!();
    expect(await first).toEqual({ status: 200, connection: 'keep-alive' });

    const inFlight = get(port, agent);
    await until(() => waiting.length === 1);
    const stopped = shutdown.stop('test');
    expect(closed).not.toHaveBeenCalled();
    waiting.shift()!();
    expect(await inFlight).toEqual({ status: 200, connection: 'close' });
    await stopped;
    expect(closed).toHaveBeenCalledTimes(1);
    await expect(get(port, agent)).rejects.toMatchObject({ code: 'ECONNREFUSED' });
    agent.destroy();
  });

  it('cuts a request still running at the deadline, then runs close()', async () => {
    const { server, waiting } = gatedServer();
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as AddressInfo;
    const closed = jest.fn(async () => undefined);
    const shutdown = gracefulShutdown(server, { deadlineMs: 200, close: closed, log: () => undefined });
    const agent = new http.Agent({ keepAlive: true });
    const stuck = get(port, agent);
    await until(() => waiting.length === 1);
    await shutdown.stop('test');
    await expect(stuck).rejects.toMatchObject({ code: 'ECONNRESET' });
    expect(closed).toHaveBeenCalledTimes(1);
    agent.destroy();
  });
});
