/** One metered bucket from `GET /v1/usage`: calls of one key on one route in one time bucket. */
export interface UsageRow {
  /** Null for console (session) calls. */
  keyId: string | null;
  keyName?: string | null;
  route: string;
  bucket: string;
  count: number;
  errorCount: number;
  userId?: string | null;
}

/** The limits in force, as `GET /v1/usage` reports them with every answer. */
export interface UsageLimits {
  /** Requests per minute for a key without a limit of its own. */
  keyRateLimitPerMinute: number;
  /** Requests per minute for all keys and the console session of one user together. */
  userRateLimitPerMinute: number;
  maxActiveKeysPerUser: number;
  /** Active keys of the one user the report covers; null when it covers everyone. */
  activeKeys: number | null;
}

export interface UsageResponse {
  from?: string;
  to?: string;
  groupBy?: string;
  limits?: UsageLimits;
  data: UsageRow[];
}

export type UsageGrouping = 'hour' | 'day';

export interface UsageQuery {
  keyId?: string;
  route?: string;
  from: string;
  to: string;
  groupBy: UsageGrouping;
}
