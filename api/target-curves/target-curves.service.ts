import { Op, type Transaction } from 'sequelize';
import type { components } from '../../shared/contract/api-types';
import { requirePoints, type TargetCurve as TargetCurveSpec } from '../../shared/eq-fit/target-curve';
import { CalculationInputError } from '../../shared/errors';
import { can } from '../auth/permissions';
import type { Database } from '../db/database';
import { newId } from '../db/ids';
import type { TargetCurve } from '../db/models/target-curve';
import { pageOf, type Page, type PageRequest } from '../db/pagination';
import { conflict, forbidden, notFound } from '../http/problem';
import { ownerScope, type Caller } from '../rooms/room-access';

type TargetCurveCreate = components['schemas']['TargetCurveCreate'];
type TargetCurveUpdate = components['schemas']['TargetCurveUpdate'];
export type StoredTargetCurveView = components['schemas']['StoredTargetCurve'];
/** A target curve as a request may give it: one of the core's kinds, or a stored one by name. */
export type TargetCurveReference = TargetCurveSpec | { kind: 'stored'; name: string };

const view = (curve: TargetCurve): StoredTargetCurveView => ({
  id: curve.id,
  ownerId: curve.ownerId,
  name: curve.name,
  notes: curve.notes,
  points: curve.points,
  createdAt: curve.createdAt.toISOString(),
  updatedAt: curve.updatedAt.toISOString(),
});

/**
 * Stored target curves: a caller's own (every owner's for admins in lists and by id). Names are unique
 * per owner, so requests can name one; every write goes through the write queue.
 */
export class TargetCurvesService {
  constructor(private readonly db: Database) {}

  list(caller: Caller, page: PageRequest): Promise<Page<StoredTargetCurveView>> {
    return pageOf(this.db.models.TargetCurve, ownerScope(caller), page, view);
  }

  async get(caller: Caller, id: string): Promise<StoredTargetCurveView> {
    return view(await this.find(caller, id));
  }

  async create(caller: Caller, input: TargetCurveCreate): Promise<StoredTargetCurveView> {
    requirePoints(input.points, '/points');
    const ownerId = caller.principal.userId;
    const curve = await this.db.write(async (transaction) => {
      await this.nameFree(ownerId, input.name, null, transaction);
      return this.db.models.TargetCurve.create(
        { id: newId('tgc'), ownerId, name: input.name, notes: input.notes ?? null, points: input.points },
        { transaction },
      );
    });
    return view(curve);
  }

  async update(caller: Caller, id: string, changes: TargetCurveUpdate): Promise<StoredTargetCurveView> {
    if (changes.points) requirePoints(changes.points, '/points');
    const found = await this.find(caller, id);
    const curve = await this.db.write(async (transaction) => {
      const current = await this.db.models.TargetCurve.findByPk(found.id, { transaction });
      if (!current) throw notFound(`No target curve ${id}.`);
      if (changes.name !== undefined)
        await this.nameFree(current.ownerId, changes.name, current.id, transaction);
      return current.update(
        {
          ...(changes.name !== undefined && { name: changes.name }),
          ...(changes.notes !== undefined && { notes: changes.notes }),
          ...(changes.points !== undefined && { points: changes.points }),
        },
        { transaction },
      );
    });
    return view(curve);
  }

  async delete(caller: Caller, id: string): Promise<void> {
    const curve = await this.find(caller, id);
    await this.db.write((transaction) => curve.destroy({ transaction }));
  }

  /**
   * The curve a request names, as points for the core; other kinds pass through. Only keys and users that
   * may store tunings may read stored curves (403 otherwise); a name the caller has not stored is a 422
   * naming `field` (the core's convention, turned into a request pointer by the error path).
   */
  async resolve(
    caller: Caller,
    curve: TargetCurveReference | undefined,
    field: string,
  ): Promise<TargetCurveSpec | undefined> {
    if (curve?.kind !== 'stored') return curve;
    if (!can(caller.principal, 'tuning')) {
      throw forbidden(
        'Naming a stored target curve needs a key or user that may store tunings (role tuning or admin).',
      );
    }
    const stored = await this.db.models.TargetCurve.findOne({
      where: { ownerId: caller.principal.userId, name: curve.name },
    });
    if (!stored) {
      throw new CalculationInputError(
        `you have no stored target curve named "${curve.name}"`,
        `${field}/name`,
      );
    }
    return { kind: 'points', points: stored.points };
  }

  private async find(caller: Caller, id: string): Promise<TargetCurve> {
    const curve = await this.db.models.TargetCurve.findOne({ where: { id, ...ownerScope(caller) } });
    if (!curve) throw notFound(`No target curve ${id}.`);
    return curve;
  }

  private async nameFree(ownerId: string, name: string, exceptId: string | null, transaction: Transaction) {
    const taken = await this.db.models.TargetCurve.findOne({
      where: { ownerId, name, ...(exceptId && { id: { [Op.ne]: exceptId } }) },
      transaction,
    });
    if (taken) {
      throw conflict(`You already have a target curve named "${name}" (${taken.id}).`, [
        { pointer: '/body/name', message: 'name is taken' },
      ]);
    }
  }
}
