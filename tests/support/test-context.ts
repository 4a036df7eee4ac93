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
}

/** A real app on a fresh SQLite file in a temporary folder, with users and keys of every role. */
export async function createTestContext(options: TestContextOptions = {}): Promise<TestContext> {
  const dir = mkdtempSync(path.join(tmpdir(), 'isochron-test-'));
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: `sqlite:${path.join(dir, 'test.sqlite')}`,
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
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
