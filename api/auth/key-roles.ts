import { KEY_ROLES, type KeyRole } from '../db/models/api-key';
import type { UserRole } from '../db/models/user';

/** A key may never do more than its owner: viewers own no working keys, developers no admin keys. */
export const KEY_ROLES_BY_OWNER_ROLE: Record<UserRole, readonly KeyRole[]> = {
  admin: ['calculate', 'tuning', 'admin'],
  developer: ['calculate', 'tuning'],
  viewer: [],
};

/**
 * What a key may do now: its own role, lowered to the highest role its owner's current role allows, or
 * null when the owner may hold no key at all. Checked on every request, so a demotion reaches every key
 * of the user at once and a promotion gives back no more than each key was created with.
 */
export function effectiveKeyRole(keyRole: KeyRole, ownerRole: UserRole): KeyRole | null {
  const allowed = KEY_ROLES_BY_OWNER_ROLE[ownerRole] ?? [];
  const rank = KEY_ROLES.indexOf(keyRole);
  for (let i = rank; i >= 0; i -= 1) {
    if (allowed.includes(KEY_ROLES[i])) return KEY_ROLES[i];
  }
  return null;
}
