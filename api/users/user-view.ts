import type { components } from '../../shared/contract/api-types';
import type { User } from '../db/models/user';

/** A user as `/v1/users` shows it (the contract's `User`): never the password hash. */
export type UserView = components['schemas']['User'];

export function toUserView(user: User): UserView {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    status: user.status,
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null,
    createdAt: user.createdAt.toISOString(),
    updatedAt: user.updatedAt.toISOString(),
  };
}
