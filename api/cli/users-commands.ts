import { parseArgs } from 'node:util';
import { USER_ROLES, type UserRole } from '../db/models/user';
import type { Services } from '../services';
import { inviteUser } from '../users';
import { UsageError, type CliIo } from './cli-io';

// Deliberately loose: the address only has to reach a person; the mail server is the judge.
const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

async function create(services: Services, args: string[], io: CliIo): Promise<void> {
  const { values } = parseArgs({
    args,
    options: {
      email: { type: 'string' },
      role: { type: 'string' },
      name: { type: 'string' },
      json: { type: 'boolean' },
    },
  });
  if (!values.email) throw new UsageError('--email is required.');
  if (!EMAIL.test(values.email) || values.email.length > 254) {
    throw new UsageError(`--email must be an e-mail address; got "${values.email}".`);
  }
  if (!values.role) throw new UsageError('--role is required (admin, developer or viewer).');
  if (!(USER_ROLES as readonly string[]).includes(values.role)) {
    throw new UsageError(`--role must be admin, developer or viewer; got "${values.role}".`);
  }
  const { user, invitation } = await inviteUser(
    services,
    { kind: 'operator' },
    {
      email: values.email,
      role: values.role as UserRole,
      name: values.name ?? null,
    },
  );
  if (values.json) {
    io.out(JSON.stringify({ user, invitation }));
    return;
  }
  io.out(`Created ${user.email} (role ${user.role}, id ${user.id}), waiting for a password.`);
  io.out(`One-time link, valid until ${invitation.expiresAt}; hand it to them over a safe channel:`);
  io.out('');
  io.out(`  ${invitation.url}`);
  io.out('');
  if (!invitation.emailSent)
    io.err('The invitation e-mail was not sent (no mail server configured); use the link above.');
}

export async function usersCommand(services: Services, args: string[], io: CliIo): Promise<void> {
  const [action, ...rest] = args;
  if (action === 'create') return create(services, rest, io);
  throw new UsageError(action ? `Unknown users command "${action}".` : 'users needs a command: create.');
}
