import { Router } from 'express';
import { roomGeometry } from '../../shared/geometry';
import { findLayout } from '../../shared/layouts';
import { tuningCautions } from '../../shared/plan';
import { mayIdentify } from '../auth/disclosure';
import { requirePermission } from '../auth/permissions';
import { notFound } from '../http/problem';
import { validate } from '../http/validate';
import { renderRoomReport } from '../reports/room-report';
import { designAtRate } from '../rooms/design-at-rate';
import { findRoomFor, findTuningFor } from '../rooms/access';
import { findVersion, settingsOf } from '../rooms/tuning-store';
import type { Services } from '../services';

/** GET /v1/rooms/{roomId}/report: the client's print-ready HTML report of a room and one of its tunings. */
export function roomReportRouter({ db }: Services): Router {
  const router = Router();
  router.get(
    '/rooms/:roomId/report',
    requirePermission('tuning'),
    validate('getRoomReport'),
    async (req, res) => {
      const room = await findRoomFor(req, db.models, String(req.valid.params.roomId));
      const q = req.valid.query as { tuningId?: string; version?: number };
      const chosen = q.tuningId
        ? await findTuningFor(req, db.models, q.tuningId)
        : await db.models.Tuning.findOne({
            where: { roomId: room.id },
            order: [
              ['updatedAt', 'DESC'],
              ['id', 'DESC'],
            ],
          });
      if (chosen && chosen.roomId !== room.id) throw notFound(`Tuning ${chosen.id} belongs to another room.`);
      const layout = findLayout(room.layoutId);
      let tuning = null;
      if (chosen) {
        const version = await findVersion(db.models, chosen, q.version);
        // The author's name only for the author and admins; a developer's client report never carries
        // the e-mail address of an admin who edited the tuning.
        const shown = mayIdentify(req.principal, version.createdByUserId);
        const author =
          version.createdByUserId && shown ? await db.models.User.findByPk(version.createdByUserId) : null;
        const settings = settingsOf(version);
        tuning = {
          name: version.name,
          version: version.version,
          notes: version.notes,
          createdAt: version.createdAt,
          tunedBy: author
            ? (author.name ?? author.email)
            : version.createdByUserId
              ? 'another Isochron user'
              : 'unknown',
          settings,
          designed: designAtRate(settings, settings.sampleRateHz),
          cautions: tuningCautions(settings, layout),
        };
      }
      const html = renderRoomReport({
        room,
        layout,
        geometry: roomGeometry({
          layout: room.layoutId,
          dimensions: room.dimensions,
          listener: room.listener,
          loudspeakers: room.loudspeakers,
        }),
        tuning,
        generatedAt: new Date(),
      });
      res.type('text/html; charset=utf-8').send(html);
    },
  );
  return router;
}
