import { mkdtempSync, rmSync } from 'node:fs';
import http from 'node:http';
import net from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { openDatabase } from '../../api/db/database';
import {
  databaseWithKeys,
  startService,
  type ServiceProcess,
  STARTS_THE_SERVICE_MS,
} from '../support/service-process';

const DEADLINE_MS = 1500;
const CLIENT_GIVE_UP_MS = 25_000;

interface ClientLog {
  ok: number;
  /** Responses that said `Connection: close`, and responses that still came after one did. */
  closeHeaders: number;
  afterClose: number;
  ended: string;
}

/** One keep-alive client sending calculations back to back on one connection until the service is gone. */
function keepAliveClient(port: number, key: string): Promise<ClientLog> {
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  const body = JSON.stringify({
    sampleRateHz: 48000,
    filters: [{ type: 'peaking', frequencyHz: 1000, gainDb: -3, q: 1.41 }],
  });
  const log: ClientLog = { ok: 0, closeHeaders: 0, afterClose: 0, ended: '' };
  const started = Date.now();
  return new Promise((resolve) => {
    const next = () => {
      if (Date.now() - started > CLIENT_GIVE_UP_MS) {
        log.ended = 'gave up: the service kept answering';
        agent.destroy();
        return resolve(log);
      }
      const req = http.request(
        {
          host: '127.0.0.1',
          port,
          method: 'POST',
          path: '/v1/biquads',
          agent,
          headers: {
            Authorization: `Bearer ${key}`,
            'Content-Type': 'application/json',
            'Content-Length': Buffer.byteLength(body),
          },
        },
        (res) => {
          res.resume();
          res.on('end', () => {
            if (res.statusCode === 200) log.ok += 1;
            if (log.closeHeaders > 0) log.afterClose += 1;
            if (res.headers.connection === 'close') log.closeHeaders += 1;
            setImmediate(next);
          });
        },
      );
      req.on('error', (err: NodeJS.ErrnoException) => {
        log.ended = err.code ?? err.message;
        agent.destroy();
        resolve(log);
      });
      req.end(body);
    };
    next();
  });
}

/** A client that sends its headers and then one byte of its body every 200 ms, never finishing. */
function slowBody(port: number, key: string): Promise<{ cutAfterSignalMs: number | null; answer: string }> {
  return new Promise((resolve) => {
    const socket = net.connect(port, '127.0.0.1');
    let answer = '';
    let signalAt: number | null = null;
    let timer: NodeJS.Timeout;
    socket.on('connect', () => {
      socket.write(
        `POST /v1/delays HTTP/1.1\r\nHost: 127.0.0.1\r\nAuthorization: Bearer ${key}\r\n` +
          'Content-Type: application/json\r\nContent-Length: 100000\r\n\r\n{',
      );
      timer = setInterval(() => socket.write(' '), 200);
    });
    socket.on('data', (chunk) => (answer += chunk.toString()));
    const done = () => {
      clearInterval(timer);
      resolve({ cutAfterSignalMs: signalAt === null ? null : Date.now() - signalAt, answer });
    };
    socket.on('close', done);
    socket.on('error', () => undefined);
    (socket as unknown as { markSignal: () => void }).markSignal = () => (signalAt = Date.now());
    slowSockets.push(socket as unknown as { markSignal: () => void });
  });
}
const slowSockets: Array<{ markSignal: () => void }> = [];

describe('SIGTERM under keep-alive load and a slow body', () => {
  it(
    'stops accepting, closes keep-alive connections, cuts the slow body at the deadline, writes all usage, exits 0',
    async () => {
      const dir = mkdtempSync(path.join(tmpdir(), 'isochron-shutdown-'));
      const databaseUrl = `sqlite:${path.join(dir, 'service.sqlite')}`;
      let service: ServiceProcess | undefined;
      try {
        const { secrets } = await databaseWithKeys(databaseUrl, { role: 'calculate', count: 5 });
        service = await startService(databaseUrl, dir, {
          SHUTDOWN_DEADLINE_MS: String(DEADLINE_MS),
          // Long enough that only the shutdown flush can have written the counts.
          USAGE_FLUSH_INTERVAL_MS: '3600000',
        });
        let signalAt = 0;
        const { port } = service;
        const slow = slowBody(port, secrets[4]);
        const clients = secrets.slice(0, 4).map((key) => keepAliveClient(port, key));
        await new Promise((resolve) => setTimeout(resolve, 700));
        signalAt = Date.now();
        slowSockets.forEach((s) => s.markSignal());
        service.child.kill('SIGTERM');

        const code = await service.exited;
        const shutdownMs = Date.now() - signalAt;
        const logs = await Promise.all(clients);
        const cut = await slow;

        expect(code).toBe(0);
        for (const log of logs) {
          expect(log.ended).not.toMatch(/gave up/);
          expect(log.ok).toBeGreaterThan(0);
          // Once stopping, an answer says the connection closes; nothing comes after it, and no new connection is taken.
          expect(log.closeHeaders).toBeLessThanOrEqual(1);
          expect(log.afterClose).toBe(0);
          expect(log.ended).toMatch(/ECONNREFUSED|ECONNRESET|socket hang up|EPIPE/);
        }
        // The slow body got no answer and was cut when the deadline came, not before.
        expect(cut.answer).toBe('');
        expect(cut.cutAfterSignalMs).toBeGreaterThanOrEqual(DEADLINE_MS - 100);
        // Generous: the point is that it ends at all (it used to run on for minutes).
        expect(shutdownMs).toBeLessThan(DEADLINE_MS + 8000);

        const completed = logs.reduce((sum, log) => sum + log.ok, 0);
        const reopened = await openDatabase(databaseUrl);
        try {
          expect(await reopened.models.UsageBucket.sum('count')).toBe(completed);
        } finally {
          await reopened.close();
        }
        console.log(
          `shutdown under load: ${completed} calls answered, exit ${shutdownMs} ms after SIGTERM ` +
            `(deadline ${DEADLINE_MS} ms), slow body cut after ${cut.cutAfterSignalMs} ms`,
        );
      } finally {
        if (service?.child.exitCode === null) service.child.kill('SIGKILL');
        rmSync(dir, { recursive: true, force: true });
      }
    },
    STARTS_THE_SERVICE_MS,
  );
});
