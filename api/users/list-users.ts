import type { Models } from '../db/models';
import { pageOf, type Page, type PageRequest } from '../db/pagination';
import { notFound } from '../http/problem';
import { toUserView, type UserView } from './user-view';

export type ListUsersQuery = PageRequest;

/** One page of users in creation order (ids sort by time). */
export function listUsers(models: Models, query: ListUsersQuery): Promise<Page<UserView>> {
  return pageOf(models.User, {}, query, toUserView);
}

/** One user, or a 404 saying which. */
export async function getUser(
  models: Models,
  userId: string,
  missing = `No user ${userId}.`,
): Promise<UserView> {
  const user = await models.User.findByPk(userId);
  if (!user) throw notFound(missing);
  return toUserView(user);
}
