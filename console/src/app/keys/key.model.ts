/** What an API key may do (PRODUCT.md §5). */
export type KeyRole = 'calculate' | 'tuning' | 'admin';

/** An API key as `GET /v1/keys` lists it: never the secret, only its prefix and last four. */
export interface ApiKey {
  id: string;
  name: string;
  role: KeyRole;
  prefix: string;
  lastFour: string;
  createdAt: string;
  lastUsedAt: string | null;
  expiresAt: string | null;
  /** Null means the server's default limit applies. */
  rateLimitPerMinute: number | null;
  revokedAt: string | null;
  ownerId: string | null;
  ownerEmail?: string | null;
  kind?: 'live' | 'test';
  status?: 'active' | 'expired' | 'revoked';
  updatedAt?: string;
}

/** The answer to `POST /v1/keys`: the only time the clear secret is ever sent. */
export interface CreatedKey extends ApiKey {
  secret: string;
}

export interface NewKeyRequest {
  name: string;
  role: KeyRole;
  expiresAt?: string;
  rateLimitPerMinute?: number;
}

export interface KeyChanges {
  name?: string;
  rateLimitPerMinute?: number | null;
  expiresAt?: string | null;
}

export interface ListPage<T> {
  data: T[];
  hasMore: boolean;
}
