import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { Client } from 'pg';

/**
 * The engines a test runs on. By default SQLite in a temporary folder and everything shared in memory;
 * with `ISOCHRON_TEST_POSTGRES_URL` (a PostgreSQL server where the user may create databases) each
 * test context gets a fresh database of its own, and with `ISOCHRON_TEST_REDIS_URL` a Redis key prefix
 * of its own. `.ci/run` runs the whole suite a second time that way.
 */
export const testPostgresUrl = process.env.ISOCHRON_TEST_POSTGRES_URL || null;
export const testRedisUrl = process.env.ISOCHRON_TEST_REDIS_URL || null;

/** A name that no other test context (or jest worker) uses at the same time. */
export const uniqueName = (base: string): string =>
  `${base}_${process.pid}_${Date.now().toString(36)}_${randomBytes(3).toString('hex')}`;

/** The admin URL with another database name. */
function withDatabase(url: string, database: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${database}`;
  return parsed.toString();
}

/** A fresh, empty PostgreSQL database; `drop()` removes it (closing any connection left open). */
export async function createPostgresDatabase(
  adminUrl: string,
): Promise<{ url: string; drop(): Promise<void> }> {
  const name = uniqueName('isochron_test');
  const admin = new Client({ connectionString: adminUrl });
  await admin.connect();
  try {
    await admin.query(`CREATE DATABASE "${name}"`);
  } finally {
    await admin.end();
  }
  return {
    url: withDatabase(adminUrl, name),
    async drop() {
      const client = new Client({ connectionString: adminUrl });
      await client.connect();
      try {
        await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      } finally {
        await client.end();
      }
    },
  };
}

/**
 * The environment for a test service: DATABASE_URL (a SQLite file in `dir`, or a fresh PostgreSQL
 * database) and, with Redis, REDIS_URL and a key prefix of its own. `cleanUp` removes the database.
 */
export async function testEngineEnv(
  dir: string,
  only?: 'sqlite',
): Promise<{ env: Record<string, string>; cleanUp(): Promise<void> }> {
  const env: Record<string, string> = {};
  let cleanUp: () => Promise<void> = async () => undefined;
  if (testPostgresUrl && only !== 'sqlite') {
    const database = await createPostgresDatabase(testPostgresUrl);
    env.DATABASE_URL = database.url;
    cleanUp = async () => database.drop();
  } else {
    env.DATABASE_URL = `sqlite:${path.join(dir, 'test.sqlite')}`;
  }
  if (testRedisUrl && only !== 'sqlite') {
    env.REDIS_URL = testRedisUrl;
    env.REDIS_KEY_PREFIX = `${uniqueName('isochron-test')}:`;
  }
  return { env, cleanUp };
}
