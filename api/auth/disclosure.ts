import { can, type Principal } from './permissions';

/**
 * Whether the caller may learn who a user is (name, e-mail, key ids): the user themself and those who
 * manage users. A developer sharing a room's history with an admin sees that someone else made a change,
 * never who, nor with which key.
 */
export function mayIdentify(caller: Principal | undefined, userId: string | null): boolean {
  if (userId === null || caller === undefined) return false;
  return caller.userId === userId || can(caller, 'users');
}

/** The author of a stored change as the caller may see it: both ids, or neither. */
export function authorAsSeenBy(
  caller: Principal | undefined,
  author: { userId: string | null; keyId: string | null },
): { userId: string | null; keyId: string | null } {
  return mayIdentify(caller, author.userId) ? author : { userId: null, keyId: null };
}
