import type { components, operations } from '../../../../shared/contract/api-types';

type Schemas = components['schemas'];
type UsageParameters = NonNullable<operations['getUsage']['parameters']['query']>;

/** The groupings the usage page asks for: one row per key, route and hour or day. */
export type UsageGrouping = Extract<Schemas['UsageReport']['groupBy'], 'hour' | 'day'>;

/**
 * One metered bucket from `GET /v1/usage` grouped by hour or day: calls of one key on one route in one
 * time bucket. The contract's row, where `bucket` and `route` are null only for the groupings by route
 * or key, which the page does not ask for.
 */
export type UsageRow = Omit<Schemas['UsageRow'], 'bucket' | 'route'> & {
  bucket: NonNullable<Schemas['UsageRow']['bucket']>;
  route: NonNullable<Schemas['UsageRow']['route']>;
};

/** The limits in force, as `GET /v1/usage` reports them with every answer. */
export type UsageLimits = Schemas['UsageLimits'];

/** `GET /v1/usage` grouped by hour or day. */
export type UsageResponse = Omit<Schemas['UsageReport'], 'data' | 'groupBy'> & {
  groupBy: UsageGrouping;
  data: UsageRow[];
};

/** The page's query: the contract's parameters, with the range and an hour or day grouping always given. */
export type UsageQuery = Pick<UsageParameters, 'keyId' | 'route'> &
  Required<Pick<UsageParameters, 'from' | 'to'>> & { groupBy: UsageGrouping };
