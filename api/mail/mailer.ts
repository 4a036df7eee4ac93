import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../config';
import type { Logger } from '../logger';
import { startFakeSmtpServer } from './fake-smtp-server';
import { Outbox } from './outbox';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  /**
   * Hands one plain-text message to the mail server. Never throws: a failure is logged and answered
   * with `false`, so a request that sends mail still succeeds and can offer another way (a link).
   */
  send(message: MailMessage): Promise<boolean>;
  /** Messages the development mail server received; null when real mail is sent. */
  readonly outbox: Outbox | null;
  /** How mail leaves this process, for the start-up log. */
  readonly description: string;
  close(): Promise<void>;
}

// A mail server that does not answer must not hold a console request for nodemailer's default two minutes.
const TIMEOUTS = { connectionTimeout: 5000, greetingTimeout: 5000, socketTimeout: 10000 };

/** Control characters would let a value start a new header line; mail headers get plain text only. */
const headerSafe = (value: string): string => value.replace(/\p{Cc}+/gu, ' ').trim();

/**
 * Mail through `SMTP_URL` when it is set. Otherwise, outside production, the service starts its own
 * loopback mail server and keeps what it receives in an outbox; in production without `SMTP_URL`
 * every message is refused and logged.
 */
export async function createMailer(
  config: Pick<Config, 'env' | 'smtpUrl' | 'mailFrom'>,
  logger: Logger,
): Promise<Mailer> {
  let transport: Transporter | null = null;
  let outbox: Outbox | null = null;
  let stopServer = async (): Promise<void> => {};
  let description: string;

  if (config.smtpUrl) {
    transport = nodemailer.createTransport({ url: config.smtpUrl, ...TIMEOUTS });
    description = 'SMTP_URL';
  } else if (config.env !== 'production') {
    outbox = new Outbox();
    const server = await startFakeSmtpServer(outbox);
    stopServer = server.close;
    transport = nodemailer.createTransport({
      host: server.host,
      port: server.port,
      secure: false,
      ignoreTLS: true,
      ...TIMEOUTS,
    });
    description = `local development mail server on ${server.host}:${server.port} (outbox at GET /v1/outbox)`;
  } else {
    description = 'nowhere (SMTP_URL is not set)';
  }

  return {
    outbox,
    description,
    async send(message) {
      if (!transport) {
        logger.warn({ subject: message.subject }, 'mail not sent: SMTP_URL is not set');
        return false;
      }
      try {
        await transport.sendMail({
          from: config.mailFrom,
          to: headerSafe(message.to),
          subject: headerSafe(message.subject),
          text: message.text,
        });
        return true;
      } catch (err) {
        // The error may quote the server's reply but never the SMTP_URL credentials or the message body.
        logger.error(
          { err: { message: (err as Error).message, code: (err as { code?: string }).code } },
          'mail not sent',
        );
        return false;
      }
    },
    async close() {
      transport?.close();
      await stopServer();
    },
  };
}
