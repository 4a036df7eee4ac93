import { roomGeometry } from '../../shared/geometry';
import { mayIdentify } from '../auth/disclosure';
import { findLayout } from '../../shared/layouts';
import { tuningCautions } from '../../shared/plan';
import type { Database } from '../db/database';
import { notFound } from '../http/problem';
import { designAtRate } from '../tunings/design-at-rate';
import { findVersion, settingsOf } from '../tunings/tuning-store';
import { findRoomFor, findTuningFor, type Caller } from './room-access';
import { stalenessOf } from './room-state-store';
import { renderRoomReport } from './room-report';

/**
 * The client's print-ready HTML report of a room and one of its tunings: the given one (at the given
 * version), or else the room's most recently changed tuning.
 */
export async function roomReportHtml(
  db: Database,
  caller: Caller,
  roomId: string,
  choice: { tuningId?: string; version?: number },
  now: Date,
): Promise<string> {
  const room = await findRoomFor(caller, db.models, roomId);
  const chosen = choice.tuningId
    ? await findTuningFor(caller, db.models, choice.tuningId)
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
    const version = await findVersion(db.models, chosen, choice.version);
    // The author's name only for the author and admins; a developer's client report never carries
    // the e-mail address of an admin who edited the tuning.
    const shown = mayIdentify(caller.principal, version.createdByUserId);
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
      cautions: tuningCautions(settings, { layout, limits: room.limits }),
      stale: await stalenessOf(db.models, room, version.roomRevision),
    };
  }
  return renderRoomReport({
    room,
    layout,
    geometry: roomGeometry({
      layout: room.layoutId,
      dimensions: room.dimensions,
      listener: room.listener,
      loudspeakers: room.loudspeakers,
    }),
    tuning,
    generatedAt: now,
  });
}
