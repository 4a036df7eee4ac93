import type { Transaction } from 'sequelize';
import { newId } from '../db/ids';
import type { Actor } from '../auth/actor';
import type { Models } from '../db/models';

export type AuditAction =
  | 'key.created'
  | 'key.updated'
  | 'key.revoked'
  | 'user.invited'
  | 'user.updated'
  | 'user.roleChanged'
  | 'user.disabled'
  | 'user.passwordSet'
  | 'session.signedIn'
  | 'session.signInFailed'
  | 'session.signedOut';

export interface AuditEntry {
  action: AuditAction;
  targetType?: string;
  targetId?: string;
  /** Never put secrets, passwords or tokens here. */
  details?: Record<string, unknown>;
}

/** Records who did what, inside the caller's write transaction so the event and the change land together. */
export async function recordAudit(
  models: Models,
  actor: Actor,
  entry: AuditEntry,
  transaction: Transaction,
): Promise<void> {
  await models.AuditEvent.create(
    {
      id: newId('evt'),
      action: entry.action,
      actorUserId: actor.kind === 'caller' ? actor.principal.userId : null,
      actorKeyId: actor.kind === 'caller' ? (actor.principal.keyId ?? null) : null,
      targetType: entry.targetType ?? null,
      targetId: entry.targetId ?? null,
      details: entry.details ? JSON.stringify(entry.details) : null,
      ipAddress: actor.kind === 'operator' ? null : actor.ip,
    },
    { transaction },
  );
}
