import type { ApiKey } from './key.model';

export type KeyStatus = 'active' | 'expired' | 'revoked';

/** Revocation wins over expiry: a revoked key is revoked whatever its expiry says. */
export function keyStatus(key: Pick<ApiKey, 'revokedAt' | 'expiresAt'>, now: Date): KeyStatus {
  if (key.revokedAt) return 'revoked';
  if (key.expiresAt && new Date(key.expiresAt).getTime() <= now.getTime()) return 'expired';
  return 'active';
}

/** "120 / min", or "default" when the key follows the server-wide limit. */
export function rateLimitLabel(key: Pick<ApiKey, 'rateLimitPerMinute'>): string {
  return key.rateLimitPerMinute === null ? 'default' : `${key.rateLimitPerMinute} / min`;
}

/** How a key is recognised in lists: its visible prefix, an ellipsis, and its last four characters. */
export function maskedKey(key: Pick<ApiKey, 'prefix' | 'lastFour'>): string {
  return `${key.prefix}…${key.lastFour}`;
}

/** Case-insensitive match of the table filter against the columns a person can see. */
export function keyMatchesFilter(key: ApiKey, filter: string, now: Date): boolean {
  const needle = filter.trim().toLowerCase();
  if (!needle) return true;
  const haystack = [key.name, key.role, maskedKey(key), keyStatus(key, now), key.ownerEmail ?? '']
    .join(' ')
    .toLowerCase();
  return needle.split(/\s+/).every((word) => haystack.includes(word));
}

/** Sort values for the keys table: dates as epoch milliseconds, absent dates last in ascending order. */
export function keySortValue(key: ApiKey, column: string, now: Date): string | number {
  const time = (value: string | null) => (value ? new Date(value).getTime() : Number.MAX_SAFE_INTEGER);
  switch (column) {
    case 'name':
      return key.name.toLowerCase();
    case 'role':
      return key.role;
    case 'key':
      return maskedKey(key).toLowerCase();
    case 'created':
      return time(key.createdAt);
    case 'lastUsed':
      return time(key.lastUsedAt);
    case 'expires':
      return time(key.expiresAt);
    case 'rateLimit':
      return key.rateLimitPerMinute ?? 0;
    case 'status':
      return keyStatus(key, now);
    default:
      return '';
  }
}

/** Ensures an expiry chosen in a date picker means "the end of that day" in the person's time zone. */
export function endOfLocalDay(date: Date): string {
  const end = new Date(date.getFullYear(), date.getMonth(), date.getDate(), 23, 59, 59, 999);
  return end.toISOString();
}
