import { parseArgs } from 'node:util';
import { Op } from 'sequelize';
import { KEY_ROLES, type KeyRole } from '../db/models/api-key';
import type { User } from '../db/models/user';
import { KeyService } from '../keys/key-service';
import type { KeyView } from '../keys/key-view';
import { notifyKeyCreated } from '../mail';
import type { Services } from '../services';
import { normalizeEmail } from '../session/credentials';
import { RefusedError, UsageError, type CliIo } from './cli-io';

const OPERATOR = { kind: 'operator' } as const;
const KEY_ID = /^key_[0-9a-z]{1,36}$/;

function keyService(services: Services): KeyService {
  return new KeyService({
    db: services.db,
    keys: services.keys,
    keyHashSecret: services.config.keyHashSecret,
    logger: services.logger,
    notifyKeyCreated: (notice) => notifyKeyCreated(services, notice),
    maxActiveKeysPerUser: services.config.maxActiveKeysPerUser,
  });
}

async function userByEmail(services: Services, email: string): Promise<User> {
  const user = await services.db.models.User.findOne({ where: { email: normalizeEmail(email) } });
  if (!user) throw new RefusedError(`No user with the e-mail address ${email}.`);
  return user;
}

async function defaultOwner(services: Services): Promise<User> {
  const admin = await services.db.models.User.findOne({
    where: { role: 'admin', status: { [Op.ne]: 'disabled' } },
    order: [['createdAt', 'ASC']],
  });
  if (!admin)
    throw new RefusedError('No admin user exists yet: pass --owner EMAIL, or first run `users create`.');
  return admin;
}

function parseRole(value: string | undefined): KeyRole {
  if (!value) throw new UsageError('--role is required (calculate, tuning or admin).');
  if (!(KEY_ROLES as readonly string[]).includes(value)) {
    throw new UsageError(`--role must be calculate, tuning or admin; got "${value}".`);
  }
  return value as KeyRole;
}

function parseRateLimit(value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  const limit = Number(value);
  if (!Number.isInteger(limit) || limit < 1 || limit > 1_000_000) {
    throw new UsageError(
      `--rate-limit must be a whole number of requests per minute from 1 to 1000000; got "${value}".`,
    );
  }
  return limit;
}

function parseExpiry(value: string | undefined): string | undefined {
  if (value === undefined) return undefined;
  if (Number.isNaN(Date.parse(value)))
    throw new UsageError(`--expires must be an RFC 3339 date-time; got "${value}".`);
  return value;
}

async function create(services: Services, args: string[], io: CliIo): Promise<void> {
  const { values } = parseArgs({
    args,
    options: {
      name: { type: 'string' },
      role: { type: 'string' },
      owner: { type: 'string' },
      kind: { type: 'string' },
      expires: { type: 'string' },
      'rate-limit': { type: 'string' },
      json: { type: 'boolean' },
    },
  });
  if (!values.name) throw new UsageError('--name is required.');
  const role = parseRole(values.role);
  if (values.kind !== undefined && values.kind !== 'live' && values.kind !== 'test') {
    throw new UsageError(`--kind must be live or test; got "${values.kind}".`);
  }
  const rateLimitPerMinute = parseRateLimit(values['rate-limit']);
  const expiresAt = parseExpiry(values.expires);
  const owner = values.owner ? await userByEmail(services, values.owner) : await defaultOwner(services);
  const key = await keyService(services).create(OPERATOR, {
    name: values.name,
    role,
    kind: values.kind as 'live' | 'test' | undefined,
    ownerId: owner.id,
    expiresAt,
    rateLimitPerMinute,
  });
  if (values.json) {
    io.out(JSON.stringify({ ...key, ownerEmail: owner.email }));
    return;
  }
  io.out(`Created key ${key.id} "${key.name}" (role ${key.role}) for ${owner.email}.`);
  io.out('The key is shown only this once; store it now:');
  io.out('');
  io.out(`  ${key.secret}`);
  io.out('');
  io.out('Send it as the header  Authorization: Bearer <key>');
}

function describe(key: KeyView, owners: Map<string, string>): string {
  return [
    key.id,
    `${key.prefix}…${key.lastFour}`,
    key.role.padEnd(9),
    key.status.padEnd(7),
    (owners.get(key.ownerId) ?? key.ownerId).padEnd(28),
    `last used ${key.lastUsedAt ?? 'never'}`,
    JSON.stringify(key.name),
  ].join('  ');
}

async function list(services: Services, args: string[], io: CliIo): Promise<void> {
  const { values } = parseArgs({
    args,
    options: { owner: { type: 'string' }, 'include-revoked': { type: 'boolean' }, json: { type: 'boolean' } },
  });
  const ownerId = values.owner ? (await userByEmail(services, values.owner)).id : undefined;
  const service = keyService(services);
  const keys: KeyView[] = [];
  let startingAfter: string | undefined;
  for (;;) {
    const page = await service.list(OPERATOR, {
      limit: 100,
      startingAfter,
      ownerId,
      includeRevoked: values['include-revoked'] ?? false,
    });
    keys.push(...page.data);
    if (!page.hasMore) break;
    startingAfter = page.data[page.data.length - 1].id;
  }
  if (values.json) {
    io.out(JSON.stringify(keys));
    return;
  }
  const users = await services.db.models.User.findAll({ attributes: ['id', 'email'] });
  const owners = new Map(users.map((u) => [u.id, u.email]));
  if (keys.length === 0) io.err('No keys.');
  for (const key of keys) io.out(describe(key, owners));
}

async function revoke(services: Services, args: string[], io: CliIo): Promise<void> {
  const { positionals } = parseArgs({ args, allowPositionals: true, options: {} });
  if (positionals.length !== 1)
    throw new UsageError('keys revoke takes one key id, e.g. key_0mf3x1c2a9f8a7b6c5d4e.');
  const [id] = positionals;
  if (!KEY_ID.test(id))
    throw new UsageError(`"${id}" is not a key id (key_…); use \`keys list\` to find it.`);
  const key = await keyService(services).revoke(OPERATOR, id);
  io.out(
    `Revoked ${key.id} "${key.name}" at ${key.revokedAt}. A running service refuses it within a second.`,
  );
}

export async function keysCommand(services: Services, args: string[], io: CliIo): Promise<void> {
  const [action, ...rest] = args;
  switch (action) {
    case 'create':
      return create(services, rest, io);
    case 'list':
      return list(services, rest, io);
    case 'revoke':
      return revoke(services, rest, io);
    default:
      throw new UsageError(
        action ? `Unknown keys command "${action}".` : 'keys needs a command: create, list or revoke.',
      );
  }
}
