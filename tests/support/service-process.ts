import { spawn, type ChildProcess } from 'node:child_process';
import http from 'node:http';
import net from 'node:net';
import path from 'node:path';
import { generateKeySecret, hashKeySecret } from '../../api/auth/key-secret';
import { projectRoot } from '../../api/config';
import { openDatabase } from '../../api/db/database';
import { newId } from '../../api/db/ids';
import type { KeyRole } from '../../api/db/models/api-key';

/** Test timeout for tests that start the real service: tsx compiles it first, slowly on a busy machine. */
export const STARTS_THE_SERVICE_MS = 120_000;

export const PROCESS_KEY_HASH_SECRET = 'process-test-key-hash-secret-0123456789';

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

function healthy(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    http
      .get({ host: '127.0.0.1', port, path: '/healthz' }, (res) => {
        res.resume();
        resolve(res.statusCode === 200);
      })
      .on('error', () => resolve(false));
  });
}

export interface ServiceProcess {
  port: number;
  child: ChildProcess;
  /** Everything the process wrote to stdout and stderr so far. */
  output(): string;
  /** Resolves with the exit code once the process has ended. */
  exited: Promise<number | null>;
  /** Sends SIGTERM (if still running) and waits for the exit. */
  stop(): Promise<number | null>;
}

/** Starts the real service (`api/main.ts`) on a free port and waits until it answers `/healthz`. */
export async function startService(
  databaseUrl: string,
  dir: string,
  env: Record<string, string> = {},
): Promise<ServiceProcess> {
  const port = await freePort();
  let output = '';
  const child = spawn(process.execPath, ['--import', 'tsx', 'api/main.ts'], {
    cwd: projectRoot,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      ISOCHRON_KEY_HASH_SECRET: PROCESS_KEY_HASH_SECRET,
      ISOCHRON_SESSION_SECRET: 'process-test-session-secret-0123456789',
      SEED_DEMO_DATA: 'false',
      CONSOLE_DIR: path.join(dir, 'no-console'),
      LOG_LEVEL: 'warn',
      // Load tests drive many keys of one user; the per-user ceiling has tests of its own.
      USER_RATE_LIMIT_PER_MINUTE: '1000000',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.on('data', (chunk) => (output += chunk));
  child.stderr!.on('data', (chunk) => (output += chunk));
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the service exited with ${child.exitCode}: ${output}`);
    if (await healthy(port)) break;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  return {
    port,
    child,
    output: () => output,
    exited,
    stop: async () => {
      if (child.exitCode === null) child.kill('SIGTERM');
      return exited;
    },
  };
}

/** A database file with one user and `count` keys of one role; answers the clear keys and the user id. */
export async function databaseWithKeys(
  databaseUrl: string,
  options: { role: KeyRole; count: number; userRole?: 'admin' | 'developer' },
): Promise<{ secrets: string[]; userId: string }> {
  const secrets: string[] = [];
  const userId = newId('usr');
  const db = await openDatabase(databaseUrl);
  await db.write(async (transaction) => {
    await db.models.User.create(
      {
        id: userId,
        email: 'rig@test.example',
        name: null,
        role: options.userRole ?? 'developer',
        passwordHash: null,
        lastSignInAt: null,
      },
      { transaction },
    );
    for (let i = 0; i < options.count; i += 1) {
      const { secret, prefix, lastFour } = generateKeySecret('test');
      secrets.push(secret);
      await db.models.ApiKey.create(
        {
          id: newId('key'),
          name: `Rig ${i}`,
          role: options.role,
          kind: 'test',
          prefix,
          lastFour,
          secretHash: hashKeySecret(secret, PROCESS_KEY_HASH_SECRET),
          ownerId: userId,
          createdById: null,
          rateLimitPerMinute: 100_000,
          expiresAt: null,
          revokedAt: null,
          lastUsedAt: null,
        },
        { transaction },
      );
    }
  });
  await db.close();
  return { secrets, userId };
}
