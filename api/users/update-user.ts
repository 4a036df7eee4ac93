import type { components } from '../../shared/contract/api-types';
import { recordAudit, type AuditEntry } from '../audit/record-audit';
import { actorUserId, type Actor } from '../auth/actor';
import type { UserRole } from '../db/models/user';
import { conflict, notFound } from '../http/problem';
import type { Services } from '../services';
import { keyRoleEffects, type KeyRoleEffect } from './key-role-effects';
import { toUserView } from './user-view';

export interface UpdateUserInput {
  role?: UserRole;
  name?: string | null;
  /** `disabled` signs the user out and refuses them; `active` lifts that again. */
  status?: 'active' | 'disabled';
}

/** The user after a change; after a role change also the keys whose effective role it moved. */
export type UpdatedUserView = components['schemas']['UserUpdateResult'];

/**
 * Changes a user's role, name or status. A role change takes effect on the user's keys at their next
 * request (each key is capped by its owner's role); the answer and the audit log list the keys it moved. Admins cannot disable or demote themselves, so the service
 * always keeps at least the admin who made the last change.
 */
export async function updateUser(
  services: Pick<Services, 'db' | 'keys'>,
  actor: Actor,
  userId: string,
  input: UpdateUserInput,
): Promise<UpdatedUserView> {
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
    let keys: KeyRoleEffect[] | undefined;
    if (input.role !== undefined && input.role !== user.role) {
      keys = await keyRoleEffects(
        services.db.models,
        user.id,
        user.role,
        input.role,
        new Date(),
        transaction,
      );
      events.push({
        action: 'user.roleChanged',
        ...target,
        details: {
          from: user.role,
          to: input.role,
          keys: keys.map((k) => ({
            id: k.id,
            role: k.role,
            from: k.effectiveRoleBefore,
            to: k.effectiveRoleAfter,
          })),
        },
      });
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
    return keys === undefined ? toUserView(user) : { ...toUserView(user), keys };
  });
  // Keys are looked up through a short cache; a disabled or demoted owner's keys must change on the very next request.
  if (input.status !== undefined || input.role !== undefined) await services.keys.invalidate();
  return view;
}
