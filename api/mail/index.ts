export { createMailer, type Mailer, type MailMessage } from './mailer';
export { Outbox, type OutboxMessage } from './outbox';
export { invitationMessage, keyCreatedMessage, type KeyCreatedNotice } from './messages';
export { notifyKeyCreated } from './notify-key-created';
