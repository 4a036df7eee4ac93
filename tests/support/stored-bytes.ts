import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import type { TestContext } from './test-context';

/**
 * Everything the service has stored for a test context, as bytes to search for secrets that must not
 * be there: on SQLite the database file, its write-ahead log and shared-memory index; on PostgreSQL
 * every row of every table as text; with Redis, every value under the context's prefix (sessions,
 * throttles, rate-limit counts, the usage buffer).
 */
export async function storedBytes(ctx: TestContext): Promise<Buffer> {
  const parts: Buffer[] = [];
  if (ctx.db.dialect === 'sqlite') {
    const file = path.join(ctx.dir, 'test.sqlite');
    for (const f of [file, `${file}-wal`, `${file}-shm`]) if (existsSync(f)) parts.push(readFileSync(f));
  } else {
    const tables = await ctx.db.sequelize.query<{ name: string }>(
      "SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public'",
      { type: QueryTypes.SELECT },
    );
    for (const { name } of tables) {
      const rows = await ctx.db.sequelize.query<{ row: string }>(
        `SELECT row_to_json(t)::text AS row FROM "${name}" t`,
        {
          type: QueryTypes.SELECT,
        },
      );
      for (const { row } of rows) parts.push(Buffer.from(row, 'utf8'));
    }
  }
  const { redis, prefix } = ctx.services.shared;
  if (redis) {
    for await (const keys of redis.scanIterator({ MATCH: `${prefix}*`, COUNT: 500 })) {
      for (const key of keys) {
        parts.push(Buffer.from(key, 'utf8'));
        const type = await redis.type(key);
        if (type === 'string') parts.push(Buffer.from((await redis.get(key)) ?? '', 'utf8'));
        else if (type === 'hash') parts.push(Buffer.from(JSON.stringify(await redis.hGetAll(key)), 'utf8'));
      }
    }
  }
  return Buffer.concat(parts);
}

/** Names of the tables in the test database, on either engine. */
export async function tableNames(ctx: TestContext): Promise<string[]> {
  const sql =
    ctx.db.dialect === 'sqlite'
      ? "SELECT name FROM sqlite_master WHERE type = 'table'"
      : "SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public'";
  const rows = await ctx.db.sequelize.query<{ name: string }>(sql, { type: QueryTypes.SELECT });
  return rows.map((r) => r.name);
}
