import { hourStart, statusClassOf, UsageCounter } from './usage-counter';

const T = Date.UTC(2026, 2, 12, 9, 59, 59, 999);

describe('UsageCounter', () => {
  it('adds calls of the same key, route, status class and hour into one cell', () => {
    const counter = new UsageCounter();
    counter.record('key_a', 'usr_1', 'POST /v1/biquads', 200, T);
    counter.record('key_a', 'usr_1', 'POST /v1/biquads', 201, T - 1000);
    counter.record('key_a', 'usr_1', 'POST /v1/biquads', 422, T);
    counter.record('key_b', 'usr_1', 'POST /v1/biquads', 200, T);
    counter.record('key_a', 'usr_1', 'POST /v1/biquads', 200, T + 1); // the next hour
    const { counts } = counter.take();
    const cells = counts.map((c) => [c.keyId, c.statusClass, new Date(c.bucketStart).toISOString(), c.count]);
    expect(cells).toEqual(
      expect.arrayContaining([
        ['key_a', '2xx', '2026-03-12T09:00:00.000Z', 2],
        ['key_a', '4xx', '2026-03-12T09:00:00.000Z', 1],
        ['key_b', '2xx', '2026-03-12T09:00:00.000Z', 1],
        ['key_a', '2xx', '2026-03-12T10:00:00.000Z', 1],
      ]),
    );
    expect(counts).toHaveLength(4);
  });

  it('keeps each key’s latest use, and none for console calls', () => {
    const counter = new UsageCounter();
    counter.record('key_a', 'usr_1', 'GET /v1/layouts', 200, T);
    counter.record('key_a', 'usr_1', 'GET /v1/layouts', 200, T - 5000);
    counter.record('', 'usr_2', 'GET /v1/layouts', 200, T + 5000);
    const { lastUsedAt } = counter.take();
    expect([...lastUsedAt]).toEqual([['key_a', T]]);
  });

  it('take empties it; giveBack merges a failed batch with what came meanwhile', () => {
    const counter = new UsageCounter();
    counter.record('key_a', 'usr_1', 'GET /v1/layouts', 200, T);
    counter.record('key_a', 'usr_1', 'GET /v1/layouts', 200, T);
    const batch = counter.take();
    expect(counter.pending).toBe(0);
    counter.record('key_a', 'usr_1', 'GET /v1/layouts', 200, T - 10);
    counter.giveBack(batch);
    expect(counter.pending).toBe(3);
    const again = counter.take();
    expect(again.counts).toHaveLength(1);
    expect(again.counts[0].count).toBe(3);
    expect(again.lastUsedAt.get('key_a')).toBe(T);
  });
});

describe('buckets and classes', () => {
  it('start hours on the UTC hour', () => {
    expect(new Date(hourStart(T)).toISOString()).toBe('2026-03-12T09:00:00.000Z');
    expect(hourStart(Date.UTC(2026, 2, 12, 10))).toBe(Date.UTC(2026, 2, 12, 10));
  });

  it('class statuses by their first digit (RFC 9110 §15)', () => {
    expect([100, 204, 304, 429, 503].map(statusClassOf)).toEqual(['1xx', '2xx', '3xx', '4xx', '5xx']);
  });
});
