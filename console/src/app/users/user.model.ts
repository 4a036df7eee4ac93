import type { UserRole } from '../auth/roles';

export type UserStatus = 'active' | 'invited' | 'disabled';

/** A console user as `GET /v1/users` lists it. */
export interface ConsoleUser {
  id: string;
  email: string;
  name: string | null;
  role: UserRole;
  status: UserStatus;
  lastSignInAt?: string | null;
  createdAt?: string;
}

export interface InviteRequest {
  email: string;
  role: UserRole;
  name?: string;
}

/** The answer to an invitation: the user and the one-time link (also e-mailed when possible). */
export interface InvitationResult {
  user: ConsoleUser;
  invitation: { url: string; expiresAt: string; emailSent: boolean };
}

export interface UserChanges {
  role?: UserRole;
  status?: 'active' | 'disabled';
}

/** One message the development mail server received. */
export interface OutboxMessage {
  id: string;
  to: string | string[];
  from?: string;
  subject: string;
  text?: string;
  html?: string;
  sentAt?: string;
  date?: string;
}
