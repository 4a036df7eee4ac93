import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { SessionData } from 'express-session';
import { openDatabase, type Database } from '../db/database';
import { SqliteSessionStore, storedSessionKey, TOUCH_INTERVAL_MS } from './session-store';

let dir: string;
let db: Database;
let clock: number;
let store: SqliteSessionStore;

beforeEach(async () => {
  dir = mkdtempSync(path.join(tmpdir(), 'isochron-sessions-'));
  db = await openDatabase(`sqlite:${path.join(dir, 'sessions.sqlite')}`);
  clock = Date.parse('2026-03-02T10:00:00Z');
  store = new SqliteSessionStore(db, () => clock);
});

afterEach(async () => {
  store.close();
  await db.close();
  rmSync(dir, { recursive: true, force: true });
});

const sessionUntil = (expiresAtMs: number, extra: object = {}): SessionData =>
  ({
    cookie: { originalMaxAge: 3600_000, expires: new Date(expiresAtMs), httpOnly: true, path: '/' },
    ...extra,
  }) as unknown as SessionData;

const call = <T>(fn: (callback: (err?: unknown, value?: T) => void) => void): Promise<T | undefined> =>
  new Promise((resolve, reject) => fn((err, value) => (err ? reject(err) : resolve(value))));

const get = (sid: string) => call<SessionData | null>((cb) => store.get(sid, cb));
const set = (sid: string, data: SessionData) => call((cb) => store.set(sid, data, cb));

describe('SqliteSessionStore', () => {
  it('stores, reads and destroys a session under the SHA-256 of its id', async () => {
    await set('sid-one', sessionUntil(clock + 3600_000, { passport: { user: { id: 'usr_1' } } }));
    const row = await db.models.Session.findByPk(storedSessionKey('sid-one'));
    expect(row!.sid).toMatch(/^[0-9a-f]{64}$/);
    // FIPS 180-2 appendix B.1: SHA-256("abc").
    expect(storedSessionKey('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(await db.models.Session.findByPk('sid-one')).toBeNull();
    expect(await get('sid-one')).toMatchObject({ passport: { user: { id: 'usr_1' } } });
    await call((cb) => store.destroy('sid-one', cb));
    expect(await get('sid-one')).toBeNull();
  });

  it('answers null for an expired session and sweeps it away', async () => {
    await set('old', sessionUntil(clock + 1000));
    await set('fresh', sessionUntil(clock + 3600_000));
    clock += 2000;
    expect(await get('old')).toBeNull();
    expect(await store.clearExpired()).toBe(1);
    expect(await get('fresh')).not.toBeNull();
  });

  it('overwrites a session saved twice instead of adding a row', async () => {
    await set('same', sessionUntil(clock + 1000, { step: 1 }));
    await set('same', sessionUntil(clock + 2000, { step: 2 }));
    expect(await db.models.Session.count()).toBe(1);
    expect(await get('same')).toMatchObject({ step: 2 });
  });

  it('writes a rolling expiry back only when it has moved by the touch interval', async () => {
    await set('rolling', sessionUntil(clock + 3600_000));
    const stored = async () =>
      (await db.models.Session.findByPk(storedSessionKey('rolling')))!.expires!.getTime();
    const touch = (expiresAt: number) =>
      call((cb) => store.touch('rolling', sessionUntil(expiresAt), cb as () => void));

    await touch(clock + 3600_000 + TOUCH_INTERVAL_MS - 1);
    expect(await stored()).toBe(clock + 3600_000);
    await touch(clock + 3600_000 + TOUCH_INTERVAL_MS);
    expect(await stored()).toBe(clock + 3600_000 + TOUCH_INTERVAL_MS);
  });

  it('treats a damaged row as no session', async () => {
    await db.write((transaction) =>
      db.models.Session.create(
        { sid: storedSessionKey('broken'), expires: new Date(clock + 1000), data: '{not json' },
        { transaction },
      ),
    );
    expect(await get('broken')).toBeNull();
  });
});
