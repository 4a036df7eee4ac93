import { usageRouteChart, usageTimeChart } from './usage-charts';

describe('usageTimeChart', () => {
  it('stacks succeeded and failed calls so each bar totals the calls of its bucket', () => {
    const spec = usageTimeChart(
      { starts: [Date.UTC(2026, 2, 13), Date.UTC(2026, 2, 14)], counts: [10, 4], errorCounts: [1, 4] },
      'day',
    );
    expect(spec.labels).toEqual(['13 Mar', '14 Mar']);
    expect(spec.series[0].values).toEqual([9, 0]);
    expect(spec.series[1].values).toEqual([1, 4]);
    expect(spec.summary).toBe('Bar chart of calls per day over 2 days: 14 calls, 5 failed.');
  });
});

describe('usageRouteChart', () => {
  const route = (name: string, count: number, errorCount = 0) => ({
    route: name,
    count,
    errorCount,
    errorRate: 0,
  });

  it('keeps the busiest routes and folds the rest into one bar', () => {
    const spec = usageRouteChart([route('a', 9, 1), route('b', 5), route('c', 2, 2), route('d', 1)], 2);
    expect(spec.labels).toEqual(['a', 'b', '2 other routes']);
    expect(spec.series[0].values).toEqual([8, 5, 1]);
    expect(spec.series[1].values).toEqual([1, 0, 2]);
    expect(spec.horizontal).toBe(true);
  });

  it('says so when there is nothing to draw', () => {
    expect(usageRouteChart([]).summary).toBe('No calls in this range.');
  });
});
