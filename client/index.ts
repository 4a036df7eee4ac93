import createClient, { type Client, type ClientOptions } from 'openapi-fetch';
import type { components, operations, paths } from '../shared/contract/api-types';

export type { components, operations, paths };

/** A typed client of the Isochron API: every path, parameter, body and answer comes from the contract. */
export type IsochronClient = Client<paths>;

export interface IsochronClientOptions extends Omit<ClientOptions, 'baseUrl'> {
  /** Where the service runs, e.g. `http://localhost:8080`. */
  baseUrl: string;
  /** An API key (`iso_live_…`), sent as `Authorization: Bearer <key>` and nowhere else. */
  apiKey: string;
}

/**
 * A client built with openapi-fetch over the types generated from the OpenAPI contract
 * (`shared/contract/api-types.ts`), so a call that does not match the contract does not compile.
 */
export function createIsochronClient({ baseUrl, apiKey, ...options }: IsochronClientOptions): IsochronClient {
  const client = createClient<paths>({ baseUrl, ...options });
  client.use({
    onRequest({ request }) {
      request.headers.set('Authorization', `Bearer ${apiKey}`);
      return request;
    },
  });
  return client;
}
