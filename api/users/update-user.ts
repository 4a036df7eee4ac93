import { recordAudit, type AuditEntry } from '../audit/record-audit';
import { actorUserId, type Actor } from '../auth/actor';
import type { UserRole } from '../db/models/user';
import { conflict, notFound } from '../http/problem';
import type { Services } from '../services';
import { toUserView, type UserView } from './user-view';

export interface UpdateUserInput {
  role?: UserRole;
  name?: string | null;
  /** `disabled` signs the user out and refuses them; `active` lifts that again. */
  status?: 'active' | 'disabled';
}

/**
 * Changes a user's role, name or status. Admins cannot disable or demote themselves, so the service
 * always keeps at least the admin who made the last change.
 */
export async function updateUser(
  services: Pick<Services, 'db' | 'keys'>,
  actor: Actor,
  userId: string,
  input: UpdateUserInput,
): Promise<UserView> {
  const { User } = services.db.models;
  const view = await services.db.write(async (transaction) => {
    const user = await User.findByPk(userId, { transaction });
    if (!user) throw notFound(`No user ${userId}.`);
    const self = actorUserId(actor) === user.id;
    if (self && input.role !== undefined && input.role !== user.role) {
      throw conflict('You cannot change your own role; ask another admin.', [
        { pointer: '/body/role', message: 'cannot change your own role' },
      ]);
    }
    if (self && input.status === 'disabled') {
      throw conflict('You cannot disable your own account.', [
        { pointer: '/body/status', message: 'cannot disable yourself' },
      ]);
    }

    const events: AuditEntry[] = [];
    const target = { targetType: 'user', targetId: user.id };
    if (input.role !== undefined && input.role !== user.role) {
      events.push({ action: 'user.roleChanged', ...target, details: { from: user.role, to: input.role } });
      user.role = input.role;
    }
    if (input.name !== undefined && input.name !== user.name) {
      events.push({ action: 'user.updated', ...target, details: { fields: ['name'] } });
      user.name = input.name;
    }
    if (input.status === 'disabled' && user.status !== 'disabled') {
      events.push({ action: 'user.disabled', ...target, details: { from: user.status } });
      user.status = 'disabled';
    } else if (input.status === 'active' && user.status === 'invited') {
      throw conflict(
        'The user has not chosen a password yet; they become active by accepting their invitation.',
        [{ pointer: '/body/status', message: 'the invitation has not been accepted yet' }],
      );
    } else if (input.status === 'active' && user.status === 'disabled') {
      // Someone disabled before accepting their invitation goes back to waiting for it.
      user.status = user.passwordHash ? 'active' : 'invited';
      events.push({ action: 'user.updated', ...target, details: { fields: ['status'], to: user.status } });
    }

    if (events.length > 0) {
      await user.save({ transaction });
      for (const event of events) await recordAudit(services.db.models, actor, event, transaction);
    }
    return toUserView(user);
  });
  // Keys are looked up through a short cache; a disabled owner's keys must stop on the very next request.
  if (input.status !== undefined) services.keys.invalidate();
  return view;
}
