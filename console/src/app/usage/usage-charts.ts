import type { ChartSpec } from '../ui/chart/chart-spec';
import type { UsageGrouping } from './usage.model';
import { type RouteUsage, type TimeSeries, bucketLabel } from './usage-series';

/** Calls per bucket as stacked bars: answered calls and failed calls (4xx/5xx). */
export function usageTimeChart(series: TimeSeries, grouping: UsageGrouping): ChartSpec {
  const total = series.counts.reduce((sum, value) => sum + value, 0);
  const errors = series.errorCounts.reduce((sum, value) => sum + value, 0);
  const unit = grouping === 'hour' ? 'hour' : 'day';
  return {
    kind: 'bar',
    xScale: 'category',
    stacked: true,
    labels: series.starts.map((start) => bucketLabel(start, grouping)),
    yTitle: `Calls per ${unit}`,
    xTitle: grouping === 'hour' ? 'Hour (UTC)' : 'Day (UTC)',
    series: [
      {
        label: 'Succeeded',
        values: series.counts.map((count, i) => count - series.errorCounts[i]),
        colour: 1,
      },
      { label: 'Failed', values: [...series.errorCounts], colour: 5 },
    ],
    summary: `Bar chart of calls per ${unit} over ${series.starts.length} ${unit}s: ${total} calls, ${errors} failed.`,
  };
}

/** The busiest routes as horizontal bars; the rest are folded into "other routes". */
export function usageRouteChart(routes: readonly RouteUsage[], limit = 8): ChartSpec {
  const top = routes.slice(0, limit);
  const rest = routes.slice(limit);
  const rows = rest.length
    ? [
        ...top,
        {
          route: `${rest.length} other routes`,
          count: rest.reduce((sum, route) => sum + route.count, 0),
          errorCount: rest.reduce((sum, route) => sum + route.errorCount, 0),
          errorRate: Number.NaN,
        },
      ]
    : top;
  return {
    kind: 'bar',
    xScale: 'category',
    horizontal: true,
    stacked: true,
    labels: rows.map((row) => row.route),
    xTitle: 'Calls',
    series: [
      { label: 'Succeeded', values: rows.map((row) => row.count - row.errorCount), colour: 1 },
      { label: 'Failed', values: rows.map((row) => row.errorCount), colour: 5 },
    ],
    summary: rows.length
      ? `Calls by route, busiest first: ${rows.map((row) => `${row.route} ${row.count}`).join(', ')}.`
      : 'No calls in this range.',
  };
}
