import { createHash } from 'node:crypto';
import session, { type SessionData } from 'express-session';
import { Op } from 'sequelize';
import type { Database } from '../db/database';

/** Rolling expiry moves on every request; writing it back more often than this would add a write per call. */
export const TOUCH_INTERVAL_MS = 60_000;
const SWEEP_INTERVAL_MS = 15 * 60_000;
const KNOWN_EXPIRY_LIMIT = 10_000;

type Callback<T = void> = (err?: unknown, value?: T) => void;

/**
 * Rows are keyed by the SHA-256 of the session id, so a copy of the database cannot be replayed as
 * cookies. Every write goes through the database's write queue.
 */
export const storedSessionKey = (sid: string): string => createHash('sha256').update(sid).digest('hex');

function expiryOf(data: SessionData, now: number): Date {
  const expires = data.cookie?.expires;
  if (expires) return new Date(expires);
  return new Date(now + (data.cookie?.originalMaxAge ?? 0));
}

function settle<T>(promise: Promise<T>, callback?: Callback<T>): void {
  promise.then(
    (value) => callback?.(null, value),
    (err) => callback?.(err),
  );
}

/** express-session store on the `sessions` table. */
export class SqliteSessionStore extends session.Store {
  /** Last expiry written per stored key, so a touch inside TOUCH_INTERVAL_MS costs nothing. */
  private readonly knownExpiry = new Map<string, number>();
  private readonly sweeper: NodeJS.Timeout;

  constructor(
    private readonly db: Database,
    private readonly now: () => number = Date.now,
  ) {
    super();
    this.sweeper = setInterval(() => void this.clearExpired().catch(() => undefined), SWEEP_INTERVAL_MS);
    this.sweeper.unref();
  }

  override get(sid: string, callback: (err: unknown, session?: SessionData | null) => void): void {
    settle(this.read(sid), callback as Callback<SessionData | null>);
  }

  override set(sid: string, data: SessionData, callback?: (err?: unknown) => void): void {
    const key = storedSessionKey(sid);
    const expires = expiryOf(data, this.now());
    const write = this.db.write((transaction) =>
      this.db.models.Session.upsert({ sid: key, expires, data: JSON.stringify(data) }, { transaction }),
    );
    settle(
      write.then(() => this.remember(key, expires)),
      callback,
    );
  }

  override touch(sid: string, data: SessionData, callback?: () => void): void {
    const key = storedSessionKey(sid);
    const expires = expiryOf(data, this.now());
    const known = this.knownExpiry.get(key);
    if (known !== undefined && expires.getTime() - known < TOUCH_INTERVAL_MS) {
      callback?.();
      return;
    }
    const write = this.db.write((transaction) =>
      this.db.models.Session.update({ expires }, { where: { sid: key }, transaction }),
    );
    settle(
      write.then(() => this.remember(key, expires)),
      callback as Callback,
    );
  }

  override destroy(sid: string, callback?: (err?: unknown) => void): void {
    const key = storedSessionKey(sid);
    this.knownExpiry.delete(key);
    settle(
      this.db
        .write((transaction) => this.db.models.Session.destroy({ where: { sid: key }, transaction }))
        .then(() => undefined),
      callback,
    );
  }

  /** Deletes expired rows; returns how many. */
  clearExpired(): Promise<number> {
    return this.db.write((transaction) =>
      this.db.models.Session.destroy({ where: { expires: { [Op.lte]: new Date(this.now()) } }, transaction }),
    );
  }

  close(): void {
    clearInterval(this.sweeper);
  }

  private async read(sid: string): Promise<SessionData | null> {
    const key = storedSessionKey(sid);
    const row = await this.db.models.Session.findByPk(key);
    if (!row?.data || (row.expires && row.expires.getTime() <= this.now())) return null;
    try {
      const data = JSON.parse(row.data) as SessionData;
      if (row.expires) this.remember(key, row.expires);
      return data;
    } catch {
      return null;
    }
  }

  private remember(key: string, expires: Date): void {
    if (this.knownExpiry.size >= KNOWN_EXPIRY_LIMIT) this.knownExpiry.clear();
    this.knownExpiry.set(key, expires.getTime());
  }
}
