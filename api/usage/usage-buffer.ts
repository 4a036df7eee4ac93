import type { RedisClient } from '../shared-state/shared-state';
import { hourStart, statusClassOf, UsageCounter, type UsageBatch, type UsageCount } from './usage-counter';

/**
 * Where counted calls wait for the next flush. In this process (`MemoryUsageBuffer`, the embedded
 * default), or in Redis (`RedisUsageBuffer`), where they outlive the instance that counted them and any
 * instance's flush writes everyone's.
 */
export interface UsageBuffer {
  record(keyId: string, userId: string, route: string, status: number, atMs: number): void;
  /** Calls counted and not yet taken, where this process can see them; null when it cannot (Redis). */
  readonly pending: number | null;
  /** Takes everything buffered so far, at once. */
  take(): Promise<UsageBatch>;
  /** Puts back a batch whose write failed. */
  giveBack(batch: UsageBatch): Promise<void>;
}

export class MemoryUsageBuffer implements UsageBuffer {
  constructor(readonly counter: UsageCounter = new UsageCounter()) {}
  record(keyId: string, userId: string, route: string, status: number, atMs: number): void {
    this.counter.record(keyId, userId, route, status, atMs);
  }
  get pending(): number {
    return this.counter.pending;
  }
  async take(): Promise<UsageBatch> {
    return this.counter.take();
  }
  async giveBack(batch: UsageBatch): Promise<void> {
    this.counter.giveBack(batch);
  }
}

const SEPARATOR = '\u0000';
const fieldOf = (c: Omit<UsageCount, 'count'>): string =>
  [c.keyId, c.userId, c.route, c.statusClass, String(c.bucketStart)].join(SEPARATOR);

// Reads the whole hash and removes it in one step, so two instances flushing at once never both take a call.
const TAKE_ALL = `
local cells = redis.call('HGETALL', KEYS[1])
redis.call('DEL', KEYS[1])
return cells
`;

/**
 * Counts in one Redis hash shared by every instance (`HINCRBY` per call; node-redis pipelines the
 * commands of one tick). When Redis refuses a count, it is kept in this process and written with the
 * next flush, so a call is never lost to a Redis hiccup. The time a key was last used stays in this
 * process: it only moves forward, so every instance writing its own is enough.
 */
export class RedisUsageBuffer implements UsageBuffer {
  private readonly local = new UsageCounter();
  private readonly inFlight = new Set<Promise<unknown>>();

  constructor(
    private readonly client: RedisClient,
    private readonly key: string,
  ) {}

  get pending(): null {
    return null;
  }

  record(keyId: string, userId: string, route: string, status: number, atMs: number): void {
    const field = fieldOf({
      keyId,
      userId,
      route,
      statusClass: statusClassOf(status),
      bucketStart: hourStart(atMs),
    });
    // lastUsedAt only: the count itself goes to Redis (or below, into `local`, if Redis refuses it).
    this.local.touch(keyId, atMs);
    const sent: Promise<unknown> = this.client.hIncrBy(this.key, field, 1).catch(() => {
      this.local.record(keyId, userId, route, status, atMs);
    });
    this.inFlight.add(sent);
    void sent.finally(() => this.inFlight.delete(sent));
  }

  async take(): Promise<UsageBatch> {
    // Counts sent but not yet acknowledged belong to this flush.
    await Promise.all([...this.inFlight]);
    const reply = (await this.client.eval(TAKE_ALL, { keys: [this.key] })) as string[];
    const batch = this.local.take();
    const fromRedis = new UsageCounter();
    for (let i = 0; i + 1 < reply.length; i += 2) {
      const [keyId, userId, route, statusClass, bucketStart] = reply[i].split(SEPARATOR);
      fromRedis.add({
        keyId,
        userId,
        route,
        statusClass,
        bucketStart: Number(bucketStart),
        count: Number(reply[i + 1]),
      });
    }
    fromRedis.giveBack(batch);
    return fromRedis.take();
  }

  async giveBack(batch: UsageBatch): Promise<void> {
    // Into this process: the next flush here writes them, whatever happens to Redis meanwhile.
    this.local.giveBack(batch);
  }
}
