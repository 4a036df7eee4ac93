const HOUR_MS = 3_600_000;

/** One counted cell: calls by a key (or a signed-in user) to one route, with one status class, in one hour. */
export interface UsageCount {
  /** '' for calls made with a console session rather than a key. */
  keyId: string;
  userId: string;
  /** Method and route template, e.g. `POST /v1/biquads` or `GET /v1/keys/{keyId}`; never raw ids. */
  route: string;
  /** `2xx`, `4xx`... */
  statusClass: string;
  /** Start of the hour, milliseconds since the epoch (UTC). */
  bucketStart: number;
  count: number;
}

/** What a flush takes away: the counts so far and, per key, the latest time it was used. */
export interface UsageBatch {
  counts: UsageCount[];
  lastUsedAt: Map<string, number>;
}

export const statusClassOf = (status: number): string => `${Math.floor(status / 100)}xx`;

export const hourStart = (timeMs: number): number => Math.floor(timeMs / HOUR_MS) * HOUR_MS;

const cellId = (c: Omit<UsageCount, 'count'>): string =>
  `${c.keyId}\u0000${c.userId}\u0000${c.route}\u0000${c.statusClass}\u0000${c.bucketStart}`;

/**
 * Calls counted in memory, so that a request costs a map update and never a database write. A flush
 * takes the whole batch at once; a flush that fails gives it back so nothing is lost.
 */
export class UsageCounter {
  private counts = new Map<string, UsageCount>();
  private lastUsedAt = new Map<string, number>();

  record(keyId: string, userId: string, route: string, status: number, atMs: number): void {
    const fresh = {
      keyId,
      userId,
      route,
      statusClass: statusClassOf(status),
      bucketStart: hourStart(atMs),
      count: 1,
    };
    const id = cellId(fresh);
    const cell = this.counts.get(id);
    if (cell) cell.count += 1;
    else this.counts.set(id, fresh);
    if (keyId !== '' && (this.lastUsedAt.get(keyId) ?? 0) < atMs) this.lastUsedAt.set(keyId, atMs);
  }

  /** Only moves a key's last-used time forward (the call itself is counted elsewhere). */
  touch(keyId: string, atMs: number): void {
    if (keyId !== '' && (this.lastUsedAt.get(keyId) ?? 0) < atMs) this.lastUsedAt.set(keyId, atMs);
  }

  /** Adds an already counted cell (from a shared buffer). */
  add(cell: UsageCount): void {
    this.giveBack({ counts: [cell], lastUsedAt: new Map() });
  }

  /** Calls recorded and not yet taken. */
  get pending(): number {
    let total = 0;
    for (const cell of this.counts.values()) total += cell.count;
    return total;
  }

  take(): UsageBatch {
    const batch = { counts: [...this.counts.values()], lastUsedAt: this.lastUsedAt };
    this.counts = new Map();
    this.lastUsedAt = new Map();
    return batch;
  }

  /** Puts back a batch whose write failed, merged with whatever was counted meanwhile. */
  giveBack(batch: UsageBatch): void {
    for (const cell of batch.counts) {
      const id = cellId(cell);
      const current = this.counts.get(id);
      if (current) current.count += cell.count;
      else this.counts.set(id, { ...cell });
    }
    for (const [keyId, atMs] of batch.lastUsedAt) {
      if ((this.lastUsedAt.get(keyId) ?? 0) < atMs) this.lastUsedAt.set(keyId, atMs);
    }
  }
}
