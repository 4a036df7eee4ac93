import type { UsageRow } from './usage.model';
import {
  bucketLabel,
  presetRange,
  rowsSince,
  usageByRoute,
  usageOverTime,
  usageTotals,
} from './usage-series';

function row(route: string, bucket: string, count: number, errorCount = 0, keyId = 'key_a'): UsageRow {
  return { keyId, keyName: null, route, bucket, count, errorCount, userId: null };
}

const rows: UsageRow[] = [
  row('POST /v1/biquads', '2026-03-14T09:00:00.000Z', 40, 2),
  row('POST /v1/biquads', '2026-03-14T11:00:00.000Z', 10, 0, 'key_b'),
  row('POST /v1/delays', '2026-03-14T09:00:00.000Z', 25, 5),
  row('GET /v1/layouts', '2026-03-13T23:00:00.000Z', 25, 0),
];

describe('usageTotals', () => {
  it('adds calls and errors and divides them', () => {
    expect(usageTotals(rows)).toEqual({ count: 100, errorCount: 7, errorRate: 0.07 });
  });

  it('reports an undefined error rate, not zero, when nothing was called', () => {
    expect(usageTotals([]).errorRate).toBeNaN();
  });
});

describe('usageByRoute', () => {
  it('sums each route and puts the busiest first, ties by name', () => {
    expect(usageByRoute(rows).map((r) => [r.route, r.count, r.errorCount])).toEqual([
      ['POST /v1/biquads', 50, 2],
      ['GET /v1/layouts', 25, 0],
      ['POST /v1/delays', 25, 5],
    ]);
  });
});

describe('usageOverTime', () => {
  it('fills hourly buckets with zeros and sums rows that share a bucket', () => {
    const series = usageOverTime(
      rows,
      new Date('2026-03-14T08:00:00Z'),
      new Date('2026-03-14T12:00:00Z'),
      'hour',
    );
    expect(series.starts.map((s) => new Date(s).toISOString().slice(11, 13))).toEqual([
      '08',
      '09',
      '10',
      '11',
    ]);
    expect(series.counts).toEqual([0, 65, 0, 10]);
    expect(series.errorCounts).toEqual([0, 7, 0, 0]);
  });

  it('groups by UTC day and ignores rows outside the range or with unreadable buckets', () => {
    const series = usageOverTime(
      [...rows, row('POST /v1/plans', 'garbage', 99), row('POST /v1/plans', '2026-03-20T00:00:00Z', 99)],
      new Date('2026-03-13T00:00:00Z'),
      new Date('2026-03-15T00:00:00Z'),
      'day',
    );
    expect(series.counts).toEqual([25, 75]);
  });
});

describe('rowsSince', () => {
  it('keeps buckets starting at or after the instant', () => {
    expect(rowsSince(rows, new Date('2026-03-14T09:00:00Z')).map((r) => r.count)).toEqual([40, 10, 25]);
  });
});

describe('bucketLabel', () => {
  it('labels days and hours in UTC', () => {
    expect(bucketLabel(Date.UTC(2026, 2, 14), 'day')).toBe('14 Mar');
    expect(bucketLabel(Date.UTC(2026, 2, 14, 9), 'hour')).toBe('14 Mar 09:00');
  });
});

describe('presetRange', () => {
  const now = new Date('2026-03-14T09:20:00Z');
  it('covers the last 24 hours by hour, ending after the current hour', () => {
    const range = presetRange('24h', now);
    expect(range.to.toISOString()).toBe('2026-03-14T10:00:00.000Z');
    expect(range.from.toISOString()).toBe('2026-03-13T10:00:00.000Z');
    expect(range.grouping).toBe('hour');
  });

  it('covers whole UTC days for 7 and 30 days, today included', () => {
    expect(presetRange('7d', now)).toEqual({
      from: new Date('2026-03-08T00:00:00Z'),
      to: new Date('2026-03-15T00:00:00Z'),
      grouping: 'day',
    });
    expect(presetRange('30d', now).from.toISOString()).toBe('2026-02-13T00:00:00.000Z');
  });

  it('moves to the next hour when now sits exactly on an hour', () => {
    expect(presetRange('24h', new Date('2026-03-14T09:00:00Z')).to.toISOString()).toBe(
      '2026-03-14T10:00:00.000Z',
    );
  });
});
