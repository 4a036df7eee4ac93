import type { components } from '../../../../shared/contract/api-types';

type Schemas = components['schemas'];

/** What an API key may do (the contract's `KeyRole`). */
export type KeyRole = Schemas['KeyRole'];

/** An API key as `GET /v1/keys` lists it, plus the owner's e-mail the keys page looks up for admins. */
export type ApiKey = Schemas['ApiKey'] & { ownerEmail?: string | null };

/** The answer to `POST /v1/keys`: the only time the clear secret is ever sent. */
export type CreatedKey = Schemas['CreatedApiKey'];

export type NewKeyRequest = Schemas['CreateKeyRequest'];

export type KeyChanges = Schemas['UpdateKeyRequest'];

/** One page of a list, as every list of the API answers it (the contract's `ListMeta` and the page's items). */
export type ListPage<T> = Schemas['ListMeta'] & { data: T[] };
