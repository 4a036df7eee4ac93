import type { MailMessage } from './mailer';

export interface InvitationMessageInput {
  to: string;
  name: string | null;
  role: string;
  url: string;
  expiresAt: Date;
  invitedBy: string | null;
}

const utc = (date: Date): string => `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/** The e-mail carrying a one-time link to set a password. */
export function invitationMessage(input: InvitationMessageInput): MailMessage {
  const greeting = input.name ? `Hello ${input.name},` : 'Hello,';
  const who = input.invitedBy ?? 'An administrator';
  return {
    to: input.to,
    subject: 'You are invited to the Isochron console',
    text: [
      greeting,
      '',
      `${who} invited you to the Isochron console with the role "${input.role}".`,
      '',
      `Choose your password here. The link works once and expires on ${utc(input.expiresAt)}:`,
      input.url,
      '',
      'If you did not expect this invitation, ignore this message; nothing happens until the link is used.',
    ].join('\n'),
  };
}

export interface KeyCreatedNotice {
  ownerEmail: string;
  keyName: string;
  role: string;
  /** Visible start of the key (`iso_live_Ab3x`). */
  prefix: string;
  lastFour: string;
  /** Who created it, as shown to the owner (an e-mail address or a name); null for the operator command line. */
  createdBy: string | null;
}

/** The notice sent to a key's owner. It never contains the key itself, only how to recognise it. */
export function keyCreatedMessage(notice: KeyCreatedNotice): MailMessage {
  return {
    to: notice.ownerEmail,
    subject: 'An Isochron API key was created for you',
    text: [
      'Hello,',
      '',
      `${notice.createdBy ?? 'An operator'} created an API key for you:`,
      '',
      `  Name: ${notice.keyName}`,
      `  Role: ${notice.role}`,
      `  Key:  ${notice.prefix}…${notice.lastFour}`,
      '',
      'The key itself is shown only once, to whoever created it; ask them to hand it over through a safe',
      'channel. If you did not expect this key, revoke it in the console under Keys.',
    ].join('\n'),
  };
}
