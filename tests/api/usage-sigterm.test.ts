import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import http from 'node:http';
import net from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { generateKeySecret, hashKeySecret } from '../../api/auth/key-secret';
import { projectRoot } from '../../api/config';
import { openDatabase } from '../../api/db/database';
import { newId } from '../../api/db/ids';
import { burst, completedResponses, type BurstRequest } from '../support/http-burst';

const KEY_HASH_SECRET = 'sigterm-test-key-hash-secret-0123456789';

function freePort(): Promise<number> {
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

/** Waits for the service to answer, or for the process to die (which fails the test with its output). */
async function started(child: ChildProcess, port: number, output: () => string): Promise<void> {
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the service exited with ${child.exitCode}: ${output()}`);
    if (await healthy(port)) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

describe('SIGTERM in the middle of a burst', () => {
  it('the real service finishes what it started, writes every count and exits 0', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'isochron-sigterm-'));
    const databaseUrl = `sqlite:${path.join(dir, 'service.sqlite')}`;
    try {
      const secrets: string[] = [];
      const db = await openDatabase(databaseUrl);
      await db.write(async (transaction) => {
        const ownerId = newId('usr');
        await db.models.User.create(
          {
            id: ownerId,
            email: 'rig@test.example',
            name: null,
            role: 'developer',
            passwordHash: null,
            lastSignInAt: null,
          },
          { transaction },
        );
        for (let i = 0; i < 8; i += 1) {
          const { secret, prefix, lastFour } = generateKeySecret('test');
          secrets.push(secret);
          await db.models.ApiKey.create(
            {
              id: newId('key'),
              name: `Rig ${i}`,
              role: 'calculate',
              kind: 'test',
              prefix,
              lastFour,
              secretHash: hashKeySecret(secret, KEY_HASH_SECRET),
              ownerId,
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

      const port = await freePort();
      let output = '';
      const child = spawn(process.execPath, ['--import', 'tsx', 'api/main.ts'], {
        cwd: projectRoot,
        env: {
          ...process.env,
          NODE_ENV: 'test',
          PORT: String(port),
          DATABASE_URL: databaseUrl,
          ISOCHRON_KEY_HASH_SECRET: KEY_HASH_SECRET,
          ISOCHRON_SESSION_SECRET: 'sigterm-test-session-secret-0123456789',
          SEED_DEMO_DATA: 'false',
          CONSOLE_DIR: path.join(dir, 'no-console'),
          // Long enough that only the shutdown flush can have written the counts.
          USAGE_FLUSH_INTERVAL_MS: '3600000',
          // Eight keys of one user: the per-user ceiling is not what this test is about.
          USER_RATE_LIMIT_PER_MINUTE: '1000000',
          LOG_LEVEL: 'warn',
        },
        stdio: ['ignore', 'pipe', 'pipe'],
      });
      child.stdout!.on('data', (chunk) => (output += chunk));
      child.stderr!.on('data', (chunk) => (output += chunk));
      const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
      await started(child, port, () => output);

      const requests: BurstRequest[] = Array.from({ length: 1200 }, (_, i) => ({
        method: 'POST',
        path: '/v1/biquads',
        headers: { Authorization: `Bearer ${secrets[i % secrets.length]}` },
        body: { sampleRateHz: 48000, filters: [{ type: 'peaking', frequencyHz: 1000, gainDb: -3, q: 1.41 }] },
      }));
      let signalled = false;
      const outcomes = await burst(port, requests, {
        onResponse: (completed) => {
          if (completed === 300 && !signalled) {
            signalled = true;
            child.kill('SIGTERM');
          }
        },
      });
      expect(await exited).toBe(0);

      const completed = completedResponses(outcomes);
      expect(outcomes.filter((o) => 'status' in o && o.status !== 200)).toEqual([]);
      expect(completed).toBeGreaterThanOrEqual(300);
      // The stop really came mid-burst: some calls found the service gone.
      expect(completed).toBeLessThan(requests.length);
      const reopened = await openDatabase(databaseUrl);
      try {
        expect(await reopened.models.UsageBucket.sum('count')).toBe(completed);
      } finally {
        await reopened.close();
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
