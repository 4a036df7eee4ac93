import type { components } from '../../shared/contract/api-types';
import { Op, type Transaction } from 'sequelize';
import { effectiveKeyRole } from '../auth/key-roles';
import type { Models } from '../db/models';
import type { UserRole } from '../db/models/user';

/**
 * What a change of its owner's role did to one key that was not revoked or expired (the contract's
 * `UserUpdateResult.keys`): the role it was created with, never changed by a role change, and what it
 * could do before and can do after; null when it can do nothing.
 */
export type KeyRoleEffect = NonNullable<components['schemas']['UserUpdateResult']['keys']>[number];

/**
 * The owner's live keys whose effective role a change from `from` to `to` moves. Keys are kept as they
 * are: a key is lowered (or stopped) while its owner's role allows less, and a promotion gives back at
 * most the role it was created with.
 */
export async function keyRoleEffects(
  models: Models,
  ownerId: string,
  from: UserRole,
  to: UserRole,
  now: Date,
  transaction: Transaction,
): Promise<KeyRoleEffect[]> {
  const keys = await models.ApiKey.findAll({
    where: {
      ownerId,
      revokedAt: null,
      [Op.or]: [{ expiresAt: null }, { expiresAt: { [Op.gt]: now } }],
    },
    order: [['id', 'ASC']],
    transaction,
  });
  return keys
    .map((key) => ({
      id: key.id,
      name: key.name,
      prefix: key.prefix,
      lastFour: key.lastFour,
      role: key.role,
      effectiveRoleBefore: effectiveKeyRole(key.role, from),
      effectiveRoleAfter: effectiveKeyRole(key.role, to),
    }))
    .filter((effect) => effect.effectiveRoleBefore !== effect.effectiveRoleAfter);
}
