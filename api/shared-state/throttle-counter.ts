import type { RedisClient } from './shared-state';
import type { GrowingDelay, ThrottleCounting } from '../session/sign-in-throttle';

/**
 * Failures per key with a growing wait after the free ones, in Redis and so shared by every instance;
 * in one process `GrowingDelayThrottle` does the same. Same rules either way (see `GrowingDelay`).
 */
export type ThrottleCounter = ThrottleCounting;

// One hash per key: f = failures, l = last failure (ms), b = blocked until (ms). The rules are
// GrowingDelayThrottle's, run inside Redis so that two instances counting at once never lose a failure.
// ATTEMPT: while the key must wait, answer the wait and count nothing; otherwise count and answer 0.
const ATTEMPT = `
local f = tonumber(redis.call('HGET', KEYS[1], 'f') or '0')
local l = tonumber(redis.call('HGET', KEYS[1], 'l') or '0')
local b = tonumber(redis.call('HGET', KEYS[1], 'b') or '0')
local now, free, first, max, forget = tonumber(ARGV[1]), tonumber(ARGV[2]), tonumber(ARGV[3]), tonumber(ARGV[4]), tonumber(ARGV[5])
if f > 0 and now >= b and now - l > forget then f = 0; b = 0 end
if b > now then return b - now end
f = f + 1
local beyond = f - free
if beyond > 0 then b = now + math.min(max, first * 2 ^ math.min(beyond - 1, 30)) end
redis.call('HSET', KEYS[1], 'f', f, 'l', now, 'b', b)
redis.call('PEXPIRE', KEYS[1], math.max(b - now, 0) + forget + 1000)
return 0
`;

const FORGIVE = `
local f = tonumber(redis.call('HGET', KEYS[1], 'f') or '0')
if f == 0 then return 0 end
f = f - 1
if f <= 0 then redis.call('DEL', KEYS[1]) return 0 end
redis.call('HSET', KEYS[1], 'f', f)
if f <= tonumber(ARGV[1]) then redis.call('HSET', KEYS[1], 'b', 0) end
return f
`;

export class RedisThrottleCounter implements ThrottleCounter {
  constructor(
    private readonly client: RedisClient,
    private readonly prefix: string,
    private readonly limits: GrowingDelay,
    private readonly now: () => number = Date.now,
  ) {}

  async attempt(key: string): Promise<number> {
    const { freeFailures, firstDelayMs, maxDelayMs, forgetAfterMs } = this.limits;
    const wait = await this.client.eval(ATTEMPT, {
      keys: [this.prefix + key],
      arguments: [this.now(), freeFailures, firstDelayMs, maxDelayMs, forgetAfterMs].map(String),
    });
    return Number(wait);
  }

  async succeed(key: string): Promise<void> {
    await this.client.del(this.prefix + key);
  }

  async forgive(key: string): Promise<void> {
    await this.client.eval(FORGIVE, {
      keys: [this.prefix + key],
      arguments: [String(this.limits.freeFailures)],
    });
  }
}
