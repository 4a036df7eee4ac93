import type { UsageGrouping, UsageRow } from './usage.model';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

export interface UsageTotals {
  count: number;
  errorCount: number;
  /** Errors divided by calls; NaN when there were no calls. */
  errorRate: number;
}

export interface RouteUsage extends UsageTotals {
  route: string;
}

export interface TimeSeries {
  /** Start of each bucket, epoch milliseconds (UTC-aligned). */
  starts: number[];
  counts: number[];
  errorCounts: number[];
}

export function stepMs(grouping: UsageGrouping): number {
  return grouping === 'hour' ? HOUR_MS : DAY_MS;
}

/** Sums calls and errors over rows. */
export function usageTotals(rows: readonly UsageRow[]): UsageTotals {
  let count = 0;
  let errorCount = 0;
  for (const row of rows) {
    count += row.count;
    errorCount += row.errorCount;
  }
  return { count, errorCount, errorRate: count > 0 ? errorCount / count : Number.NaN };
}

/** Calls per route, busiest first; ties by route name so the order is stable. */
export function usageByRoute(rows: readonly UsageRow[]): RouteUsage[] {
  const routes = new Map<string, UsageRow[]>();
  for (const row of rows) routes.set(row.route, [...(routes.get(row.route) ?? []), row]);
  return [...routes.entries()]
    .map(([route, routeRows]) => ({ route, ...usageTotals(routeRows) }))
    .sort((a, b) => b.count - a.count || a.route.localeCompare(b.route));
}

/**
 * Calls and errors per bucket from `from` (inclusive) to `to` (exclusive), with empty buckets as zero so
 * a quiet hour shows as a dip rather than vanishing from the chart. Buckets are aligned to UTC.
 */
export function usageOverTime(
  rows: readonly UsageRow[],
  from: Date,
  to: Date,
  grouping: UsageGrouping,
): TimeSeries {
  const step = stepMs(grouping);
  const first = Math.floor(from.getTime() / step) * step;
  const end = to.getTime();
  const starts: number[] = [];
  for (let start = first; start < end; start += step) starts.push(start);
  const index = new Map(starts.map((start, i) => [start, i]));
  const counts = starts.map(() => 0);
  const errorCounts = starts.map(() => 0);
  for (const row of rows) {
    const time = new Date(row.bucket).getTime();
    if (Number.isNaN(time)) continue;
    const slot = index.get(Math.floor(time / step) * step);
    if (slot === undefined) continue;
    counts[slot] += row.count;
    errorCounts[slot] += row.errorCount;
  }
  return { starts, counts, errorCounts };
}

/** Rows whose bucket starts at or after `since`. */
export function rowsSince(rows: readonly UsageRow[], since: Date): UsageRow[] {
  const limit = since.getTime();
  return rows.filter((row) => new Date(row.bucket).getTime() >= limit);
}

/** Label for a bucket start on a chart axis: "14 Mar" for days, "14 Mar 09:00" for hours (UTC). */
export function bucketLabel(start: number, grouping: UsageGrouping): string {
  const date = new Date(start);
  const months = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
  const day = `${date.getUTCDate()} ${months[date.getUTCMonth()]}`;
  if (grouping === 'day') return day;
  return `${day} ${String(date.getUTCHours()).padStart(2, '0')}:00`;
}

export type RangePreset = '24h' | '7d' | '30d';

/** A time range ending at the next whole hour after `now`, so the current hour is included. */
export function presetRange(
  preset: RangePreset,
  now: Date,
): { from: Date; to: Date; grouping: UsageGrouping } {
  const to = new Date(Math.ceil((now.getTime() + 1) / HOUR_MS) * HOUR_MS);
  if (preset === '24h') return { from: new Date(to.getTime() - DAY_MS), to, grouping: 'hour' };
  const days = preset === '7d' ? 7 : 30;
  const dayEnd = new Date(Math.ceil(to.getTime() / DAY_MS) * DAY_MS);
  return { from: new Date(dayEnd.getTime() - days * DAY_MS), to: dayEnd, grouping: 'day' };
}
