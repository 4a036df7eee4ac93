import type { User, UserRole, UserStatus } from '../db/models/user';

/** A user as `/v1/users` shows it: never the password hash. */
export interface UserView {
  id: string;
  email: string;
  name: string | null;
  role: UserRole;
  status: UserStatus;
  lastSignInAt: string | null;
  createdAt: string;
  updatedAt: string;
}

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
