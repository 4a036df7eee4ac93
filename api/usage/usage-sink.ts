import { QueryTypes, type Transaction } from 'sequelize';
import type { Database } from '../db/database';
import type { UsageBatch, UsageCount } from './usage-counter';

/** Where flushed usage goes: the database (SQLite or PostgreSQL, the same statement on both). */
export interface UsageSink {
  write(batch: UsageBatch): Promise<void>;
}

// 8 bound values per row; 100 rows stay far below SQLite's and PostgreSQL's limits on bound variables.
const ROWS_PER_STATEMENT = 100;

const cellKey = (c: UsageCount): string =>
  [c.keyId, c.userId, c.route, c.statusClass, String(c.bucketStart).padStart(16, '0')].join('\u0000');

function compareCells(a: UsageCount, b: UsageCount): number {
  const x = cellKey(a);
  const y = cellKey(b);
  return x < y ? -1 : x > y ? 1 : 0;
}

/**
 * Adds a batch to `usage_buckets` and moves `api_keys.lastUsedAt` forward, all in one transaction
 * through the write queue. Counts are added to the stored ones (`count = count + excluded.count`), so
 * flushes from any number of processes or restarts sum up instead of overwriting each other.
 */
export class DatabaseUsageSink implements UsageSink {
  constructor(private readonly db: Database) {}

  write(batch: UsageBatch): Promise<void> {
    if (batch.counts.length === 0 && batch.lastUsedAt.size === 0) return Promise.resolve();
    // The same order in every instance's flush: two flushes that touch the same rows lock them in one
    // order on PostgreSQL and so never deadlock.
    const counts = [...batch.counts].sort((a, b) => compareCells(a, b));
    const lastUsedAt = [...batch.lastUsedAt].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return this.db.write(async (transaction) => {
      const now = new Date();
      for (let i = 0; i < counts.length; i += ROWS_PER_STATEMENT) {
        await this.upsert(counts.slice(i, i + ROWS_PER_STATEMENT), now, transaction);
      }
      for (const [keyId, atMs] of lastUsedAt) {
        const at = new Date(atMs);
        await this.db.sequelize.query(
          'UPDATE api_keys SET "lastUsedAt" = ? WHERE id = ? AND ("lastUsedAt" IS NULL OR "lastUsedAt" < ?)',
          { replacements: [at, keyId, at], type: QueryTypes.UPDATE, transaction },
        );
      }
    });
  }

  private async upsert(rows: UsageCount[], now: Date, transaction: Transaction): Promise<void> {
    const values: unknown[] = [];
    for (const row of rows) {
      values.push(
        row.keyId,
        row.userId,
        row.route,
        row.statusClass,
        new Date(row.bucketStart),
        row.count,
        now,
        now,
      );
    }
    await this.db.sequelize.query(
      `INSERT INTO usage_buckets ("keyId", "userId", route, "statusClass", "bucketStart", count, "createdAt", "updatedAt")
       VALUES ${rows.map(() => '(?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}
       ON CONFLICT ("keyId", "userId", route, "statusClass", "bucketStart")
       DO UPDATE SET count = usage_buckets.count + excluded.count, "updatedAt" = excluded."updatedAt"`,
      { replacements: values, type: QueryTypes.INSERT, transaction },
    );
  }
}
