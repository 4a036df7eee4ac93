import type { components, operations } from '../../../../shared/contract/api-types';

type Schemas = components['schemas'];

export type UserStatus = Schemas['User']['status'];

/** A console user as `GET /v1/users` lists it. */
export type ConsoleUser = Schemas['User'];

export type InviteRequest = operations['inviteUser']['requestBody']['content']['application/json'];

/** The answer to an invitation: the user and the one-time link (also e-mailed when possible). */
export type InvitationResult = Schemas['UserInvitationResult'];

export type UserChanges = operations['updateUser']['requestBody']['content']['application/json'];

/** The answer to `PATCH /v1/users/{userId}`: the user and, after a role change, the keys it moved. */
export type UserUpdateResult = Schemas['UserUpdateResult'];

/** `GET /v1/outbox`. */
export type OutboxList = operations['listOutbox']['responses'][200]['content']['application/json'];

/** One message the development mail server received. */
export type OutboxMessage = Schemas['OutboxMessage'];
