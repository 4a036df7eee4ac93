import { QueryTypes } from 'sequelize';
import type { Database, Dialect } from '../db/database';
import { ProblemError } from '../http/problem';

export type UsageGrouping = 'hour' | 'day' | 'route' | 'key';

export interface UsageQuery {
  /** Only this user's usage (a caller with `usage:own`); everyone's when absent. */
  ownerId?: string;
  keyId?: string;
  route?: string;
  /** Buckets whose hour starts at or after `from` and before `to`. */
  from: Date;
  to: Date;
  groupBy: UsageGrouping;
}

/** One row of a usage report; a column the grouping folds away is null. */
export interface UsageRow {
  keyId: string | null;
  keyName: string | null;
  /** The key's owner, or the signed-in user for console calls. */
  userId: string | null;
  route: string | null;
  /** Start of the hour or day (UTC), RFC 3339. */
  bucket: string | null;
  count: number;
  errorCount: number;
}

export const MAX_USAGE_ROWS = 10_000;

interface Grouping {
  select: string;
  groupBy: string;
}

/**
 * The day a bucket falls in, as 'YYYY-MM-DD' (UTC) on both engines. SQLite stores dates as
 * 'YYYY-MM-DD HH:MM:SS.SSS +00:00' text in UTC, so the day is its first 10 characters; PostgreSQL
 * stores `timestamptz`, formatted here in UTC whatever the session's time zone.
 */
const DAY_OF: Record<Dialect, string> = {
  sqlite: 'substr(u."bucketStart", 1, 10)',
  postgres: `to_char(u."bucketStart" AT TIME ZONE 'UTC', 'YYYY-MM-DD')`,
};

/**
 * Text is ordered byte by byte on both engines: SQLite's default collation is binary, PostgreSQL's
 * follows the database's locale unless told `COLLATE "C"`.
 */
const BYTE_ORDER: Record<Dialect, string> = { sqlite: '', postgres: ' COLLATE "C"' };

// Aliases are quoted: PostgreSQL folds unquoted names to lower case. The key's name is an aggregate
// (there is one per key) so that PostgreSQL accepts it beside GROUP BY u."keyId".
function groupings(dialect: Dialect): Record<UsageGrouping, Grouping> {
  const day = DAY_OF[dialect];
  return {
    hour: {
      select:
        'u."keyId" AS "keyId", MAX(k.name) AS "keyName", u."userId" AS "userId", u.route AS route, u."bucketStart" AS bucket',
      groupBy: 'u."keyId", u."userId", u.route, u."bucketStart"',
    },
    day: {
      select: `u."keyId" AS "keyId", MAX(k.name) AS "keyName", u."userId" AS "userId", u.route AS route, ${day} AS bucket`,
      groupBy: `u."keyId", u."userId", u.route, ${day}`,
    },
    route: {
      select: 'NULL AS "keyId", NULL AS "keyName", NULL AS "userId", u.route AS route, NULL AS bucket',
      groupBy: 'u.route',
    },
    key: {
      select:
        'u."keyId" AS "keyId", MAX(k.name) AS "keyName", u."userId" AS "userId", NULL AS route, NULL AS bucket',
      groupBy: 'u."keyId", u."userId"',
    },
  };
}

const GROUPINGS: Record<Dialect, Record<UsageGrouping, Grouping>> = {
  sqlite: groupings('sqlite'),
  postgres: groupings('postgres'),
};

interface RawRow {
  keyId: string | null;
  keyName: string | null;
  userId: string | null;
  route: string | null;
  bucket: string | Date | null;
  count: number | string;
  errorCount: number | string;
}

function bucketIso(raw: string | Date | null): string | null {
  if (raw === null) return null;
  // PostgreSQL answers a timestamptz as a Date.
  if (raw instanceof Date) return raw.toISOString();
  // '2026-03-14' (a day) or '2026-03-14 09:00:00.000 +00:00' (an hour, SQLite).
  return raw.length === 10
    ? `${raw}T00:00:00.000Z`
    : new Date(raw.replace(' ', 'T').replace(' ', '')).toISOString();
}

/** Usage summed from the stored buckets. Every filter value is a bound parameter, never SQL text. */
export async function usageReport(db: Database, query: UsageQuery): Promise<UsageRow[]> {
  const grouping = GROUPINGS[db.dialect][query.groupBy];
  const text = BYTE_ORDER[db.dialect];
  const where = ['u."bucketStart" >= :from', 'u."bucketStart" < :to'];
  const replacements: Record<string, unknown> = { from: query.from, to: query.to, max: MAX_USAGE_ROWS + 1 };
  if (query.ownerId !== undefined) {
    where.push('u."userId" = :ownerId');
    replacements.ownerId = query.ownerId;
  }
  if (query.keyId !== undefined) {
    where.push('u."keyId" = :keyId');
    replacements.keyId = query.keyId;
  }
  if (query.route !== undefined) {
    where.push('u.route = :route');
    replacements.route = query.route;
  }
  // Ordered outside the grouping: PostgreSQL reads `"keyId" COLLATE "C"` in ORDER BY as an input
  // column, not the output one, so the grouped rows are sorted as a derived table.
  const rows = await db.sequelize.query<RawRow>(
    `SELECT r.* FROM (
       SELECT ${grouping.select},
              SUM(u.count) AS count,
              SUM(CASE WHEN u."statusClass" IN ('4xx', '5xx') THEN u.count ELSE 0 END) AS "errorCount"
         FROM usage_buckets u LEFT JOIN api_keys k ON k.id = u."keyId"
        WHERE ${where.join(' AND ')}
        GROUP BY ${grouping.groupBy}
     ) r
     ORDER BY r.bucket, r."keyId"${text}, r."userId"${text}, r.route${text}
     LIMIT :max`,
    { replacements, type: QueryTypes.SELECT },
  );
  if (rows.length > MAX_USAGE_ROWS) {
    throw new ProblemError({
      status: 422,
      title: 'Report too large',
      detail: `More than ${MAX_USAGE_ROWS} rows: narrow from/to, filter by keyId or route, or group by day.`,
      type: 'usage-too-large',
    });
  }
  return rows.map((row) => ({
    keyId: row.keyId === '' ? null : row.keyId,
    keyName: row.keyName ?? null,
    userId: row.userId,
    route: row.route,
    bucket: bucketIso(row.bucket),
    count: Number(row.count),
    errorCount: Number(row.errorCount),
  }));
}
