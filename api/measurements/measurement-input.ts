import {
  parseFrequencyResponseText,
  requireFrequencyResponse,
  type ParsedFrequencyResponse,
} from '../../shared/analysis/frequency-response-text';
import { CalculationInputError } from '../../shared/errors';
import type { MeasurementKind, MeasurementSource } from '../db/models/measurement';
import type { Room } from '../db/models/room';
import type { HeavyWork } from '../work/heavy-work';

/** What a measurement row stores, before the row exists. */
export interface MeasurementContent {
  kind: MeasurementKind;
  source: MeasurementSource;
  result: Record<string, unknown>;
}

export interface UploadForm {
  channel: string;
  micPosition: string;
  fileChannel?: number;
  smoothingOctaves?: number;
  temperatureC?: number;
  name?: string;
  notes?: string;
  referenceFileChannel?: number;
  timingReferenceMs?: number;
}

/** The room must have a loudspeaker with this channel label. */
export function requireRoomChannel(room: Room, channel: string): void {
  const labels = room.loudspeakers.map((l) => l.id);
  if (!labels.includes(channel)) {
    throw new CalculationInputError(
      `channel ${channel} is not a loudspeaker of room ${room.id}; it has ${labels.join(', ')}`,
      '/channel',
    );
  }
}

const isWav = (bytes: Buffer, fileName: string, mimeType: string): boolean =>
  /\.wav$/i.test(fileName) ||
  /^audio\//i.test(mimeType) ||
  (['RIFF', 'RIFX', 'RF64'].includes(bytes.subarray(0, 4).toString('latin1')) &&
    bytes.subarray(8, 12).toString('latin1') === 'WAVE');

/**
 * An uploaded file as a measurement: a WAV impulse response is analysed in the room (its dimensions give
 * the modes, on a worker thread); anything else must be a text frequency response.
 */
export async function contentFromFile(
  work: Pick<HeavyWork, 'run'>,
  file: { buffer: Buffer; originalname: string; mimetype: string; size: number },
  form: UploadForm,
  room: Room,
): Promise<MeasurementContent> {
  if (isWav(file.buffer, file.originalname, file.mimetype)) {
    const given = timingReferenceGiven(form);
    // The file's memory moves to the worker thread (decoding and analysis happen there); the loopback
    // channel, when named, is decoded and its arrival detected there too.
    const {
      analysis,
      file: read,
      timingReferenceMs,
    } = await work.run(
      'analyseWav',
      {
        bytes: file.buffer,
        channel: form.fileChannel,
        channelField: '/fileChannel',
        referenceChannel: form.referenceFileChannel,
        referenceChannelField: '/referenceFileChannel',
        smoothingOctaves: form.smoothingOctaves ?? 1 / 12,
        room: room.dimensions,
        temperatureC: form.temperatureC ?? 20,
      },
      undefined,
      [file.buffer],
    );
    const timingReference =
      timingReferenceMs === undefined
        ? given
        : {
            source: 'loopback' as const,
            arrivalMs: timingReferenceMs,
            fileChannel: form.referenceFileChannel,
          };
    return {
      kind: 'impulseResponse',
      source: { type: 'wav', fileName: file.originalname, sizeBytes: file.size, ...read },
      result: timingReference ? { ...analysis, timingReference } : analysis,
    };
  }
  if (file.buffer.includes(0)) {
    throw new CalculationInputError(
      'The file is neither a WAV impulse response nor a text frequency response (it holds binary data).',
      '/file',
    );
  }
  const response = parseFrequencyResponseText(file.buffer.toString('utf8'), '/file');
  return {
    kind: 'frequencyResponse',
    source: { type: 'text', fileName: file.originalname, sizeBytes: file.size },
    result: { ...response },
  };
}

/**
 * The timing reference of an impulse-response capture: the arrival in the loopback channel of the same file
 * (detected on the worker thread as the loudspeaker's arrival is), or the figure the capture tool gave.
 * Plans use arrivals relative to it, so interface and converter latency cancel between captures. Checks
 * the two fields before any decoding, and answers the given figure.
 */
function timingReferenceGiven(form: UploadForm): { source: 'given'; arrivalMs: number } | null {
  if (form.referenceFileChannel !== undefined && form.timingReferenceMs !== undefined) {
    throw new CalculationInputError(
      'give the timing reference either as a file channel or as a time, not both',
      '/timingReferenceMs',
    );
  }
  if (form.referenceFileChannel !== undefined && form.referenceFileChannel === (form.fileChannel ?? 0)) {
    throw new CalculationInputError(
      'the timing reference must be another channel of the file than the loudspeaker',
      '/referenceFileChannel',
    );
  }
  return form.timingReferenceMs === undefined ? null : { source: 'given', arrivalMs: form.timingReferenceMs };
}

export type JsonMeasurement =
  | { kind: 'frequencyResponse'; response?: ParsedFrequencyResponse; text?: string }
  | { kind: 'spl'; splDb: number; weighting?: 'A' | 'C' | 'Z'; timeWeighting?: 'slow' | 'fast' };

/** A JSON measurement body as stored content. */
export function contentFromJson(body: JsonMeasurement): MeasurementContent {
  if (body.kind === 'spl') {
    return {
      kind: 'spl',
      source: { type: 'json' },
      result: {
        splDb: body.splDb,
        weighting: body.weighting ?? 'C',
        timeWeighting: body.timeWeighting ?? 'slow',
      },
    };
  }
  if ((body.response === undefined) === (body.text === undefined)) {
    throw new CalculationInputError(
      'give the response either as arrays (response) or as text (text), not both',
      '/response',
    );
  }
  const response = body.response
    ? requireFrequencyResponse(body.response)
    : parseFrequencyResponseText(body.text ?? '', '/text');
  return {
    kind: 'frequencyResponse',
    source: { type: body.text ? 'text' : 'json' },
    result: { ...response },
  };
}
