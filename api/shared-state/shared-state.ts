import type session from 'express-session';
import { MemoryStore, type Store } from 'express-rate-limit';
import type { RedisStore as ConnectRedisStore } from 'connect-redis';
import type { Logger } from '../logger';
import { storedSessionKey } from '../session/session-store';
import { GrowingDelayThrottle, type GrowingDelay } from '../session/sign-in-throttle';
import { RedisThrottleCounter, type ThrottleCounter } from './throttle-counter';

/**
 * What several instances of the service must share to behave as one: rate-limit counts, sign-in
 * throttles, console sessions, key-cache invalidation and the usage buffer. Without `REDIS_URL` each of
 * them lives in this process (the embedded default); with it, in Redis. Every consumer asks this one
 * object for its store, so the choice is made in one place.
 */
export interface SharedState {
  readonly kind: 'memory' | 'redis';
  /** A store for one express-rate-limit limiter; `name` keeps limiters' counts apart. */
  rateLimitStore(name: string): Store;
  /** A growing-delay throttle counter; `name` keeps throttles apart. */
  throttleCounter(name: string, limits: GrowingDelay, now: () => number): ThrottleCounter;
  /** The console session store, or null for the database's own table. */
  sessionStore(): session.Store | null;
  /** Tells every instance (this one included) to drop its key cache; resolves once the message is sent. */
  publishKeyChange(): Promise<void>;
  /** Called whenever any instance published a key change. */
  onKeyChange(listener: () => void): void;
  /** The Redis client for the usage buffer, or null in memory. */
  readonly redis: RedisClient | null;
  /** Prefix of every Redis key this service writes. */
  readonly prefix: string;
  /** Readiness: resolves when the shared store answers, throws otherwise. Nothing to check in memory. */
  ping(): Promise<void>;
  close(): Promise<void>;
}

export type RedisClient = ReturnType<typeof newRedisClient>;

export interface SharedStateOptions {
  redisUrl: string | null;
  /** Prefix of every key in Redis, so several deployments (or test files) can share one server. */
  prefix: string;
  logger: Logger;
}

/** In this process only: what one instance needs and all it can promise. */
export function memorySharedState(): SharedState {
  const listeners: Array<() => void> = [];
  return {
    kind: 'memory',
    redis: null,
    prefix: '',
    rateLimitStore: () => new MemoryStore(),
    throttleCounter: (_name, limits, now) => new GrowingDelayThrottle(limits, now),
    sessionStore: () => null,
    publishKeyChange: async () => {
      for (const listener of listeners) listener();
    },
    onKeyChange: (listener) => listeners.push(listener),
    ping: async () => undefined,
    close: async () => undefined,
  };
}

/** How long a command may wait for a Redis that does not answer before the request gets a 503. */
const REDIS_TIMEOUT_MS = 2000;

// The Redis packages are loaded only when REDIS_URL is set: the embedded default never pays for them.
function newRedisClient(redis: typeof import('redis'), url: string) {
  // No offline queue: while Redis is away, commands fail at once (503) instead of piling up.
  return redis.createClient({
    url,
    disableOfflineQueue: true,
    socket: {
      connectTimeout: REDIS_TIMEOUT_MS,
      reconnectStrategy: (retries) => Math.min(100 * 2 ** retries, 2000),
    },
  });
}

export async function redisSharedState(url: string, prefix: string, logger: Logger): Promise<SharedState> {
  const [redis, { RedisStore: RedisSessionStore }, { RedisStore: RedisRateLimitStore }] = await Promise.all([
    import('redis'),
    import('connect-redis'),
    import('rate-limit-redis'),
  ]);
  /**
   * connect-redis keyed by the SHA-256 of the session id (as the database store is), so a copy of Redis
   * cannot be replayed as cookies.
   */
  class HashedRedisSessionStore extends RedisSessionStore {
    override get(sid: string, cb: Parameters<ConnectRedisStore['get']>[1]) {
      return super.get(storedSessionKey(sid), cb);
    }
    override set(sid: string, sess: session.SessionData, cb?: Parameters<ConnectRedisStore['set']>[2]) {
      return super.set(storedSessionKey(sid), sess, cb);
    }
    override touch(sid: string, sess: session.SessionData, cb?: Parameters<ConnectRedisStore['touch']>[2]) {
      return super.touch(storedSessionKey(sid), sess, cb);
    }
    override destroy(sid: string, cb?: Parameters<ConnectRedisStore['destroy']>[1]) {
      return super.destroy(storedSessionKey(sid), cb);
    }
  }
  const client = newRedisClient(redis, url);
  let lastError = '';
  client.on('error', (err: Error) => {
    // One log line per distinct failure, not one per reconnect attempt.
    if (err.message !== lastError) logger.error({ err: err.message }, 'redis error');
    lastError = err.message;
  });
  client.on('ready', () => {
    if (lastError) logger.info('redis connected again');
    lastError = '';
  });
  await client.connect();
  const subscriber = client.duplicate();
  subscriber.on('error', () => undefined);
  await subscriber.connect();
  const channel = `${prefix}keys:changed`;
  const listeners: Array<() => void> = [];
  await subscriber.subscribe(channel, () => {
    for (const listener of listeners) listener();
  });
  return {
    kind: 'redis',
    redis: client,
    prefix,
    rateLimitStore: (name) =>
      new RedisRateLimitStore({
        prefix: `${prefix}rl:${name}:`,
        sendCommand: (...args: string[]) => client.sendCommand(args),
      }),
    throttleCounter: (name, limits, now) =>
      new RedisThrottleCounter(client, `${prefix}throttle:${name}:`, limits, now),
    sessionStore: () => {
      return new HashedRedisSessionStore({ client, prefix: `${prefix}sess:` });
    },
    publishKeyChange: async () => {
      // This instance drops its own cache at once too (the message also comes back to it).
      for (const listener of listeners) listener();
      await client.publish(channel, String(Date.now()));
    },
    onKeyChange: (listener) => listeners.push(listener),
    ping: async () => {
      await withTimeout(client.ping(), REDIS_TIMEOUT_MS);
    },
    close: async () => {
      await subscriber.close().catch(() => undefined);
      await client.close().catch(() => undefined);
    },
  };
}

function withTimeout<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_resolve, reject) => {
    timer = setTimeout(() => reject(new Error(`Redis did not answer within ${ms} ms`)), ms);
  });
  return Promise.race([work, timeout]).finally(() => clearTimeout(timer));
}

export async function createSharedState(options: SharedStateOptions): Promise<SharedState> {
  if (!options.redisUrl) return memorySharedState();
  return redisSharedState(options.redisUrl, options.prefix, options.logger);
}

/** Errors of the Redis client: the shared store is away, which is the server's state (503), not the request's. */
export function isRedisFailure(err: unknown): boolean {
  for (
    let e = err as { name?: unknown; message?: unknown; cause?: unknown } | null, depth = 0;
    e && depth < 4;
    depth += 1
  ) {
    const name = typeof e.name === 'string' ? e.name : '';
    if (
      /^(ClientClosedError|ClientOfflineError|ConnectionTimeoutError|SocketClosedUnexpectedlyError|ReconnectStrategyError|SocketTimeoutError)$/.test(
        name,
      )
    ) {
      return true;
    }
    if (typeof e.message === 'string' && /^Redis did not answer/.test(e.message)) return true;
    e = (e.cause ?? null) as typeof e;
  }
  return false;
}
