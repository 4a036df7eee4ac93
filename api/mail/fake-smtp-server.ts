import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { Outbox } from './outbox';
import { parseMessage } from './parse-message';

/** Largest message the development server accepts; ours are a few kilobytes. */
export const MAX_MESSAGE_BYTES = 64 * 1024;
/** Connections at once; the service itself needs one. */
const MAX_CLIENTS = 4;

export interface FakeSmtpServer {
  host: string;
  port: number;
  close(): Promise<void>;
}

/**
 * A mail server for development and tests: listens on the loopback interface only, on a port the
 * system picks, accepts every message without authentication and puts it in the outbox instead of
 * delivering it anywhere.
 */
export function startFakeSmtpServer(outbox: Outbox): Promise<FakeSmtpServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    maxClients: MAX_CLIENTS,
    logger: false,
    banner: 'Isochron development mail server (nothing is delivered)',
    closeTimeout: 1000,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        if (stream.sizeExceeded) return callback(new Error('Message too large'));
        const { subject, text } = parseMessage(Buffer.concat(chunks));
        const to = session.envelope.rcptTo.map((recipient) => recipient.address).join(', ');
        outbox.add({ to, subject, text });
        callback();
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      server.off('error', reject);
      const { port } = server.server.address() as AddressInfo;
      resolve({
        host: '127.0.0.1',
        port,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
