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

export interface UsageResponse {
  from?: string;
  to?: string;
  groupBy?: string;
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
