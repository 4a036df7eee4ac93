import { type ChildProcess, spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { plainRequest } from './http';

const root = path.resolve(__dirname, '../../..');

export interface RunningService {
  origin: string;
  /** Everything the service printed, for failure messages. */
  output: () => string;
  stop: () => Promise<void>;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

async function waitUntilReady(origin: string, child: ChildProcess, output: () => string): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`The service exited with ${child.exitCode}:\n${output()}`);
    try {
      const response = await plainRequest(`${origin}/readyz`);
      if (response.status === 200) return;
    } catch {
      // Not listening yet.
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`The service did not become ready within 60 s:\n${output()}`);
}

/**
 * Starts the built service (`dist/server/api/main.js`) on a free loopback port with a fresh SQLite file,
 * in development mode so the demo data is seeded and mail goes to the local outbox.
 */
export async function startService(): Promise<RunningService> {
  const port = await freePort();
  const origin = `http://127.0.0.1:${port}`;
  const dataDir = mkdtempSync(path.join(tmpdir(), 'isochron-browser-'));
  let log = '';
  const child = spawn(process.execPath, [path.join(root, 'dist/server/api/main.js')], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'development',
      PORT: String(port),
      DATABASE_URL: `sqlite:${path.join(dataDir, 'isochron.sqlite')}`,
      PUBLIC_URL: origin,
      USAGE_FLUSH_INTERVAL_MS: '200',
      SMTP_URL: '',
      LOG_LEVEL: 'warn',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (chunk: Buffer) => (log += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (log += chunk.toString()));
  const output = () => log;
  try {
    await waitUntilReady(origin, child, output);
  } catch (error) {
    child.kill('SIGKILL');
    rmSync(dataDir, { recursive: true, force: true });
    throw error;
  }
  return {
    origin,
    output,
    stop: async () => {
      if (child.exitCode === null) {
        // A graceful stop flushes metered usage; a service that hangs is killed after 10 s.
        let timer: NodeJS.Timeout | undefined;
        const exited = new Promise((resolve) => child.once('exit', resolve));
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((resolve) => (timer = setTimeout(resolve, 10_000)))]);
        clearTimeout(timer);
        if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
      }
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
