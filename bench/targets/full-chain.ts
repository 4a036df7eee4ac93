import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createApp } from '../../api/app';
import { createServer, listen } from '../../api/http/server';
import { generateKeySecret, hashKeySecret } from '../../api/auth/key-secret';
import { loadConfig } from '../../api/config';
import { openDatabase } from '../../api/db/database';
import { newId } from '../../api/db/ids';
import { closeServices, createServices } from '../../api/services';
import { serveUntilStopped } from './protocol';

/**
 * (C) The whole service as deployed (production settings) on a fresh SQLite file: helmet, request ids,
 * bearer-key authentication, the per-key rate limit (set high enough never to refuse), usage metering
 * and OpenAPI validation in front of POST /v1/biquads.
 */
async function main(): Promise<void> {
  const dir = mkdtempSync(path.join(tmpdir(), 'isochron-bench-'));
  const config = loadConfig({
    NODE_ENV: 'production',
    PORT: '0',
    DATABASE_URL: `sqlite:${path.join(dir, 'bench.sqlite')}`,
    ISOCHRON_KEY_HASH_SECRET: 'bench-key-hash-secret-0123456789abcdef',
    ISOCHRON_SESSION_SECRET: 'bench-session-secret-0123456789abcdef',
    CONSOLE_DIR: path.join(dir, 'no-console'),
    LOG_LEVEL: 'warn',
    // The per-user ceiling, like the key's own limit, set high enough never to refuse.
    USER_RATE_LIMIT_PER_MINUTE: '10000000',
    // The heavy-work settings as the caller's environment gives them (else the service's defaults).
    ...Object.fromEntries(
      ['HEAVY_WORK_THREADS', 'HEAVY_WORK_QUEUE_LIMIT', 'HEAVY_WORK_NICE'].flatMap((name) =>
        process.env[name] === undefined ? [] : [[name, process.env[name] as string]],
      ),
    ),
  });
  const services = await createServices(config);
  const { secret, prefix, lastFour } = generateKeySecret('test');
  await services.db.write(async (transaction) => {
    const ownerId = newId('usr');
    await services.db.models.User.create(
      {
        id: ownerId,
        email: 'bench@bench.example',
        name: null,
        role: 'developer',
        passwordHash: null,
        lastSignInAt: null,
      },
      { transaction },
    );
    await services.db.models.ApiKey.create(
      {
        id: newId('key'),
        name: 'Benchmark',
        role: 'calculate',
        kind: 'test',
        prefix,
        lastFour,
        secretHash: hashKeySecret(secret, config.keyHashSecret),
        ownerId,
        createdById: null,
        rateLimitPerMinute: 10_000_000,
        expiresAt: null,
        revokedAt: null,
        lastUsedAt: null,
      },
      { transaction },
    );
  });
  // The server as `npm start` serves it (api/main.ts).
  const server = listen(createServer(createApp(services)), 0, '127.0.0.1', (error) => {
    if (error) throw error;
    serveUntilStopped(
      (server.address() as AddressInfo).port,
      { Authorization: `Bearer ${secret}` },
      async () => {
        await new Promise((resolve) => server.close(resolve));
        await closeServices(services);
        const db = await openDatabase(config.databaseUrl);
        const meteredCalls = (await db.models.UsageBucket.sum('count')) ?? 0;
        await db.close();
        rmSync(dir, { recursive: true, force: true });
        return { meteredCalls };
      },
    );
  });
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
