import { createHash, randomBytes } from 'node:crypto';

/** An invitation link is good for this long (PRODUCT.md §5: one-time, expiring). */
export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60_000;

/** 32 bytes from the CSPRNG, base64url: the token travels only in the e-mailed link. */
export function generateInvitationToken(): string {
  return randomBytes(32).toString('base64url');
}

/**
 * Only this hash is stored. A plain SHA-256 is enough here (unlike passwords): the token has 256 bits
 * of entropy, so there is nothing to guess from the hash.
 */
export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** The console page that takes the token: `${publicUrl}/accept-invitation?token=...`. */
export function invitationUrl(publicUrl: string, token: string): string {
  const url = new URL('accept-invitation', publicUrl.endsWith('/') ? publicUrl : `${publicUrl}/`);
  url.searchParams.set('token', token);
  return url.toString();
}
