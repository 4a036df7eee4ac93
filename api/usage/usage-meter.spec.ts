import { EventEmitter } from 'node:events';
import type { Request, Response } from 'express';
import pino from 'pino';
import type { UsageBatch } from './usage-counter';
import { routeTemplate, UsageMeter } from './usage-meter';
import type { UsageSink } from './usage-sink';

const silent = pino({ level: 'silent' });

class MemorySink implements UsageSink {
  readonly written: UsageBatch[] = [];
  failuresLeft = 0;
  async write(batch: UsageBatch): Promise<void> {
    if (this.failuresLeft > 0) {
      this.failuresLeft -= 1;
      throw new Error('SQLITE_BUSY: database is locked');
    }
    this.written.push(batch);
  }
  get total(): number {
    return this.written.flatMap((b) => b.counts).reduce((sum, c) => sum + c.count, 0);
  }
}

function fakeCall(path: string | undefined, status: number) {
  const req = {
    method: 'POST',
    baseUrl: '/v1',
    route: path === undefined ? undefined : { path },
    principal: { kind: 'key', role: 'calculate', userId: 'usr_1', keyId: 'key_1' },
  } as unknown as Request;
  const res = Object.assign(new EventEmitter(), { statusCode: status }) as unknown as Response;
  return { req, res };
}

describe('routeTemplate', () => {
  it('spells the matched route as the OpenAPI template, never with raw ids', () => {
    const req = { method: 'GET', route: { path: '/rooms/:roomId/tunings/:tuningId' } } as unknown as Request;
    expect(routeTemplate(req, '/v1')).toBe('GET /v1/rooms/{roomId}/tunings/{tuningId}');
  });

  it('names a call no route matched without its path', () => {
    const req = { method: 'GET', url: '/secret-ish/key_123' } as unknown as Request;
    expect(routeTemplate(req, '/v1')).toBe('GET /v1 (no route)');
  });
});

describe('UsageMeter', () => {
  it('counts a call when its response finishes, not before', async () => {
    const sink = new MemorySink();
    const meter = new UsageMeter({ sink, flushIntervalMs: 3_600_000, logger: silent });
    const { req, res } = fakeCall('/biquads', 200);
    meter.middleware(req, res, () => undefined);
    expect(meter.counter.pending).toBe(0);
    res.emit('finish');
    expect(meter.counter.pending).toBe(1);
    await meter.close();
    expect(sink.written[0].counts[0]).toMatchObject({
      route: 'POST /v1/biquads',
      statusClass: '2xx',
      count: 1,
    });
  });

  it('keeps the counts of a failed flush and writes them with the next one', async () => {
    const sink = new MemorySink();
    const meter = new UsageMeter({ sink, flushIntervalMs: 3_600_000, logger: silent });
    for (let i = 0; i < 5; i += 1) {
      const { req, res } = fakeCall('/biquads', 200);
      meter.middleware(req, res, () => undefined);
      res.emit('finish');
    }
    sink.failuresLeft = 1;
    await expect(meter.flush()).rejects.toThrow('SQLITE_BUSY');
    expect(sink.total).toBe(0);
    const { req, res } = fakeCall('/biquads', 500);
    meter.middleware(req, res, () => undefined);
    res.emit('finish');
    await meter.close();
    expect(sink.total).toBe(6);
  });

  it('runs flushes one after another and writes each call once', async () => {
    const sink = new MemorySink();
    const meter = new UsageMeter({ sink, flushIntervalMs: 3_600_000, logger: silent });
    const flushes = [];
    for (let i = 0; i < 50; i += 1) {
      const { req, res } = fakeCall(i % 2 ? '/delays' : undefined, 200 + (i % 3) * 100);
      meter.middleware(req, res, () => undefined);
      res.emit('finish');
      flushes.push(meter.flush());
    }
    await Promise.all(flushes);
    await meter.close();
    expect(sink.total).toBe(50);
  });

  it('does not count calls with no principal (refused before authentication)', async () => {
    const sink = new MemorySink();
    const meter = new UsageMeter({ sink, flushIntervalMs: 3_600_000, logger: silent });
    const { req, res } = fakeCall('/biquads', 401);
    delete (req as { principal?: unknown }).principal;
    meter.middleware(req, res, () => undefined);
    res.emit('finish');
    await meter.close();
    expect(sink.total).toBe(0);
  });
});
