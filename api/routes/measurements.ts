import { Router, type Request, type RequestHandler } from 'express';
import { powerAverageResampled } from '../../shared/analysis/spatial-average';
import { requirePermission } from '../auth/permissions';
import { newId } from '../db/ids';
import type { Measurement } from '../db/models/measurement';
import type { Room } from '../db/models/room';
import { notFound, ProblemError } from '../http/problem';
import { validate } from '../http/validate';
import { measurementDto } from '../measurements/measurement-dto';
import {
  contentFromFile,
  contentFromJson,
  requireRoomChannel,
  type MeasurementContent,
} from '../measurements/measurement-input';
import { findRoomFor } from '../rooms/access';
import { pageById } from '../rooms/pagination';
import type { Services } from '../services';

interface Labels {
  channel: string;
  micPosition?: string;
  name?: string;
  notes?: string;
}

/** /v1/rooms/{roomId}/measurements: uploads analysed on arrival and stored whole, or not at all. */
export function measurementsRouter({ db }: Services): Router {
  const router = Router();
  const { Measurement } = db.models;
  const tuning = requirePermission('tuning');
  const path = '/rooms/:roomId/measurements';

  const store = async (req: Request, room: Room, labels: Labels, content: MeasurementContent) => {
    const row = await db.write((transaction) =>
      Measurement.create(
        {
          id: newId('meas'),
          roomId: room.id,
          ownerId: room.ownerId,
          channel: labels.channel,
          micPosition: labels.micPosition ?? '1',
          name: labels.name ?? null,
          notes: labels.notes ?? null,
          ...content,
          createdByKeyId: req.principal?.keyId ?? null,
        },
        { transaction },
      ),
    );
    return measurementDto(row, true);
  };
  const created = (res: Parameters<RequestHandler>[1], dto: ReturnType<typeof measurementDto>) =>
    res.status(201).location(`/v1/rooms/${dto.roomId}/measurements/${dto.id}`).json(dto);

  router.post(
    path,
    tuning,
    validate('createMeasurement', async (input, req, res) => {
      const room = await findRoomFor(req, db.models, input.params.roomId);
      requireRoomChannel(room, input.body.channel);
      // A multipart upload carries a file; a JSON body carries the measurement itself.
      const content = input.file
        ? contentFromFile(input.file, input.body, room)
        : contentFromJson(input.body);
      created(res, await store(req, room, input.body, content));
    }),
  );

  router.get(
    path,
    tuning,
    validate('listMeasurements', async ({ params, query: { limit, startingAfter, channel } }, req, res) => {
      const room = await findRoomFor(req, db.models, params.roomId);
      const page = await pageById(
        Measurement,
        { roomId: room.id, ...(channel && { channel }) },
        limit,
        startingAfter,
      );
      res.json({ data: page.rows.map((m) => measurementDto(m, false)), hasMore: page.hasMore });
    }),
  );

  router.get(
    `${path}/average`,
    tuning,
    validate('averageMeasurements', async ({ params, query: { channel, kind } }, req, res) => {
      const room = await findRoomFor(req, db.models, params.roomId);
      const rows = await Measurement.findAll({ where: { roomId: room.id, channel }, order: [['id', 'ASC']] });
      const withResponse = rows.filter((m) => m.kind !== 'spl' && (kind === undefined || m.kind === kind));
      if (withResponse.length === 0)
        throw notFound(`Room ${room.id} has no frequency or impulse responses for channel ${channel}.`);
      if (new Set(withResponse.map((m) => m.kind)).size > 1) {
        // dB re full scale and sound-pressure levels cannot be averaged into one meaningful curve.
        throw new ProblemError({
          status: 422,
          title: 'Value cannot be used',
          detail: `Channel ${channel} has both impulse-response analyses and frequency responses; choose one with kind.`,
          type: 'calculation-input',
          errors: [
            { pointer: '/query/kind', message: 'is required when the channel has both kinds of response' },
          ],
        });
      }
      const average = powerAverageResampled(withResponse.map(responseOf));
      res.json({
        channel,
        measurementIds: withResponse.map((m) => m.id),
        micPositions: [...new Set(withResponse.map((m) => m.micPosition))],
        ...average,
      });
    }),
  );

  router.get(
    `${path}/:measurementId`,
    tuning,
    validate('getMeasurement', async ({ params }, req, res) => {
      res.json(measurementDto(await findMeasurement(req, params), true));
    }),
  );

  router.delete(
    `${path}/:measurementId`,
    tuning,
    validate('deleteMeasurement', async ({ params }, req, res) => {
      const measurement = await findMeasurement(req, params);
      await db.write((transaction) => measurement.destroy({ transaction }));
      res.status(204).end();
    }),
  );

  const findMeasurement = async (
    req: Request,
    params: { roomId: string; measurementId: string },
  ): Promise<Measurement> => {
    const room = await findRoomFor(req, db.models, params.roomId);
    const measurement = await Measurement.findOne({ where: { id: params.measurementId, roomId: room.id } });
    if (!measurement) throw notFound(`No measurement ${params.measurementId} in room ${room.id}.`);
    return measurement;
  };

  return router;
}

/** The magnitude response a stored measurement carries: an analysis's smoothed response, or the response itself. */
function responseOf(m: Measurement): { frequenciesHz: number[]; magnitudeDb: number[] } {
  type Response = { frequenciesHz: number[]; magnitudeDb: number[] };
  return m.kind === 'impulseResponse'
    ? (m.result as { frequencyResponse: Response }).frequencyResponse
    : (m.result as unknown as Response);
}
