import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { generateKeySecret, hashKeySecret } from '../../../api/auth/key-secret';
import { hashPassword } from '../../../api/auth/password';
import { openDatabase, type Database } from '../../../api/db/database';
import { newId } from '../../../api/db/ids';
import type { KeyRole } from '../../../api/db/models/api-key';
import type { UserRole } from '../../../api/db/models/user';
import { createPostgresDatabase, testPostgresUrl, testRedisUrl, uniqueName } from '../../support/engines';
import {
  freePort,
  PROCESS_KEY_HASH_SECRET,
  startService,
  type ServiceProcess,
} from '../../support/service-process';

/**
 * Several real instances (`api/main.ts` as child processes) on one fresh PostgreSQL database and one
 * Redis prefix, behind HAProxy from Debian: the scaled set-up of the README, started by the test.
 */
export interface ScaledRig {
  proxyPort: number;
  instances: ServiceProcess[];
  publicUrl: string;
  databaseUrl: string;
  /** The rig's database, opened by the test itself (for seeding and for checking what was stored). */
  db: Database;
  redisPrefix: string;
  addUser(role: UserRole, email: string, password?: string): Promise<string>;
  addKey(
    role: KeyRole,
    ownerId: string,
    rateLimitPerMinute?: number | null,
  ): Promise<{ id: string; secret: string }>;
  close(): Promise<void>;
}

export const RIG_PASSWORD = 'scaled-rig-password-4471';

function haproxyConfig(proxyPort: number, ports: number[]): string {
  return [
    'global',
    '  maxconn 4096',
    'defaults',
    '  mode http',
    '  timeout connect 2s',
    '  timeout client 60s',
    '  timeout server 60s',
    '  option http-keep-alive',
    // A connection an instance refuses (it is shutting down) is tried on another one.
    '  retries 3',
    '  option redispatch',
    'frontend isochron',
    `  bind 127.0.0.1:${proxyPort}`,
    '  default_backend instances',
    'backend instances',
    '  balance roundrobin',
    '  option httpchk GET /readyz',
    '  http-check expect status 200',
    // Readiness writes a row: under a burst of writes it may take a moment, which is not being down.
    '  timeout check 5s',
    '  option forwardfor',
    ...ports.map((port, i) => `  server instance${i + 1} 127.0.0.1:${port} check inter 1s fall 3 rise 1`),
    '',
  ].join('\n');
}

function answers(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    http
      .get({ host: '127.0.0.1', port, path: '/readyz' }, (res) => {
        res.resume();
        resolve(res.statusCode === 200);
      })
      .on('error', () => resolve(false));
  });
}

export function requireScaledEngines(): { postgresUrl: string; redisUrl: string } {
  const missing = [
    !testPostgresUrl && 'ISOCHRON_TEST_POSTGRES_URL',
    !testRedisUrl && 'ISOCHRON_TEST_REDIS_URL',
    spawnSync('haproxy', ['-v']).status !== 0 && 'haproxy (apt-get install -y haproxy)',
  ].filter(Boolean);
  if (missing.length > 0) {
    // Run by `npm run test:scaled`, which provides all three; never skipped quietly.
    throw new Error(`The scaled tests need ${missing.join(', ')}; run them with npm run test:scaled.`);
  }
  return { postgresUrl: testPostgresUrl!, redisUrl: testRedisUrl! };
}

export async function startScaledRig(count: number, env: Record<string, string> = {}): Promise<ScaledRig> {
  const { postgresUrl, redisUrl } = requireScaledEngines();
  const dir = mkdtempSync(path.join(tmpdir(), 'isochron-scaled-'));
  const database = await createPostgresDatabase(postgresUrl);
  // Migrated once here, so the instances start on a ready schema (they would wait for each other anyway).
  const db = await openDatabase(database.url);
  const redisPrefix = `${uniqueName('isochron-scaled')}:`;
  const proxyPort = await freePort();
  const publicUrl = `http://127.0.0.1:${proxyPort}`;
  const instances = await Promise.all(
    Array.from({ length: count }, () =>
      startService(database.url, dir, {
        REDIS_URL: redisUrl,
        REDIS_KEY_PREFIX: redisPrefix,
        TRUST_PROXY_HOPS: '1',
        PUBLIC_URL: publicUrl,
        USAGE_FLUSH_INTERVAL_MS: '300',
        DEFAULT_RATE_LIMIT_PER_MINUTE: '100000',
        SHUTDOWN_DEADLINE_MS: '3000',
        ...env,
      }),
    ),
  );
  const config = path.join(dir, 'haproxy.cfg');
  writeFileSync(
    config,
    haproxyConfig(
      proxyPort,
      instances.map((i) => i.port),
    ),
  );
  const proxy: ChildProcess = spawn('haproxy', ['-f', config, '-db'], {
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let proxyOutput = '';
  proxy.stderr!.on('data', (chunk) => (proxyOutput += chunk));
  for (let i = 0; !(await answers(proxyPort)); i += 1) {
    if (proxy.exitCode !== null || i > 100) throw new Error(`HAProxy did not start: ${proxyOutput}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }

  let users = 0;
  return {
    proxyPort,
    instances,
    publicUrl,
    databaseUrl: database.url,
    db,
    redisPrefix,
    async addUser(role, email, password) {
      const id = newId('usr');
      const passwordHash = password ? await hashPassword(password) : null;
      users += 1;
      await db.write((transaction) =>
        db.models.User.create(
          { id, email, name: `Rig user ${users}`, role, passwordHash, lastSignInAt: null },
          { transaction },
        ),
      );
      return id;
    },
    async addKey(role, ownerId, rateLimitPerMinute = null) {
      const { secret, prefix, lastFour } = generateKeySecret('test');
      const id = newId('key');
      await db.write((transaction) =>
        db.models.ApiKey.create(
          {
            id,
            name: `Rig ${role} key`,
            role,
            kind: 'test',
            prefix,
            lastFour,
            secretHash: hashKeySecret(secret, PROCESS_KEY_HASH_SECRET),
            ownerId,
            createdById: null,
            rateLimitPerMinute,
            expiresAt: null,
            revokedAt: null,
            lastUsedAt: null,
          },
          { transaction },
        ),
      );
      return { id, secret };
    },
    async close() {
      if (proxy.exitCode === null) proxy.kill('SIGTERM');
      await Promise.all(instances.map((i) => i.stop()));
      await db.close();
      await database.drop();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
