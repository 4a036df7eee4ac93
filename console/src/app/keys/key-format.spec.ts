import type { ApiKey } from './key.model';
import {
  endOfLocalDay,
  keyMatchesFilter,
  keySortValue,
  keyStatus,
  maskedKey,
  rateLimitLabel,
} from './key-format';

const now = new Date('2026-03-14T12:00:00Z');

function key(overrides: Partial<ApiKey> = {}): ApiKey {
  return {
    id: 'key_1',
    name: 'Sweep rig — Stage 3',
    role: 'tuning',
    prefix: 'iso_live_7Hq',
    lastFour: 'x9Zk',
    createdAt: '2026-03-01T08:00:00Z',
    lastUsedAt: null,
    expiresAt: null,
    rateLimitPerMinute: 120,
    revokedAt: null,
    ownerId: 'usr_1',
    createdById: null,
    kind: 'live',
    status: 'active',
    updatedAt: '2026-03-01T08:00:00Z',
    ...overrides,
  };
}

describe('keyStatus', () => {
  it('is active without revocation or expiry, expired once the expiry passes, revoked above all', () => {
    expect(keyStatus(key(), now)).toBe('active');
    expect(keyStatus(key({ expiresAt: '2026-03-15T00:00:00Z' }), now)).toBe('active');
    expect(keyStatus(key({ expiresAt: '2026-03-14T12:00:00Z' }), now)).toBe('expired');
    expect(
      keyStatus(key({ expiresAt: '2026-03-01T00:00:00Z', revokedAt: '2026-03-02T00:00:00Z' }), now),
    ).toBe('revoked');
  });
});

describe('maskedKey', () => {
  it('joins prefix and last four with an ellipsis', () => {
    expect(maskedKey(key())).toBe('iso_live_7Hq…x9Zk');
  });
});

describe('rateLimitLabel', () => {
  it('names the per-minute limit or says the default applies', () => {
    expect(rateLimitLabel(key())).toBe('120 / min');
    expect(rateLimitLabel(key({ rateLimitPerMinute: null }))).toBe('default');
  });
});

describe('keyMatchesFilter', () => {
  it('matches every word against name, role, masked key, status and owner', () => {
    const sweep = key({ ownerEmail: 'dev@kestrel.example' });
    expect(keyMatchesFilter(sweep, '', now)).toBe(true);
    expect(keyMatchesFilter(sweep, 'stage TUNING', now)).toBe(true);
    expect(keyMatchesFilter(sweep, 'x9zk', now)).toBe(true);
    expect(keyMatchesFilter(sweep, 'dev@kestrel', now)).toBe(true);
    expect(keyMatchesFilter(sweep, 'stage revoked', now)).toBe(false);
    expect(keyMatchesFilter(key({ revokedAt: '2026-03-02T00:00:00Z' }), 'revoked', now)).toBe(true);
  });
});

describe('keySortValue', () => {
  it('sorts dates by time and puts keys never used after used ones', () => {
    const used = key({ lastUsedAt: '2026-03-10T00:00:00Z' });
    const unused = key();
    expect(keySortValue(used, 'lastUsed', now)).toBeLessThan(keySortValue(unused, 'lastUsed', now) as number);
    expect(keySortValue(key({ name: 'Render Farm' }), 'name', now)).toBe('render farm');
    expect(keySortValue(key(), 'rateLimit', now)).toBe(120);
    expect(keySortValue(key({ rateLimitPerMinute: null }), 'rateLimit', now)).toBe(0);
    expect(keySortValue(key(), 'unknown', now)).toBe('');
  });
});

describe('endOfLocalDay', () => {
  it('moves a picked date to the last millisecond of that local day', () => {
    const end = new Date(endOfLocalDay(new Date(2026, 2, 14, 9, 15)));
    expect([end.getFullYear(), end.getMonth(), end.getDate()]).toEqual([2026, 2, 14]);
    expect([end.getHours(), end.getMinutes(), end.getSeconds(), end.getMilliseconds()]).toEqual([
      23, 59, 59, 999,
    ]);
  });
});
