import { Op, type Model, type ModelStatic, type WhereOptions } from 'sequelize';

/** One page of a list: `{data, hasMore}`, the shape of every list the API answers. */
export interface Page<T> {
  data: T[];
  hasMore: boolean;
}

export interface PageRequest {
  limit: number;
  /** The cursor: the last id (or number) of the previous page. */
  startingAfter?: string | number;
}

/**
 * Cursor pagination over a table, oldest first: the rows after `startingAfter` in `column` order (ids
 * sort by creation time, so `id` is the default), with `hasMore` found by reading one row more than asked.
 */
export async function pageOf<M extends Model, T>(
  model: ModelStatic<M>,
  where: WhereOptions,
  { limit, startingAfter }: PageRequest,
  toView: (row: M) => T,
  column = 'id',
): Promise<Page<T>> {
  const cursor = startingAfter === undefined ? {} : { [column]: { [Op.gt]: startingAfter } };
  const rows = await model.findAll({
    where: { [Op.and]: [where, cursor] } as WhereOptions,
    order: [[column, 'ASC']],
    limit: limit + 1,
  });
  return { data: rows.slice(0, limit).map(toView), hasMore: rows.length > limit };
}

/**
 * The same pagination over a list already in memory, in its own order: the items after the one whose id
 * is `startingAfter` (none when that id is gone).
 */
export function pageOfList<T>(
  items: readonly T[],
  idOf: (item: T) => string,
  { limit, startingAfter }: PageRequest,
): Page<T> {
  let start = 0;
  if (startingAfter !== undefined) {
    const index = items.findIndex((item) => idOf(item) === String(startingAfter));
    start = index === -1 ? items.length : index + 1;
  }
  return { data: items.slice(start, start + limit), hasMore: start + limit < items.length };
}
