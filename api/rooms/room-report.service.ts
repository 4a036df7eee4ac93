import { roomGeometry } from '../../shared/geometry';
import { mayIdentify } from '../auth/disclosure';
import { findLayout } from '../../shared/layouts';
import { tuningCautions } from '../../shared/plan';
import type { Database } from '../db/database';
import { notFound } from '../http/problem';
import { designAtRate } from '../tunings/design-at-rate';
import { findVersion, settingsOf } from '../tunings/tuning-store';
import { findRoomFor, findTuningFor, type Caller } from './room-access';
import { powerAverageResampled } from '../../shared/analysis/spatial-average';
import { magnitudeOf } from '../../shared/plan/stored-room-plan';
import { storedMeasurement, VerificationService } from '../tunings/verification.service';
import { stalenessOf } from './room-state-store';
import { renderRoomReport, type RoomReportInput } from './room-report';

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
  let verification: RoomReportInput['verification'] = null;
  if (chosen) {
    const checked = await new VerificationService(db).verify(caller, chosen.id, { version: choice.version });
    if (checked.result.verdict !== 'incomplete' || checked.version.signOff) {
      verification = {
        result: checked.result,
        before: await beforeResponses(db, room.id),
        signOff: checked.version.signOff ?? null,
      };
    }
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
    verification,
    generatedAt: now,
  });
}

/** Each channel's "before" response: the power average over positions of its responses taken without a tuning. */
async function beforeResponses(db: Database, roomId: string) {
  const rows = (await db.models.Measurement.findAll({ where: { roomId }, order: [['id', 'ASC']] }))
    .map(storedMeasurement)
    .filter((m) => m.stage !== 'after' && magnitudeOf(m) !== null);
  return [...new Set(rows.map((m) => m.channel))].flatMap((channel) => {
    const own = rows.filter((m) => m.channel === channel);
    const kind = own.some((m) => m.kind === 'frequencyResponse') ? 'frequencyResponse' : 'impulseResponse';
    const list = own.filter((m) => m.kind === kind);
    const newestPerPosition = [...new Set(list.map((m) => m.micPosition))].map(
      (p) => list.filter((m) => m.micPosition === p).at(-1) as (typeof list)[number],
    );
    try {
      return [
        {
          channel,
          ...powerAverageResampled(
            newestPerPosition.map(
              (m) => magnitudeOf(m) as { frequenciesHz: number[]; magnitudeDb: number[] },
            ),
          ),
        },
      ];
    } catch {
      // Responses that share no frequency range cannot be averaged; the plot then shows "after" alone.
      return [];
    }
  });
}
