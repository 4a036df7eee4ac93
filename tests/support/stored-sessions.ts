import { storedSessionKey } from '../../api/session/session-store';
import type { TestContext } from './test-context';

/**
 * A console session as the server keeps it, read and changed behind the service's back, in whichever
 * store the run uses: the database's `sessions` table, or Redis (connect-redis) on the scaled engines.
 * Either way it is found under the SHA-256 of the session id, never the id itself.
 */
export interface StoredSession {
  /** The serialised session, or null when nothing is stored under that id. */
  data(): Promise<string | null>;
  /** Replaces the serialised session, keeping its expiry. */
  setData(data: string): Promise<void>;
  /** Makes the stored session expire now, as if it had been idle too long. */
  expire(): Promise<void>;
}

/**
 * The stored session under a raw session id (hashed here, as the stores do); `{ unhashed: true }`
 * looks under the clear id itself, where nothing may ever be stored.
 */
export function storedSession(
  ctx: TestContext,
  sid: string,
  options: { unhashed?: boolean } = {},
): StoredSession {
  const key = options.unhashed ? sid : storedSessionKey(sid);
  const { shared, db } = ctx.services;
  const redis = shared.redis;
  if (redis) {
    const redisKey = `${shared.prefix}sess:${key}`;
    return {
      data: async () => redis.get(redisKey),
      setData: async (data) => {
        await redis.set(redisKey, data, { KEEPTTL: true });
      },
      expire: async () => {
        await redis.pExpire(redisKey, 1);
        await new Promise((resolve) => setTimeout(resolve, 20));
      },
    };
  }
  const row = () => db.models.Session.findByPk(key);
  return {
    data: async () => (await row())?.data ?? null,
    setData: async (data) => {
      await db.write((t) => db.models.Session.update({ data }, { where: { sid: key }, transaction: t }));
    },
    expire: async () => {
      await db.write((t) =>
        db.models.Session.update(
          { expires: new Date(Date.now() - 1000) },
          { where: { sid: key }, transaction: t },
        ),
      );
    },
  };
}
