import { recordAudit } from '../audit/record-audit';
import type { Actor } from '../auth/actor';
import { hashPassword } from '../auth/password';
import type { Invitation } from '../db/models/invitation';
import type { User } from '../db/models/user';
import { ProblemError } from '../http/problem';
import type { Services } from '../services';
import { hashInvitationToken } from './invitation-token';

function refused(detail: string): ProblemError {
  return new ProblemError({
    status: 400,
    title: 'Invitation cannot be used',
    detail,
    type: 'invitation-invalid',
    errors: [{ pointer: '/body/token', message: detail }],
  });
}

/** Refuses a password built from the e-mail address (the console checks the same rule). */
function checkPassword(password: string, email: string): void {
  const local = email.split('@')[0]?.toLowerCase() ?? '';
  if (local.length >= 3 && password.toLowerCase().includes(local)) {
    throw new ProblemError({
      status: 422,
      title: 'Password cannot be used',
      detail: 'The password must not contain the e-mail address.',
      errors: [{ pointer: '/body/password', message: 'must not contain the e-mail address' }],
    });
  }
}

function usable(invitation: Invitation | null, user: User | null): { invitation: Invitation; user: User } {
  if (!invitation) throw refused('This invitation link is not valid.');
  if (invitation.usedAt) throw refused('This invitation link has already been used.');
  if (invitation.expiresAt.getTime() <= Date.now()) {
    throw refused('This invitation link has expired; ask an administrator for a new one.');
  }
  if (!user || user.status !== 'invited')
    throw refused('This invitation is no longer valid for its account.');
  return { invitation, user };
}

/**
 * Takes up an invitation: the token works once and until it expires; it sets the password and makes
 * the user active. The write queue runs one acceptance at a time, so a token raced twice wins once.
 */
export async function acceptInvitation(
  services: Pick<Services, 'db'>,
  visitor: Actor,
  token: string,
  password: string,
): Promise<User> {
  const { Invitation, User } = services.db.models;
  const tokenHash = hashInvitationToken(token);
  const pending = await Invitation.findOne({ where: { tokenHash } });
  const invitee = usable(pending, pending ? await User.findByPk(pending.userId) : null).user;
  checkPassword(password, invitee.email);
  // scrypt takes tens of milliseconds: hash before taking the write queue, not inside it.
  const passwordHash = await hashPassword(password);

  // Checked again inside the queue: another acceptance of the same token may have finished meanwhile.
  return services.db.write(async (transaction) => {
    const found = await Invitation.findOne({ where: { tokenHash }, transaction });
    const { invitation, user } = usable(
      found,
      found ? await User.findByPk(found.userId, { transaction }) : null,
    );
    await invitation.update({ usedAt: new Date() }, { transaction });
    await user.update({ passwordHash, status: 'active' }, { transaction });
    const newcomer: Actor = {
      kind: 'caller',
      principal: { kind: 'user', role: user.role, userId: user.id },
      ip: visitor.kind === 'operator' ? null : visitor.ip,
    };
    await recordAudit(
      services.db.models,
      newcomer,
      { action: 'user.passwordSet', targetType: 'user', targetId: user.id, details: { via: 'invitation' } },
      transaction,
    );
    return user;
  });
}
