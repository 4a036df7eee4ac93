import { Router } from 'express';
import { Op } from 'sequelize';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import { findTuningFor } from '../rooms/access';
import { addVersion, findVersion, settingsOf, tuningDto, type versionDto } from '../rooms/tuning-store';
import type { Services } from '../services';

/** /v1/tunings/{id}/versions: every version stays readable and can be restored as a new version. */
export function tuningVersionsRouter({ db }: Services, toDto: typeof versionDto): Router {
  const router = Router();
  const tuning = requirePermission('tuning');

  router.get('/tunings/:tuningId/versions', tuning, validate('listTuningVersions'), async (req, res) => {
    const found = await findTuningFor(req, db.models, String(req.valid.params.tuningId));
    const { limit, startingAfter } = req.valid.query as { limit: number; startingAfter?: string };
    const after = startingAfter === undefined ? 0 : Number.parseInt(startingAfter, 10) || 0;
    const rows = await db.models.TuningVersion.findAll({
      where: { tuningId: found.id, version: { [Op.gt]: after } },
      order: [['version', 'ASC']],
      limit: limit + 1,
    });
    res.json({
      data: rows.slice(0, limit).map((row) => toDto(row, req.principal)),
      hasMore: rows.length > limit,
    });
  });

  router.get(
    '/tunings/:tuningId/versions/:version',
    tuning,
    validate('getTuningVersion'),
    async (req, res) => {
      const found = await findTuningFor(req, db.models, String(req.valid.params.tuningId));
      res.json(toDto(await findVersion(db.models, found, req.valid.params.version as number), req.principal));
    },
  );

  router.post(
    '/tunings/:tuningId/versions/:version/restore',
    tuning,
    validate('restoreTuningVersion'),
    async (req, res) => {
      const found = await findTuningFor(req, db.models, String(req.valid.params.tuningId));
      const old = await findVersion(db.models, found, req.valid.params.version as number);
      const { tuning: updated, version } = await addVersion(db, req, found.id, () => ({
        name: old.name,
        notes: old.notes,
        settings: settingsOf(old),
        origin: 'restore',
        restoredFromVersion: old.version,
      }));
      res.json(tuningDto(updated, version, await db.models.Room.findByPk(updated.roomId)));
    },
  );

  return router;
}
