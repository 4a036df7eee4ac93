/** Console user roles, as the platform defines them. */
export type UserRole = 'admin' | 'developer' | 'viewer';

/**
 * Things the console may offer. They mirror the server's permission table (api/auth/permissions.ts),
 * which enforces the same rules on every request.
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

const CAPABILITIES: Record<UserRole, ReadonlySet<Capability>> = {
  admin: new Set<Capability>([
    'keys:view',
    'keys:manage',
    'keys:all',
    'keys:setRateLimit',
    'keys:createAdmin',
    'usage:all',
    'users:manage',
    'outbox:view',
    'calculate:session',
    'rooms:view',
  ]),
  developer: new Set<Capability>(['keys:view', 'keys:manage', 'calculate:session', 'rooms:view']),
  viewer: new Set<Capability>(['usage:all']),
};

/** Whether a signed-in user of this role should see the controls for a capability. */
export function can(role: UserRole | null | undefined, capability: Capability): boolean {
  if (!role) return false;
  return CAPABILITIES[role]?.has(capability) ?? false;
}

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
