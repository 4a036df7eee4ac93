import { randomBytes } from 'node:crypto';

/**
 * Resource ids sort by creation time (a millisecond timestamp in base 36, then randomness), so cursor
 * pagination can order by id alone: `key_0mf3x1c2a_9f8a7b6c5d4e`.
 */
export function newId(prefix: string): string {
  const time = Date.now().toString(36).padStart(9, '0');
  return `${prefix}_${time}${randomBytes(6).toString('hex')}`;
}
