import { verifyPassword } from '../auth/password';
import type { Config } from '../config';
import type { Models } from '../db/models';
import { OUTBOX_CAPACITY, OUTBOX_MAX_BYTES } from '../mail/outbox';
import { DEMO_PASSWORD, DEMO_USERS } from '../../seeds/demo-platform';

/**
 * What an operator must know before exposing this process: settings that are fine on a laptop and
 * dangerous on a network. Empty for a production start with its own users.
 */
export async function startupWarnings(
  config: Config,
  models: Models,
  mail: { outbox: unknown },
): Promise<string[]> {
  const warnings: string[] = [];
  if (config.env !== 'production') {
    warnings.push(
      `NODE_ENV is ${config.env}${process.env.NODE_ENV ? '' : ' (not set)'}: this is not a production start. Set NODE_ENV=production on any machine others can reach (README, "Running in production").`,
      'Session cookies are sent without the Secure flag, so they also travel over plain HTTP.',
    );
    if (mail.outbox) {
      warnings.push(
        `A development mail server runs on 127.0.0.1 and accepts mail from any local process without a password (it keeps at most ${OUTBOX_CAPACITY} messages, ${Math.round(OUTBOX_MAX_BYTES / 1024)} KiB in all, readable by admins at GET /v1/outbox). Set SMTP_URL to send real mail.`,
      );
    }
  }
  const withDemoPassword = [];
  for (const demo of DEMO_USERS) {
    const user = await models.User.findOne({ where: { email: demo.email, status: 'active' } });
    if (user?.passwordHash && (await verifyPassword(DEMO_PASSWORD, user.passwordHash))) {
      withDemoPassword.push(demo.email);
    }
  }
  if (withDemoPassword.length > 0) {
    warnings.push(
      `${withDemoPassword.join(', ')} sign in with the published demo password "${DEMO_PASSWORD}": anyone who reaches this port can sign in as them. Disable them or start from an empty database (SEED_DEMO_DATA=false) before others can reach it.`,
    );
  }
  return warnings;
}

/** The warnings as one block for standard error, where a person starting the service will see it. */
export function warningBanner(warnings: string[]): string {
  const rule = '!'.repeat(78);
  return [rule, 'Isochron is NOT set up for production:', ...warnings.map((w) => `  - ${w}`), rule].join(
    '\n',
  );
}
