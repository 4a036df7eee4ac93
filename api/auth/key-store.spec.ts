import type { Models } from '../db/models';
import { KeyStore } from './key-store';

const SECRET = 'iso_test_' + 'A'.repeat(43);

function row(overrides: object = {}) {
  return {
    id: 'key_1',
    role: 'calculate',
    ownerId: 'usr_1',
    rateLimitPerMinute: null,
    expiresAt: null,
    ...overrides,
  };
}

/** A database whose answers the test releases one at a time. */
function controlledModels(ownerStatus = 'active') {
  const pending: Array<(value: unknown) => void> = [];
  const findOne = jest.fn(() => new Promise((resolve) => pending.push(resolve)));
  const findByPk = jest.fn(async () => ({ status: ownerStatus, role: 'admin' }));
  return { models: { ApiKey: { findOne }, User: { findByPk } } as unknown as Models, findOne, pending };
}

describe('KeyStore', () => {
  it('answers repeated lookups from its cache within the second', async () => {
    const { models, findOne, pending } = controlledModels();
    let now = 1_000_000;
    const store = new KeyStore(models, 'server-secret', () => now);
    const first = store.findActive(SECRET);
    pending.shift()!(row());
    expect((await first)?.id).toBe('key_1');
    now += 499;
    expect((await store.findActive(SECRET))?.id).toBe('key_1');
    expect(findOne).toHaveBeenCalledTimes(1);
    now += 501;
    const third = store.findActive(SECRET);
    pending.shift()!(row());
    await third;
    expect(findOne).toHaveBeenCalledTimes(2);
  });

  it('reads a key in use again after half a second, still answering from the cache meanwhile', async () => {
    const { models, findOne, pending } = controlledModels();
    let now = 2_000_000;
    const store = new KeyStore(models, 'server-secret', () => now);
    const first = store.findActive(SECRET);
    pending.shift()!(row());
    await first;
    now += 499;
    store.find(SECRET);
    expect(findOne).toHaveBeenCalledTimes(1);
    now += 1;
    // Answered at once from the cache, with one read started behind it, however many calls come.
    expect((store.find(SECRET) as { id: string } | null)?.id).toBe('key_1');
    expect((store.find(SECRET) as { id: string } | null)?.id).toBe('key_1');
    expect(findOne).toHaveBeenCalledTimes(2);
    // The refreshed answer (the key's new limit) is what later calls get, cached from when it was read.
    pending.shift()!(row({ rateLimitPerMinute: 7 }));
    await new Promise((resolve) => setImmediate(resolve));
    now += 400;
    expect((store.find(SECRET) as { rateLimitPerMinute: number } | null)?.rateLimitPerMinute).toBe(7);
    expect(findOne).toHaveBeenCalledTimes(2);
  });

  it('never gives out a cached answer older than a second, refreshing or not', async () => {
    const { models, findOne, pending } = controlledModels();
    let now = 3_000_000;
    const store = new KeyStore(models, 'server-secret', () => now);
    const first = store.findActive(SECRET);
    pending.shift()!(row());
    await first;
    now += 600;
    store.find(SECRET); // starts the background read, which the database does not answer yet
    now += 400;
    const late = store.find(SECRET);
    expect(late).toBeInstanceOf(Promise);
    // It waits for the read already under way rather than starting another.
    expect(findOne).toHaveBeenCalledTimes(2);
    pending.shift()!(null); // revoked meanwhile
    expect(await late).toBeNull();
  });

  it('does not cache an answer read before an invalidation (a revocation racing a lookup)', async () => {
    const { models, findOne, pending } = controlledModels();
    const store = new KeyStore(models, 'server-secret', () => 5_000_000);
    const racing = store.findActive(SECRET);
    // The revocation commits and invalidates while the lookup is still reading the old row.
    store.invalidate();
    pending.shift()!(row());
    expect((await racing)?.id).toBe('key_1');
    const next = store.findActive(SECRET);
    expect(findOne).toHaveBeenCalledTimes(2);
    pending.shift()!(null);
    expect(await next).toBeNull();
  });

  it('reads the database once for many simultaneous misses of one key', async () => {
    const { models, findOne, pending } = controlledModels();
    const store = new KeyStore(models, 'server-secret', () => 7_000_000);
    const lookups = Array.from({ length: 32 }, () => store.findActive(SECRET));
    expect(findOne).toHaveBeenCalledTimes(1);
    pending.shift()!(row());
    expect((await Promise.all(lookups)).every((key) => key?.id === 'key_1')).toBe(true);
  });

  it('does not let a caller arriving after an invalidation share a read that started before it', async () => {
    const { models, findOne, pending } = controlledModels();
    const store = new KeyStore(models, 'server-secret', () => 8_000_000);
    const early = store.findActive(SECRET);
    store.invalidate();
    const late = store.findActive(SECRET);
    expect(findOne).toHaveBeenCalledTimes(2);
    pending.shift()!(row());
    pending.shift()!(null);
    expect((await early)?.id).toBe('key_1');
    expect(await late).toBeNull();
  });

  it('refuses the key of a disabled owner', async () => {
    const { models, pending } = controlledModels('disabled');
    const store = new KeyStore(models, 'server-secret', () => 9_000_000);
    const lookup = store.findActive(SECRET);
    pending.shift()!(row());
    expect(await lookup).toBeNull();
  });

  it('refuses a key past its expiry even from the cache', async () => {
    const { models, pending } = controlledModels();
    let now = 10_000;
    const store = new KeyStore(models, 'server-secret', () => now);
    const first = store.findActive(SECRET);
    pending.shift()!(row({ expiresAt: new Date(10_500) }));
    expect(await first).not.toBeNull();
    now = 10_500;
    expect(await store.findActive(SECRET)).toBeNull();
  });
});
