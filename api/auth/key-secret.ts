import { createHmac, randomBytes } from 'node:crypto';

export const KEY_PATTERN = /^iso_(live|test)_[A-Za-z0-9_-]{43}$/;

export interface NewKeySecret {
  /** The clear key: shown once to its creator, never stored. */
  secret: string;
  prefix: string;
  lastFour: string;
}

/** A new key: `iso_live_` + 32 bytes from the CSPRNG in base64url (256 bits of entropy). */
export function generateKeySecret(kind: 'live' | 'test' = 'live'): NewKeySecret {
  const secret = `iso_${kind}_${randomBytes(32).toString('base64url')}`;
  return { secret, prefix: secret.slice(0, `iso_${kind}_`.length + 4), lastFour: secret.slice(-4) };
}

/** Keyed hash under which a key is stored and looked up. */
export function hashKeySecret(secret: string, serverSecret: string): string {
  return createHmac('sha256', serverSecret).update(secret).digest('hex');
}
