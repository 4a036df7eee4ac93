import type { components } from '../../../../shared/contract/api-types';

/** Console user roles, as the platform defines them. */
export type UserRole = components['schemas']['SessionUser']['role'];

/** A permission of the server's own table, as the session answer lists them for the signed-in user. */
export type Permission = components['schemas']['SessionBody']['permissions'][number];

/**
 * Things the console may offer, each tied to the one server permission that allows it. The console
 * holds no role table of its own: the session answer says which permissions the user has, the server
 * enforces them on every request, and this only decides which pages and controls to show.
 */
export type Capability =
  | 'keys:view'
  | 'keys:manage'
  | 'keys:all'
  | 'keys:setRateLimit'
  | 'keys:createAdmin'
  | 'usage:all'
  | 'users:manage'
  | 'outbox:view'
  | 'calculate:session'
  | 'rooms:view';

export const CAPABILITY_NEEDS: Record<Capability, Permission> = {
  'keys:view': 'keys:own',
  'keys:manage': 'keys:own',
  'keys:all': 'keys:all',
  'keys:setRateLimit': 'keys:all',
  'keys:createAdmin': 'keys:all',
  'usage:all': 'usage:all',
  'users:manage': 'users',
  'outbox:view': 'users',
  'calculate:session': 'calculate',
  'rooms:view': 'tuning',
};

/** Whether a signed-in user with these permissions should see the controls for a capability. */
export function can(permissions: readonly string[] | null | undefined, capability: Capability): boolean {
  return Boolean(permissions?.includes(CAPABILITY_NEEDS[capability]));
}

/** What a person is told a page needs: the permission in words and the roles that usually carry it. */
export const PERMISSION_WORDS: Record<Permission, { what: string; roles: string }> = {
  calculate: { what: 'run calculations with the console session', roles: 'Developer or Admin' },
  tuning: { what: 'work with rooms, measurements and tunings', roles: 'Developer or Admin' },
  'keys:own': { what: 'hold API keys', roles: 'Developer or Admin' },
  'keys:all': { what: "manage everyone's API keys", roles: 'Admin' },
  'usage:own': { what: 'see your own usage', roles: 'any' },
  'usage:all': { what: "see everyone's usage", roles: 'Viewer or Admin' },
  users: { what: 'manage users', roles: 'Admin' },
};

/** Key roles a user of this role may hand out: nobody issues a key stronger than themselves. */
export function grantableKeyRoles(
  role: UserRole | null | undefined,
): Array<'calculate' | 'tuning' | 'admin'> {
  if (role === 'admin') return ['calculate', 'tuning', 'admin'];
  if (role === 'developer') return ['calculate', 'tuning'];
  return [];
}

/** Human label for a role, used in chips and selects. */
export function roleLabel(role: string): string {
  const labels: Record<string, string> = {
    admin: 'Admin',
    developer: 'Developer',
    viewer: 'Viewer',
    calculate: 'Calculate',
    tuning: 'Tuning',
  };
  return labels[role] ?? role;
}
