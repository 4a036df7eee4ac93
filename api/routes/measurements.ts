import { Router, type ErrorRequestHandler, type Request, type RequestHandler } from 'express';
import multer from 'multer';
import { powerAverageResampled } from '../../shared/analysis/spatial-average';
import { requirePermission } from '../auth/permissions';
import { newId } from '../db/ids';
import type { Measurement } from '../db/models/measurement';
import type { Room } from '../db/models/room';
import { badRequest, notFound, ProblemError } from '../http/problem';
import { validate } from '../http/validate';
import { measurementDto } from '../measurements/measurement-dto';
import {
  contentFromFile,
  contentFromJson,
  requireRoomChannel,
  type JsonMeasurement,
  type MeasurementContent,
  type UploadForm,
} from '../measurements/measurement-input';
import { findRoomFor, roomStillThere } from '../rooms/access';
import { pageById } from '../rooms/pagination';
import type { Services } from '../services';
import { audioProblem, multerProblem, validateFormFields, WAV_UPLOAD_LIMITS } from './audio-upload';

const upload = multer({ storage: multer.memoryStorage(), limits: WAV_UPLOAD_LIMITS }).single('file');
const receiveFile: RequestHandler = (req, res, next) =>
  upload(req, res, (err: unknown) => next(multerProblem(err)));
/** Multipart uploads take the first route; JSON bodies fall through to the second. */
const onlyMultipart: RequestHandler = (req, _res, next) =>
  next(req.is('multipart/form-data') ? undefined : 'route');

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
    const row = await db.write(async (transaction) => {
      await roomStillThere(db.models, room.id, transaction);
      return Measurement.create(
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
      );
    });
    return measurementDto(row, true);
  };
  const created = (res: Parameters<RequestHandler>[1], dto: ReturnType<typeof measurementDto>) =>
    res.status(201).location(`/v1/rooms/${dto.roomId}/measurements/${dto.id}`).json(dto);

  router.post(
    path,
    tuning,
    onlyMultipart,
    receiveFile,
    validateFormFields('MeasurementUpload'),
    async (req, res) => {
      const room = await findRoomFor(req, db.models, String(req.valid.params.roomId));
      if (!req.file)
        throw badRequest('Send the measurement file in the multipart field `file`.', [
          { pointer: '/body/file', message: 'is required' },
        ]);
      const form = req.valid.body as UploadForm;
      requireRoomChannel(room, form.channel);
      created(res, await store(req, room, form, contentFromFile(req.file, form, room)));
    },
  );

  router.post(path, tuning, validate('createMeasurement'), async (req, res) => {
    const room = await findRoomFor(req, db.models, String(req.valid.params.roomId));
    const body = req.valid.body as JsonMeasurement & Labels;
    requireRoomChannel(room, body.channel);
    created(res, await store(req, room, body, contentFromJson(body)));
  });

  router.get(path, tuning, validate('listMeasurements'), async (req, res) => {
    const room = await findRoomFor(req, db.models, String(req.valid.params.roomId));
    const { limit, startingAfter, channel } = req.valid.query as {
      limit: number;
      startingAfter?: string;
      channel?: string;
    };
    const page = await pageById(
      Measurement,
      { roomId: room.id, ...(channel && { channel }) },
      limit,
      startingAfter,
    );
    res.json({ data: page.rows.map((m) => measurementDto(m, false)), hasMore: page.hasMore });
  });

  router.get(`${path}/average`, tuning, validate('averageMeasurements'), async (req, res) => {
    const room = await findRoomFor(req, db.models, String(req.valid.params.roomId));
    const { channel, kind } = req.valid.query as { channel: string; kind?: string };
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
  });

  router.get(`${path}/:measurementId`, tuning, validate('getMeasurement'), async (req, res) => {
    res.json(measurementDto(await findMeasurement(req, await roomOf(req)), true));
  });

  router.delete(`${path}/:measurementId`, tuning, validate('deleteMeasurement'), async (req, res) => {
    const measurement = await findMeasurement(req, await roomOf(req));
    await db.write((transaction) => measurement.destroy({ transaction }));
    res.status(204).end();
  });

  const roomOf = (req: Request) => findRoomFor(req, db.models, String(req.valid.params.roomId));
  const findMeasurement = async (req: Request, room: Room): Promise<Measurement> => {
    const id = String(req.valid.params.measurementId);
    const measurement = await Measurement.findOne({ where: { id, roomId: room.id } });
    if (!measurement) throw notFound(`No measurement ${id} in room ${room.id}.`);
    return measurement;
  };

  const toAudioProblem: ErrorRequestHandler = (err, _req, _res, next) => next(audioProblem(err));
  router.use(path, toAudioProblem);
  return router;
}

/** The magnitude response a stored measurement carries: an analysis's smoothed response, or the response itself. */
function responseOf(m: Measurement): { frequenciesHz: number[]; magnitudeDb: number[] } {
  type Response = { frequenciesHz: number[]; magnitudeDb: number[] };
  return m.kind === 'impulseResponse'
    ? (m.result as { frequencyResponse: Response }).frequencyResponse
    : (m.result as unknown as Response);
}
