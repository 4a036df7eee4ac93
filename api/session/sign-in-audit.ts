import type { Request } from 'express';
import { recordAudit } from '../audit/record-audit';
import { actorOf } from '../auth/actor';
import type { Database } from '../db/database';
import type { CredentialCheck } from './credentials';

/** Records a successful sign-in and stamps the user's last sign-in time, in one write. */
export function recordSignedIn(db: Database, req: Request, userId: string): Promise<void> {
  return db.write(async (transaction) => {
    await db.models.User.update({ lastSignInAt: new Date() }, { where: { id: userId }, transaction });
    await recordAudit(
      db.models,
      actorOf(req),
      { action: 'session.signedIn', targetType: 'user', targetId: userId },
      transaction,
    );
  });
}

/**
 * Records a refused sign-in. The address tried is kept only when it names an account: people type
 * passwords into the e-mail field, and an unknown "address" may be exactly that.
 */
export function recordSignInFailed(
  db: Database,
  req: Request,
  failure: Extract<CredentialCheck, { ok: false }>,
  email: string,
): Promise<void> {
  return db.write((transaction) =>
    recordAudit(
      db.models,
      actorOf(req),
      {
        action: 'session.signInFailed',
        targetType: failure.userId ? 'user' : undefined,
        targetId: failure.userId ?? undefined,
        details: failure.userId ? { reason: failure.reason, email } : { reason: failure.reason },
      },
      transaction,
    ),
  );
}

export function recordSignedOut(db: Database, req: Request, userId: string): Promise<void> {
  return db.write((transaction) =>
    recordAudit(
      db.models,
      actorOf(req),
      { action: 'session.signedOut', targetType: 'user', targetId: userId },
      transaction,
    ),
  );
}
