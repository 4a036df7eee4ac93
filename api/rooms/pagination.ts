import { Op, type Model, type ModelStatic, type WhereOptions } from 'sequelize';

/**
 * Cursor pagination over a table whose ids sort by creation time: the page after `startingAfter`,
 * oldest first, with `hasMore` found by reading one row more than asked.
 */
export async function pageById<M extends Model>(
  model: ModelStatic<M>,
  where: WhereOptions,
  limit: number,
  startingAfter?: string,
): Promise<{ rows: M[]; hasMore: boolean }> {
  const cursor = startingAfter ? { id: { [Op.gt]: startingAfter } } : {};
  const rows = await model.findAll({
    where: { ...(where as object), ...cursor } as WhereOptions,
    order: [['id', 'ASC']],
    limit: limit + 1,
  });
  return { rows: rows.slice(0, limit), hasMore: rows.length > limit };
}
