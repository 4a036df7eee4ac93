import type { Models } from '../db/models';
import type { ApiKey } from '../db/models/api-key';
import { hashKeySecret } from './key-secret';

export interface ActiveKey {
  id: string;
  role: ApiKey['role'];
  ownerId: string;
  rateLimitPerMinute: number | null;
  expiresAt: Date | null;
}

const CACHE_TTL_MS = 1000;

/**
 * Finds the key behind a bearer token. Lookups are cached for a second so that a burst of calls does
 * not hit SQLite once per request; changes made in this process (revoke, edit) invalidate the cache
 * at once, and changes made by another process (the operator command line) are seen within a second.
 */
export class KeyStore {
  private readonly cache = new Map<string, { key: ActiveKey | null; at: number }>();
  /** Bumped by `invalidate()`: a lookup that started before a change must not cache what it read. */
  private generation = 0;

  constructor(
    private readonly models: Models,
    private readonly serverSecret: string,
    private readonly now: () => number = Date.now,
  ) {}

  async findActive(secret: string): Promise<ActiveKey | null> {
    const hash = hashKeySecret(secret, this.serverSecret);
    const cached = this.cache.get(hash);
    const now = this.now();
    let key: ActiveKey | null;
    if (cached && now - cached.at < CACHE_TTL_MS) {
      key = cached.key;
    } else {
      const generation = this.generation;
      const row = await this.models.ApiKey.findOne({ where: { secretHash: hash, revokedAt: null } });
      key = row && {
        id: row.id,
        role: row.role,
        ownerId: row.ownerId,
        rateLimitPerMinute: row.rateLimitPerMinute,
        expiresAt: row.expiresAt,
      };
      if (this.cache.size > 10_000) this.cache.clear();
      if (generation === this.generation) this.cache.set(hash, { key, at: now });
    }
    if (key?.expiresAt && key.expiresAt.getTime() <= now) return null;
    return key;
  }

  /** Call after revoking or editing a key so the next request sees the change. */
  invalidate(): void {
    this.generation += 1;
    this.cache.clear();
  }
}
