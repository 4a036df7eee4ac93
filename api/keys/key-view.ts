import type { ApiKey, KeyRole } from '../db/models/api-key';

export type KeyStatus = 'active' | 'expired' | 'revoked';

/** What callers see of a key: never the hash, and the clear secret only in the answer to its creation. */
export interface KeyView {
  id: string;
  name: string;
  role: KeyRole;
  kind: 'live' | 'test';
  prefix: string;
  lastFour: string;
  ownerId: string;
  createdById: string | null;
  rateLimitPerMinute: number | null;
  status: KeyStatus;
  expiresAt: string | null;
  revokedAt: string | null;
  lastUsedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface CreatedKeyView extends KeyView {
  /** The clear key. It is not stored anywhere and cannot be shown again. */
  secret: string;
}

const iso = (date: Date | null | undefined): string | null => (date ? date.toISOString() : null);

export function keyStatus(key: Pick<ApiKey, 'revokedAt' | 'expiresAt'>, now: Date): KeyStatus {
  if (key.revokedAt) return 'revoked';
  if (key.expiresAt && key.expiresAt.getTime() <= now.getTime()) return 'expired';
  return 'active';
}

export function toKeyView(key: ApiKey, now: Date = new Date()): KeyView {
  return {
    id: key.id,
    name: key.name,
    role: key.role,
    kind: key.kind,
    prefix: key.prefix,
    lastFour: key.lastFour,
    ownerId: key.ownerId,
    createdById: key.createdById,
    rateLimitPerMinute: key.rateLimitPerMinute,
    status: keyStatus(key, now),
    expiresAt: iso(key.expiresAt),
    revokedAt: iso(key.revokedAt),
    lastUsedAt: iso(key.lastUsedAt),
    createdAt: key.createdAt.toISOString(),
    updatedAt: key.updatedAt.toISOString(),
  };
}
