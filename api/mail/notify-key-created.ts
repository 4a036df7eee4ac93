import type { Services } from '../services';
import { keyCreatedMessage, type KeyCreatedNotice } from './messages';

/**
 * Tells a key's owner that a key was created for them. Resolves to whether the mail server took the
 * message; never throws, so key creation never fails because of mail.
 */
export function notifyKeyCreated(
  services: Pick<Services, 'mail'>,
  notice: KeyCreatedNotice,
): Promise<boolean> {
  return services.mail.send(keyCreatedMessage(notice));
}
