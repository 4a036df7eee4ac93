import type { components } from '../../shared/contract/api-types';
import type { ApiKey } from '../db/models/api-key';

type Schemas = components['schemas'];

export type KeyStatus = Schemas['ApiKey']['status'];

/**
 * What callers see of a key (the contract's `ApiKey`): never the hash, and the clear secret only in the
 * answer to its creation (`CreatedApiKey`, whose `secret` is stored nowhere and cannot be shown again).
 */
export type KeyView = Schemas['ApiKey'];

export type CreatedKeyView = Schemas['CreatedApiKey'];

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
