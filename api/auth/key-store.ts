import { hash } from 'node:crypto';
import type { Models } from '../db/models';
import type { ApiKey } from '../db/models/api-key';
import type { UserRole } from '../db/models/user';
import { effectiveKeyRole } from './key-roles';
import { hashKeySecret } from './key-secret';

export interface ActiveKey {
  id: string;
  /** What the key may do now: its own role capped by its owner's current role; null when the owner may hold no key. */
  role: ApiKey['role'] | null;
  /** The role the key was created with. */
  grantedRole: ApiKey['role'];
  ownerRole: UserRole;
  ownerId: string;
  rateLimitPerMinute: number | null;
  expiresAt: Date | null;
}

const CACHE_TTL_MS = 1000;
/**
 * A cached answer older than this is read again in the background while it is still given out, so a key
 * in steady use is refreshed before it expires. Without it every request in flight when the answer
 * expired waited for the same database read, once a second: under load, the slowest of the requests.
 */
const REFRESH_AFTER_MS = CACHE_TTL_MS / 2;

/**
 * Finds the key behind a bearer token; a disabled user's keys are refused like revoked ones. Lookups
 * are cached for a second (read again in the background after half of it) so that a burst of calls does not hit the database once per request; changes
 * made in this process (revoke, edit, a user's role or status) invalidate the cache at once. With Redis
 * the change is published and every instance drops its cache when it hears it; without, another
 * process sees it within the second.
 */
export class KeyStore {
  /** By the token's SHA-256 (never the clear token): what its lookup found, and when. */
  private readonly cache = new Map<string, { key: ActiveKey | null; at: number }>();
  /** Bumped by `invalidate()`: a lookup that started before a change must not cache what it read. */
  private generation = 0;
  private readonly inFlight = new Map<string, Promise<ActiveKey | null>>();

  constructor(
    private readonly models: Models,
    private readonly serverSecret: string,
    private readonly now: () => number = Date.now,
  ) {}

  async findActive(secret: string): Promise<ActiveKey | null> {
    return this.find(secret);
  }

  /**
   * The same answer as `findActive`, synchronously when the cache holds it: the usual case under load,
   * where it spares every request a round of promise callbacks.
   */
  find(secret: string): ActiveKey | null | Promise<ActiveKey | null> {
    // The cache is keyed by a plain SHA-256 of the token, a fifth of the keyed hash's cost: a token of
    // 256 random bits cannot be found from it, and the keyed hash (with the server secret) is worked
    // out only for the database read, on a miss.
    const digest = hash('sha256', secret, 'base64');
    const cached = this.cache.get(digest);
    const now = this.now();
    if (cached && now - cached.at < CACHE_TTL_MS) {
      // Never older than CACHE_TTL_MS when given out: the refresh only starts the next read early.
      if (now - cached.at >= REFRESH_AFTER_MS && !this.inFlight.has(digest)) {
        this.lookUp(digest, secret, now).catch(() => undefined);
      }
      return this.unexpired(cached.key, now);
    }
    return this.lookUp(digest, secret, now).then((key) => this.unexpired(key, now));
  }

  private unexpired(key: ActiveKey | null, now: number): ActiveKey | null {
    return key?.expiresAt && key.expiresAt.getTime() <= now ? null : key;
  }

  /**
   * One database read per key however many requests miss the cache at once (they all expire together
   * under load). A read that started before `invalidate()` is neither cached nor shared with later callers.
   */
  private lookUp(digest: string, secret: string, now: number): Promise<ActiveKey | null> {
    const running = this.inFlight.get(digest);
    if (running) return running;
    const generation = this.generation;
    const read = this.read(hashKeySecret(secret, this.serverSecret)).then((key) => {
      if (generation === this.generation) {
        if (this.cache.size > 10_000) this.cache.clear();
        this.cache.set(digest, { key, at: now });
      }
      return key;
    });
    this.inFlight.set(digest, read);
    const forget = () => {
      if (this.inFlight.get(digest) === read) this.inFlight.delete(digest);
    };
    read.then(forget, forget);
    return read;
  }

  /**
   * The key behind a hash, if it is not revoked and its owner is not disabled, with the role its owner's
   * current role leaves it (read with the key, so the cache never holds a role older than the key row).
   */
  private async read(secretHash: string): Promise<ActiveKey | null> {
    const row = await this.models.ApiKey.findOne({ where: { secretHash, revokedAt: null } });
    if (!row) return null;
    const owner = await this.models.User.findByPk(row.ownerId, { attributes: ['status', 'role'] });
    if (!owner || owner.status === 'disabled') return null;
    return {
      id: row.id,
      role: effectiveKeyRole(row.role, owner.role),
      grantedRole: row.role,
      ownerRole: owner.role,
      ownerId: row.ownerId,
      rateLimitPerMinute: row.rateLimitPerMinute,
      expiresAt: row.expiresAt,
    };
  }

  /** Tells every instance to drop its cache (set by the services: in memory or through Redis). */
  broadcast: (() => Promise<void>) | null = null;

  /**
   * Call after revoking or editing a key, or changing its owner, so the next request sees the change
   * here and, once the promise resolves, in every other instance too.
   */
  async invalidate(): Promise<void> {
    this.dropCache();
    // The change is committed already; if it cannot be announced, the others still see it within the
    // cache's second, so the caller's answer stands.
    if (this.broadcast) await this.broadcast().catch(() => undefined);
  }

  /** Empties this instance's cache (a change announced by any instance). */
  dropCache(): void {
    this.generation += 1;
    this.cache.clear();
    this.inFlight.clear();
  }
}
