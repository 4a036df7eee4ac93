import { Router } from 'express';
import { compareTunings, tuningToCsv } from '../../shared/plan';
import { designAtRate } from '../rooms/design-at-rate';
import { requirePermission } from '../auth/permissions';
import { badRequest } from '../http/problem';
import { validate } from '../http/validate';
import { findRoomFor, findTuningFor } from '../rooms/access';
import { pageById } from '../rooms/pagination';
import { checkPatchedChannel, planForRoom, settingsFromInput, toTuningChannel } from '../rooms/tuning-input';
import {
  addVersion,
  createTuning,
  findVersion,
  settingsOf,
  tuningDto,
  versionDto,
} from '../rooms/tuning-store';
import { tuningVersionsRouter } from './tuning-versions';
import type { Services } from '../services';

const BIQUAD_CONVENTION = 'a0 = 1; H(z) = (b0 + b1 z^-1 + b2 z^-2) / (1 + a1 z^-1 + a2 z^-2)';

/** Tunings of stored rooms: versioned on every edit, duplicable, comparable, exportable. */
export function tuningsRouter(services: Services): Router {
  const { db } = services;
  const { Tuning, Room } = db.models;
  const router = Router();
  const tuning = requirePermission('tuning');

  router.get(
    '/rooms/:roomId/tunings',
    tuning,
    validate('listRoomTunings', async ({ params, query: { limit, startingAfter } }, req, res) => {
      const room = await findRoomFor(req, db.models, params.roomId);
      const page = await pageById(Tuning, { roomId: room.id }, limit, startingAfter);
      const data = await Promise.all(
        page.rows.map(async (t) => tuningDto(t, await findVersion(db.models, t, undefined), room)),
      );
      res.json({ data, hasMore: page.hasMore });
    }),
  );

  router.post(
    '/rooms/:roomId/tunings',
    tuning,
    validate('createRoomTuning', async ({ params, body }, req, res) => {
      const room = await findRoomFor(req, db.models, params.roomId);
      if ((body.plan === undefined) === (body.channels === undefined)) {
        const pointer = body.plan === undefined ? '/body/channels' : '/body/plan';
        throw badRequest('Give exactly one of channels (settings per channel) or plan (a whole-room plan).', [
          { pointer, message: 'give exactly one of channels or plan' },
        ]);
      }
      const fromPlan = body.plan ? planForRoom(room, body.plan) : null;
      const settings = fromPlan
        ? fromPlan.settings
        : settingsFromInput({ ...body, channels: body.channels ?? [] }, room);
      const { tuning: created, version } = await createTuning(db, req, room, {
        name: body.name,
        notes: body.notes ?? null,
        settings,
        origin: fromPlan ? 'plan' : 'settings',
      });
      const dto = tuningDto(created, version, room);
      res
        .status(201)
        .location(`/v1/tunings/${created.id}`)
        .json(
          fromPlan
            ? { ...dto, planWarnings: fromPlan.plan.warnings, cautions: [...fromPlan.plan.cautions] }
            : dto,
        );
    }),
  );

  router.get(
    '/tunings/compare',
    tuning,
    validate('compareTunings', async ({ query: q }, req, res) => {
      const left = await findTuningFor(req, db.models, q.left);
      const right = await findTuningFor(req, db.models, q.right);
      const leftVersion = await findVersion(db.models, left, q.leftVersion);
      const rightVersion = await findVersion(db.models, right, q.rightVersion);
      res.json({
        left: { tuningId: left.id, version: leftVersion.version, name: leftVersion.name },
        right: { tuningId: right.id, version: rightVersion.version, name: rightVersion.name },
        ...compareTunings(settingsOf(leftVersion), settingsOf(rightVersion)),
      });
    }),
  );

  router.get(
    '/tunings/:tuningId',
    tuning,
    validate('getTuning', async ({ params, query }, req, res) => {
      const found = await findTuningFor(req, db.models, params.tuningId);
      const version = await findVersion(db.models, found, query.version);
      res.json(tuningDto(found, version, await Room.findByPk(found.roomId)));
    }),
  );

  router.patch(
    '/tunings/:tuningId',
    tuning,
    validate('updateTuning', async ({ params, body }, req, res) => {
      const found = await findTuningFor(req, db.models, params.tuningId);
      const { tuning: updated, version } = await addVersion(db, req, found.id, (current) => {
        const removed = new Set(body.removeChannels ?? []);
        const channels = current.channels.filter((c) => !removed.has(c.id));
        const sampleRateHz = body.sampleRateHz ?? current.sampleRateHz;
        (body.channels ?? []).forEach((change, bodyIndex) => {
          const index = channels.findIndex((c) => c.id === change.id);
          const merged = toTuningChannel(change, index >= 0 ? channels[index] : undefined);
          checkPatchedChannel(merged, bodyIndex, sampleRateHz);
          if (index >= 0) channels[index] = merged;
          else channels.push(merged);
        });
        return {
          name: body.name ?? current.name,
          notes: body.notes !== undefined ? body.notes : current.notes,
          origin: 'edit',
          settings: {
            sampleRateHz,
            channels,
            subwoofer: body.subwoofer !== undefined ? body.subwoofer : current.subwoofer,
          },
        };
      });
      res.json(tuningDto(updated, version, await Room.findByPk(updated.roomId)));
    }),
  );

  router.delete(
    '/tunings/:tuningId',
    tuning,
    validate('deleteTuning', async ({ params }, req, res) => {
      const found = await findTuningFor(req, db.models, params.tuningId);
      await db.write(async (transaction) => {
        await db.models.TuningVersion.destroy({ where: { tuningId: found.id }, transaction });
        await found.destroy({ transaction });
      });
      res.status(204).end();
    }),
  );

  router.post(
    '/tunings/:tuningId/duplicate',
    tuning,
    validate('duplicateTuning', async ({ params, body = {} }, req, res) => {
      const source = await findTuningFor(req, db.models, params.tuningId);
      const version = await findVersion(db.models, source, body.version);
      const room = await findRoomFor(req, db.models, source.roomId);
      const copy = await createTuning(
        db,
        req,
        room,
        {
          name: body.name ?? `${version.name} (copy)`,
          notes: version.notes,
          settings: settingsOf(version),
          origin: 'duplicate',
        },
        source.id,
      );
      res
        .status(201)
        .location(`/v1/tunings/${copy.tuning.id}`)
        .json(tuningDto(copy.tuning, copy.version, room));
    }),
  );

  router.get(
    '/tunings/:tuningId/export',
    tuning,
    validate('exportTuning', async ({ params, query: q }, req, res) => {
      const found = await findTuningFor(req, db.models, params.tuningId);
      const version = await findVersion(db.models, found, q.version);
      const designed = designAtRate(settingsOf(version), q.sampleRateHz ?? version.sampleRateHz);
      if (q.format === 'csv') {
        res
          .type('text/csv; charset=utf-8')
          .attachment(`${found.id}-v${version.version}-${designed.sampleRateHz}.csv`)
          .send(tuningToCsv(designed));
        return;
      }
      res.json({
        tuningId: found.id,
        name: version.name,
        version: version.version,
        convention: BIQUAD_CONVENTION,
        ...designed,
      });
    }),
  );

  router.use(tuningVersionsRouter(services, versionDto));
  return router;
}
