import type { Request, RequestHandler } from 'express';
import type { KeyRole } from '../db/models/api-key';
import type { UserRole } from '../db/models/user';
import { forbidden } from '../http/problem';

export type Permission =
  'calculate' | 'tuning' | 'keys:own' | 'keys:all' | 'usage:own' | 'usage:all' | 'users';

/** Who is calling: an API key, or a user signed in to the console. */
export interface Principal {
  kind: 'key' | 'user';
  role: KeyRole | UserRole;
  /** The user who owns the key, or the signed-in user. Stored resources belong to this user. */
  userId: string;
  keyId?: string;
  /** The key's own per-minute limit, when it has one. */
  rateLimitPerMinute?: number | null;
}

declare module 'express-serve-static-core' {
  interface Request {
    principal?: Principal;
  }
}

const KEY_PERMISSIONS: Record<KeyRole, Permission[]> = {
  calculate: ['calculate'],
  tuning: ['calculate', 'tuning'],
  admin: ['calculate', 'tuning', 'keys:own', 'keys:all', 'usage:own', 'usage:all', 'users'],
};

const USER_PERMISSIONS: Record<UserRole, Permission[]> = {
  admin: ['calculate', 'tuning', 'keys:own', 'keys:all', 'usage:own', 'usage:all', 'users'],
  developer: ['calculate', 'tuning', 'keys:own', 'usage:own'],
  viewer: ['usage:own', 'usage:all'],
};

export function permissionsOf(principal: Principal): readonly Permission[] {
  return principal.kind === 'key'
    ? (KEY_PERMISSIONS[principal.role as KeyRole] ?? [])
    : (USER_PERMISSIONS[principal.role as UserRole] ?? []);
}

export function can(principal: Principal | undefined, permission: Permission): boolean {
  return principal !== undefined && permissionsOf(principal).includes(permission);
}

/** Refuses with 403 `insufficient_scope` unless the caller holds one of the permissions. */
export function requirePermission(...permissions: Permission[]): RequestHandler {
  return (req, _res, next) => {
    if (!permissions.some((p) => can(req.principal, p))) {
      const problem = forbidden(`This operation needs one of these permissions: ${permissions.join(', ')}.`);
      if (req.principal?.kind === 'key') {
        problem.headers['WWW-Authenticate'] = 'Bearer realm="isochron", error="insufficient_scope"';
      }
      throw problem;
    }
    next();
  };
}

/** The caller of a request that passed authentication (every `/v1` route). */
export function principalOf(req: Request): Principal {
  if (!req.principal) throw new Error('No principal: the route is not behind authentication');
  return req.principal;
}

/** True when the caller may see every owner's resources, not just its own. */
export const isAdmin = (principal: Principal | undefined): boolean => can(principal, 'keys:all');
