import type { components } from '../../shared/contract/api-types';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { recordAudit, type AuditEntry } from '../audit/record-audit';
import { generateKeySecret, hashKeySecret } from '../auth/key-secret';
import type { KeyStore } from '../auth/key-store';
import type { Actor } from '../auth/actor';
import { KEY_ROLES_BY_OWNER_ROLE } from '../auth/key-roles';
import { isAdmin } from '../auth/permissions';
import type { Database } from '../db/database';
import type { Models } from '../db/models';
import { newId } from '../db/ids';
import { pageOf, type Page } from '../db/pagination';
import type { ApiKey, KeyRole } from '../db/models/api-key';
import { conflict, forbidden, notFound, ProblemError } from '../http/problem';
import type { Logger } from '../logger';
import type { KeyCreatedNotice } from '../mail/messages';
import { toKeyView, type CreatedKeyView, type KeyView } from './key-view';

/** Who asks: a caller of the API (a key or a signed-in user), or the operator at the command line. */
export type KeyActor = Extract<Actor, { kind: 'caller' | 'operator' }>;

export interface CreateKeyInput {
  name: string;
  role: KeyRole;
  kind?: 'live' | 'test';
  expiresAt?: string | null;
  rateLimitPerMinute?: number | null;
  /** Whose key it is; the caller itself when absent. Only admins and the operator name someone else. */
  ownerId?: string;
}

/** A change to a key, as the contract's `UpdateKeyRequest` gives it. */
export type UpdateKeyInput = components['schemas']['UpdateKeyRequest'];

export interface ListKeysOptions {
  limit: number;
  startingAfter?: string;
  ownerId?: string;
  includeRevoked?: boolean;
}

const NAME_MAX_LENGTH = 120;
// Names are stored verbatim (any quotes, semicolons or SQL are just text); only control characters are refused.
const NAME_PATTERN = /^(?=.*\S)\P{Cc}+$/u;

function unprocessable(pointer: string, message: string): ProblemError {
  return new ProblemError({
    status: 422,
    title: 'Value cannot be used',
    detail: message,
    type: 'key-input',
    errors: [{ pointer, message }],
  });
}

function checkName(name: string): void {
  if (name.length > NAME_MAX_LENGTH || !NAME_PATTERN.test(name)) {
    throw unprocessable(
      '/body/name',
      `name must be 1 to ${NAME_MAX_LENGTH} characters, not blank, without control characters`,
    );
  }
}

function parseExpiry(value: string | null | undefined, now: Date): Date | null | undefined {
  if (value === undefined || value === null) return value;
  const date = new Date(value);
  if (Number.isNaN(date.getTime()))
    throw unprocessable('/body/expiresAt', 'expiresAt must be an RFC 3339 date-time');
  if (date.getTime() <= now.getTime()) {
    throw unprocessable('/body/expiresAt', `expiresAt must be in the future; got ${value}`);
  }
  return date;
}

/** Keys of the owner that are neither revoked nor expired at `now`: what MAX_ACTIVE_KEYS_PER_USER counts. */
export function countActiveKeys(
  models: Models,
  ownerId: string,
  now: Date,
  transaction?: Transaction,
): Promise<number> {
  return models.ApiKey.count({
    where: { ownerId, revokedAt: null, [Op.or]: [{ expiresAt: null }, { expiresAt: { [Op.gt]: now } }] },
    transaction,
  });
}

export interface KeyServiceDeps {
  db: Database;
  keys: KeyStore;
  keyHashSecret: string;
  logger: Logger;
  /** Tells an owner that someone else created a key for them; resolves false when the mail failed. */
  notifyKeyCreated?: (notice: KeyCreatedNotice) => Promise<boolean>;
  /** Most active (not revoked, not expired) keys one user may hold; no limit when absent. */
  maxActiveKeysPerUser?: number;
  now?: () => Date;
}

/**
 * Creating, listing, editing and revoking API keys, for the HTTP API and the operator command line alike.
 * Callers with `keys:own` see and manage only their own keys; `keys:all` (admins) and the operator see all.
 */
export class KeyService {
  private readonly now: () => Date;

  constructor(private readonly deps: KeyServiceDeps) {
    this.now = deps.now ?? (() => new Date());
  }

  async create(actor: KeyActor, input: CreateKeyInput): Promise<CreatedKeyView> {
    const { db, keyHashSecret, logger } = this.deps;
    const self = this.scope(actor);
    const ownerId = input.ownerId ?? (actor.kind === 'caller' ? actor.principal.userId : undefined);
    if (!ownerId) throw unprocessable('/body/ownerId', 'ownerId is required');
    if (self !== null) {
      if (ownerId !== self) throw forbidden('You may create keys only for yourself.');
      if (input.role === 'admin') throw forbidden('Only an admin may create a key with role admin.');
      if (input.rateLimitPerMinute !== undefined) throw forbidden("Only an admin sets a key's rate limit.");
    }
    checkName(input.name);
    const now = this.now();
    const expiresAt = parseExpiry(input.expiresAt, now) ?? null;
    const kind = input.kind ?? 'live';
    const { secret, prefix, lastFour } = generateKeySecret(kind);

    const createdById = actor.kind === 'caller' ? actor.principal.userId : null;
    const { key, ownerEmail } = await db.write(async (transaction) => {
      // Locked on PostgreSQL so that two instances creating keys for one owner count one after the other.
      const owner = await db.models.User.findByPk(ownerId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!owner) throw unprocessable('/body/ownerId', `No user ${ownerId}`);
      if (owner.status === 'disabled') throw unprocessable('/body/ownerId', `User ${ownerId} is disabled`);
      const cap = this.deps.maxActiveKeysPerUser;
      if (cap !== undefined && (await countActiveKeys(db.models, ownerId, now, transaction)) >= cap) {
        throw conflict(
          `User ${ownerId} already has ${cap} active keys, the most one user may hold (MAX_ACTIVE_KEYS_PER_USER); revoke one first.`,
          [{ pointer: '/body/ownerId', message: `already has ${cap} active keys` }],
        );
      }
      if (!KEY_ROLES_BY_OWNER_ROLE[owner.role].includes(input.role)) {
        throw unprocessable(
          '/body/role',
          `A user with role ${owner.role} cannot own a key with role ${input.role}`,
        );
      }
      const created = await db.models.ApiKey.create(
        {
          id: newId('key'),
          name: input.name,
          role: input.role,
          kind,
          prefix,
          lastFour,
          secretHash: hashKeySecret(secret, keyHashSecret),
          ownerId,
          createdById,
          rateLimitPerMinute: input.rateLimitPerMinute ?? null,
          expiresAt,
          revokedAt: null,
          lastUsedAt: null,
        },
        { transaction },
      );
      await this.audit(actor, transaction, {
        action: 'key.created',
        targetType: 'apiKey',
        targetId: created.id,
        details: { name: created.name, role: created.role, ownerId, prefix, expiresAt, ...this.via(actor) },
      });
      return { key: created, ownerEmail: owner.email };
    });
    logger.info({ keyId: key.id, prefix, lastFour, ownerId, role: key.role }, 'API key created');
    if (ownerId !== createdById && this.deps.notifyKeyCreated) {
      const creator = createdById ? await db.models.User.findByPk(createdById) : null;
      await this.deps.notifyKeyCreated({
        ownerEmail,
        keyName: key.name,
        role: key.role,
        prefix,
        lastFour,
        createdBy: creator?.email ?? null,
      });
    }
    return { ...toKeyView(key, now), secret };
  }

  async list(actor: KeyActor, options: ListKeysOptions): Promise<Page<KeyView>> {
    const conditions: WhereOptions<ApiKey>[] = [];
    const self = this.scope(actor);
    if (self !== null) {
      if (options.ownerId !== undefined && options.ownerId !== self) {
        throw forbidden("Listing another user's keys needs the keys:all permission.");
      }
      conditions.push({ ownerId: self });
    } else if (options.ownerId !== undefined) {
      conditions.push({ ownerId: options.ownerId });
    }
    if (!options.includeRevoked) conditions.push({ revokedAt: null });
    const now = this.now();
    return pageOf(this.deps.db.models.ApiKey, { [Op.and]: conditions }, options, (row) =>
      toKeyView(row, now),
    );
  }

  async get(actor: KeyActor, id: string): Promise<KeyView> {
    return toKeyView(await this.findVisible(actor, id), this.now());
  }

  async update(actor: KeyActor, id: string, input: UpdateKeyInput): Promise<KeyView> {
    if (this.scope(actor) !== null && input.rateLimitPerMinute !== undefined) {
      throw forbidden("Only an admin sets a key's rate limit.");
    }
    if (input.name !== undefined) checkName(input.name);
    const now = this.now();
    const expiresAt = parseExpiry(input.expiresAt, now);
    const key = await this.deps.db.write(async (transaction) => {
      const found = await this.findVisible(actor, id, transaction);
      if (found.revokedAt) throw conflict(`Key ${id} is revoked and cannot be changed.`);
      if (expiresAt !== undefined) this.checkExpiryChange(actor, found, expiresAt, now);
      const changes: Partial<Pick<ApiKey, 'name' | 'rateLimitPerMinute' | 'expiresAt'>> = {};
      if (input.name !== undefined) changes.name = input.name;
      if (input.rateLimitPerMinute !== undefined) changes.rateLimitPerMinute = input.rateLimitPerMinute;
      if (expiresAt !== undefined) changes.expiresAt = expiresAt;
      if (Object.keys(changes).length === 0) return found;
      await found.update(changes, { transaction });
      await this.audit(actor, transaction, {
        action: 'key.updated',
        targetType: 'apiKey',
        targetId: id,
        details: { ...changes, ...this.via(actor) },
      });
      return found;
    });
    // After the commit, so no lookup can cache the old limit or expiry again.
    await this.deps.keys.invalidate();
    return toKeyView(key, now);
  }

  /** Revokes at once; revoking a revoked key changes nothing and answers the same. */
  async revoke(actor: KeyActor, id: string): Promise<KeyView> {
    const now = this.now();
    const key = await this.deps.db.write(async (transaction) => {
      const found = await this.findVisible(actor, id, transaction);
      if (found.revokedAt) return found;
      await found.update({ revokedAt: now }, { transaction });
      await this.audit(actor, transaction, {
        action: 'key.revoked',
        targetType: 'apiKey',
        targetId: id,
        details: { name: found.name, ownerId: found.ownerId, ...this.via(actor) },
      });
      return found;
    });
    await this.deps.keys.invalidate();
    this.deps.logger.info({ keyId: id }, 'API key revoked');
    return toKeyView(key, now);
  }

  /**
   * An expired key stays expired, for everyone: a new key is the way back. Only an admin (or the operator)
   * may move an expiry later or remove it; the owner may only bring it nearer or set one where there was none.
   */
  private checkExpiryChange(actor: KeyActor, key: ApiKey, next: Date | null, now: Date): void {
    if (key.expiresAt && key.expiresAt.getTime() <= now.getTime()) {
      throw conflict(
        `Key ${key.id} expired at ${key.expiresAt.toISOString()} and stays expired; create a new key instead.`,
        [{ pointer: '/body/expiresAt', message: 'the key has expired' }],
      );
    }
    const current = key.expiresAt;
    if (this.scope(actor) === null || current === null) return;
    if (next === null) throw forbidden("Only an admin may remove a key's expiry.");
    if (next.getTime() > current.getTime()) {
      throw forbidden(`Only an admin may move a key's expiry later than ${current.toISOString()}.`);
    }
  }

  /** The one owner whose keys the actor may touch, or null when it may touch everyone's. */
  private scope(actor: KeyActor): string | null {
    return actor.kind === 'operator' || isAdmin(actor.principal) ? null : actor.principal.userId;
  }

  /** Someone else's key is answered as missing, not forbidden, so ids of other owners' keys are not confirmed. */
  private async findVisible(actor: KeyActor, id: string, transaction?: Transaction): Promise<ApiKey> {
    const key = await this.deps.db.models.ApiKey.findByPk(id, { transaction });
    const self = this.scope(actor);
    if (!key || (self !== null && key.ownerId !== self)) {
      throw notFound(`No key ${id}.`);
    }
    return key;
  }

  private via(actor: KeyActor): Record<string, string> {
    return actor.kind === 'operator' ? { via: 'operator command line' } : {};
  }

  private audit(actor: KeyActor, transaction: Transaction, entry: AuditEntry): Promise<void> {
    return recordAudit(this.deps.db.models, actor, entry, transaction);
  }
}
