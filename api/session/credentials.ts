import { randomBytes } from 'node:crypto';
import { hashPassword, verifyPassword } from '../auth/password';
import type { Models } from '../db/models';
import type { User } from '../db/models/user';

export type SignInFailureReason = 'unknownEmail' | 'wrongPassword' | 'notActivated' | 'disabled';

export type CredentialCheck =
  { ok: true; user: User } | { ok: false; reason: SignInFailureReason; userId: string | null };

/** E-mail addresses are compared without case or surrounding spaces. */
export const normalizeEmail = (email: string): string => email.trim().toLowerCase();

let decoyHash: Promise<string> | undefined;

/**
 * Checks an e-mail address and password. Every path runs exactly one scrypt verification — against a
 * decoy hash when there is no usable one — so the answer time does not tell whether an account exists.
 */
export async function checkCredentials(
  models: Models,
  email: string,
  password: string,
): Promise<CredentialCheck> {
  decoyHash ??= hashPassword(randomBytes(24).toString('base64url'));
  const user = await models.User.findOne({ where: { email: normalizeEmail(email) } });
  const matches = await verifyPassword(password, user?.passwordHash ?? (await decoyHash));
  if (!user) return { ok: false, reason: 'unknownEmail', userId: null };
  if (!user.passwordHash || user.status === 'invited')
    return { ok: false, reason: 'notActivated', userId: user.id };
  if (!matches) return { ok: false, reason: 'wrongPassword', userId: user.id };
  if (user.status !== 'active') return { ok: false, reason: 'disabled', userId: user.id };
  return { ok: true, user };
}
