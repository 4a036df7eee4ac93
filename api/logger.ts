import pino, { type Logger } from 'pino';

/** Structured logs. Authorization headers, cookies and passwords are redacted wherever they appear. */
export function createLogger(level: string): Logger {
  return pino({
    level,
    redact: {
      paths: [
        'req.headers.authorization',
        'req.headers.cookie',
        '*.password',
        '*.secret',
        '*.token',
        'headers.authorization',
        'headers.cookie',
      ],
      censor: '[redacted]',
    },
  });
}

export type { Logger };
