import { Op, type WhereOptions } from 'sequelize';
import type { Models } from '../db/models';
import type { User } from '../db/models/user';
import { toUserView, type UserView } from './user-view';

export interface ListUsersQuery {
  limit: number;
  startingAfter?: string;
}

/** One page of users in creation order (ids sort by time). */
export async function listUsers(
  models: Models,
  query: ListUsersQuery,
): Promise<{ data: UserView[]; hasMore: boolean }> {
  const where: WhereOptions<User> = query.startingAfter ? { id: { [Op.gt]: query.startingAfter } } : {};
  const rows = await models.User.findAll({ where, order: [['id', 'ASC']], limit: query.limit + 1 });
  return { data: rows.slice(0, query.limit).map(toUserView), hasMore: rows.length > query.limit };
}
