import type { components } from '../../shared/contract/api-types';
import { Op } from 'sequelize';
import { powerAverageResampled } from '../../shared/analysis/spatial-average';
import type { Database } from '../db/database';
import { newId } from '../db/ids';
import type { Measurement } from '../db/models/measurement';
import type { Microphone } from '../db/models/microphone';
import { pageOf, type Page, type PageRequest } from '../db/pagination';
import type { UploadedFile } from '../http/validate';
import { notFound, ProblemError } from '../http/problem';
import { findRoomFor, roomStillThere, type Caller } from '../rooms/room-access';
import { MicrophonesService, withMicrophone } from '../microphones/microphones.service';
import type { HeavyWork } from '../work/heavy-work';
import { measurementDto } from './measurement-dto';
import {
  contentFromFile,
  contentFromJson,
  requireRoomChannel,
  type MeasurementContent,
  type UploadForm,
} from './measurement-input';

type MeasurementView = components['schemas']['Measurement'];

/** What a measurement is labelled with, in an upload and a JSON body alike. */
type Labels = Pick<
  components['schemas']['MeasurementUpload'],
  'channel' | 'micPosition' | 'name' | 'notes' | 'tuningId' | 'tuningVersion' | 'stage'
>;

/** Measurements of a stored room: uploads analysed on arrival and stored whole, or not at all. */
export class MeasurementsService {
  private readonly microphones: MicrophonesService;
  constructor(
    private readonly db: Database,
    private readonly work: HeavyWork,
  ) {
    this.microphones = new MicrophonesService(db, work);
  }

  /** A multipart upload (`file` with its form fields) or a JSON measurement. */
  async create(
    caller: Caller,
    roomId: string,
    input:
      | { body: UploadForm; file: UploadedFile }
      | { body: components['schemas']['MeasurementCreate']; file?: undefined },
  ): Promise<MeasurementView> {
    const room = await findRoomFor(caller, this.db.models, roomId);
    requireRoomChannel(room, input.body.channel);
    const body = input.body;
    const microphoneId =
      'microphoneId' in body && typeof body.microphoneId === 'string' ? body.microphoneId : undefined;
    const mic = await this.microphones.resolve(caller, microphoneId, '/microphoneId');
    const content = correctedBy(
      input.file
        ? await contentFromFile(this.work, input.file, input.body, room)
        : contentFromJson(input.body),
      mic,
    );
    const labels: Labels = input.body;
    const loaded = await this.loadedTuning(room.id, labels);
    const row = await this.db.write(async (transaction) => {
      await roomStillThere(this.db.models, room.id, transaction);
      return this.db.models.Measurement.create(
        {
          id: newId('meas'),
          roomId: room.id,
          ownerId: room.ownerId,
          channel: labels.channel,
          micPosition: labels.micPosition ?? '1',
          name: labels.name ?? null,
          notes: labels.notes ?? null,
          ...content,
          ...loaded,
          createdByKeyId: caller.principal.keyId ?? null,
        },
        { transaction },
      );
    });
    return measurementDto(row, true);
  }

  /**
   * Which tuning version was loaded when the measurement was taken: it must be a tuning of this room
   * (422 naming the field otherwise; never another owner's tuning, since it must be in this room).
   */
  private async loadedTuning(roomId: string, labels: Labels) {
    const stage = labels.stage ?? (labels.tuningId ? 'after' : 'before');
    if (!labels.tuningId) {
      if (labels.tuningVersion !== undefined) throw unusable('/body/tuningVersion', 'needs tuningId');
      if (stage === 'after')
        throw unusable('/body/tuningId', 'is required for an after measurement (which tuning was loaded?)');
      return { tuningId: null, tuningVersion: null, stage };
    }
    const tuning = await this.db.models.Tuning.findByPk(labels.tuningId);
    if (!tuning || tuning.roomId !== roomId) {
      throw unusable('/body/tuningId', `is not a tuning of room ${roomId}`);
    }
    const version = labels.tuningVersion ?? tuning.currentVersion;
    if (version > tuning.currentVersion) {
      throw unusable('/body/tuningVersion', `tuning ${tuning.id} has versions 1..${tuning.currentVersion}`);
    }
    return { tuningId: tuning.id, tuningVersion: version, stage };
  }

  async list(
    caller: Caller,
    roomId: string,
    query: PageRequest & { channel?: string; stage?: 'before' | 'after' },
  ): Promise<Page<MeasurementView>> {
    const room = await findRoomFor(caller, this.db.models, roomId);
    const where = {
      roomId: room.id,
      ...(query.channel && { channel: query.channel }),
      ...(query.stage && stageWhere(query.stage)),
    };
    return pageOf(this.db.models.Measurement, where, query, (m) => measurementDto(m, false));
  }

  /** The power average of a channel's responses over its microphone positions. */
  async average(
    caller: Caller,
    roomId: string,
    channel: string,
    kind?: Measurement['kind'],
    stage: 'before' | 'after' = 'before',
  ) {
    const room = await findRoomFor(caller, this.db.models, roomId);
    const rows = await this.db.models.Measurement.findAll({
      where: { roomId: room.id, channel, ...stageWhere(stage) },
      order: [['id', 'ASC']],
    });
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
    return {
      channel,
      measurementIds: withResponse.map((m) => m.id),
      micPositions: [...new Set(withResponse.map((m) => m.micPosition))],
      ...powerAverageResampled(withResponse.map(responseOf)),
    };
  }

  async get(caller: Caller, roomId: string, measurementId: string): Promise<MeasurementView> {
    return measurementDto(await this.find(caller, roomId, measurementId), true);
  }

  async delete(caller: Caller, roomId: string, measurementId: string): Promise<void> {
    const measurement = await this.find(caller, roomId, measurementId);
    await this.db.write((transaction) => measurement.destroy({ transaction }));
  }

  private async find(caller: Caller, roomId: string, measurementId: string): Promise<Measurement> {
    const room = await findRoomFor(caller, this.db.models, roomId);
    const measurement = await this.db.models.Measurement.findOne({
      where: { id: measurementId, roomId: room.id },
    });
    if (!measurement) throw notFound(`No measurement ${measurementId} in room ${room.id}.`);
    return measurement;
  }
}

/**
 * A measurement's content corrected with the microphone it names: an impulse response's analysis (in dB SPL
 * too with an offset, referred to the sweep's level or to 0 dBFS) or a frequency response (its reference is
 * unknown, so no SPL). SPL readings name no microphone.
 */
export function correctedBy(content: MeasurementContent, mic: Microphone | undefined): MeasurementContent {
  const result = content.result;
  // Only an impulse response's analysis has an `arrival`, only a frequency response top-level frequencies.
  if (!mic || !('arrival' in result || 'frequenciesHz' in result)) return content;
  if ('arrival' in result) {
    const played = content.source.sweep?.levelDbfs ?? 0;
    return { ...content, result: withMicrophone(result, mic, played) };
  }
  const { frequencyResponse, warnings, microphone } = withMicrophone(
    { frequencyResponse: result, warnings: [] },
    mic,
    null,
  );
  return {
    ...content,
    result: { ...frequencyResponse, microphone, ...(warnings.length > 0 && { warnings }) },
  };
}

/** Measurements of a stage; rows stored before stages existed count as "before". */
function stageWhere(stage: 'before' | 'after') {
  return stage === 'after' ? { stage: 'after' } : { stage: { [Op.or]: [null, 'before'] } };
}

function unusable(pointer: string, message: string): ProblemError {
  return new ProblemError({
    status: 422,
    title: 'Value cannot be used',
    detail: `${pointer.replace('/body/', '')} ${message}.`,
    type: 'calculation-input',
    errors: [{ pointer, message }],
  });
}

/**
 * The magnitude response a stored measurement carries: an analysis's smoothed response, or the response
 * itself. SPL readings carry none; the average leaves them out before asking.
 */
function responseOf({ result }: Measurement): { frequenciesHz: number[]; magnitudeDb: number[] } {
  if ('arrival' in result) return result.frequencyResponse;
  if ('frequenciesHz' in result) return result;
  throw new Error('an SPL reading has no response to average');
}
