import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { createApp } from '../../api/app';
import { generateKeySecret, hashKeySecret } from '../../api/auth/key-secret';
import { loadConfig } from '../../api/config';
import type { Database } from '../../api/db/database';
import { newId } from '../../api/db/ids';
import type { KeyRole } from '../../api/db/models/api-key';
import type { UserRole } from '../../api/db/models/user';
import { closeServices, createServices, type Services } from '../../api/services';
import { testEngineEnv } from './engines';

export interface TestContext {
  app: Express;
  services: Services;
  db: Database;
  /** Clear keys by role. `calculate` and `tuning` belong to the developer, `admin` to the admin. */
  keys: { calculate: string; tuning: string; admin: string; otherTuning: string };
  users: { admin: string; developer: string; viewer: string; other: string };
  dir: string;
  /** Adds a key for a user and returns the clear secret. */
  addKey(role: KeyRole, ownerId: string, name?: string): Promise<string>;
  close(): Promise<void>;
}

export interface TestContextOptions {
  env?: Record<string, string>;
  /**
   * `sqlite` keeps a test on the embedded engine in every run, for tests whose subject is the SQLite
   * file itself (its permissions, its page limit). Default: the run's engines.
   */
  engine?: 'sqlite';
}

/**
 * A real app on a fresh database with users and keys of every role: a SQLite file in a temporary
 * folder, or a fresh PostgreSQL database (and a Redis prefix of its own) when the suite runs on the
 * scaled engines (`tests/support/engines.ts`).
 */
export async function createTestContext(options: TestContextOptions = {}): Promise<TestContext> {
  const dir = mkdtempSync(path.join(tmpdir(), 'isochron-test-'));
  const engines = await testEngineEnv(dir, options.engine);
  const config = loadConfig({
    NODE_ENV: 'test',
    ...engines.env,
    ISOCHRON_KEY_HASH_SECRET: 'test-key-hash-secret-0123456789abcdef',
    ISOCHRON_SESSION_SECRET: 'test-session-secret-0123456789abcdef',
    SEED_DEMO_DATA: 'false',
    CONSOLE_DIR: path.join(dir, 'no-console'),
    ...options.env,
  });
  const services = await createServices(config);
  const { User, ApiKey } = services.db.models;

  const addUser = async (role: UserRole, email: string): Promise<string> => {
    const id = newId('usr');
    await services.db.write((transaction) =>
      User.create({ id, email, name: null, role, passwordHash: null, lastSignInAt: null }, { transaction }),
    );
    return id;
  };
  const addKey = async (role: KeyRole, ownerId: string, name = `${role} test key`): Promise<string> => {
    const { secret, prefix, lastFour } = generateKeySecret('test');
    await services.db.write((transaction) =>
      ApiKey.create(
        {
          id: newId('key'),
          name,
          role,
          kind: 'test',
          prefix,
          lastFour,
          secretHash: hashKeySecret(secret, config.keyHashSecret),
          ownerId,
          createdById: null,
          rateLimitPerMinute: null,
          expiresAt: null,
          revokedAt: null,
          lastUsedAt: null,
        },
        { transaction },
      ),
    );
    return secret;
  };

  const users = {
    admin: await addUser('admin', 'admin@test.example'),
    developer: await addUser('developer', 'dev@test.example'),
    viewer: await addUser('viewer', 'viewer@test.example'),
    other: await addUser('developer', 'other@test.example'),
  };
  const keys = {
    calculate: await addKey('calculate', users.developer),
    tuning: await addKey('tuning', users.developer),
    admin: await addKey('admin', users.admin),
    otherTuning: await addKey('tuning', users.other),
  };
  const app = createApp(services);
  return {
    app,
    services,
    db: services.db,
    keys,
    users,
    dir,
    addKey,
    close: async () => {
      await closeServices(services);
      await engines.cleanUp();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
