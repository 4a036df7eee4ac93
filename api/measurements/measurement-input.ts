import type { components } from '../../shared/contract/api-types';
import {
  parseFrequencyResponseText,
  requireFrequencyResponse,
} from '../../shared/analysis/frequency-response-text';
import { decayPlotsOf, type DecayPlotOptions } from '../../shared/analysis/decay-plots';
import type { PlayedSweep } from '../../shared/capture/sweep-wav';
import { CalculationInputError } from '../../shared/errors';
import { LIMITS } from '../../shared/limits';
import type { MeasurementKind, MeasurementResult, MeasurementSource } from '../db/models/measurement';
import type { Room } from '../db/models/room';
import type { HeavyWork } from '../work/heavy-work';

/** What a measurement row stores, before the row exists. */
export interface MeasurementContent {
  kind: MeasurementKind;
  source: MeasurementSource;
  result: MeasurementResult;
}

/** The fields of a multipart upload, as the contract gives them (the file travels separately). */
export type UploadForm = Omit<components['schemas']['MeasurementUpload'], 'file'>;

/** What an uploaded file holds. */
export type FileKind = 'impulseResponse' | 'sweepRecording' | 'frequencyResponse';

/** The fields that describe the sweep of a `sweepRecording`; they mean nothing for other files. */
const SWEEP_FIELDS = [
  'startHz',
  'endHz',
  'durationS',
  'fadeInS',
  'fadeOutS',
  'levelDbfs',
  'method',
  'offsetS',
  'lengthS',
] as const;

/** The fields that ask for decay plots; a text frequency response has no time axis to plot them on. */
const DECAY_FIELDS = [
  'waterfall',
  'spectrogram',
  'decaySlices',
  'decayBins',
  'decayFromHz',
  'decayToHz',
  'decaySpanMs',
  'waterfallWindowMs',
  'spectrogramWindowMs',
] as const;

/**
 * The decay plots an upload asks for, with the analysis routes' defaults (`shared/limits.ts`) for what it
 * leaves out; undefined when it asks for none.
 */
function decayPlotsOfUpload(form: UploadForm): DecayPlotOptions | undefined {
  return decayPlotsOf({
    waterfall: form.waterfall,
    spectrogram: form.spectrogram,
    decaySlices: form.decaySlices ?? LIMITS.decaySlices.default,
    decayBins: form.decayBins ?? LIMITS.decayBins.default,
    decayFromHz: form.decayFromHz ?? LIMITS.decayFromHz.default,
    decayToHz: form.decayToHz ?? LIMITS.decayToHz.default,
    decaySpanMs: form.decaySpanMs ?? LIMITS.decaySpanMs.default,
    waterfallWindowMs: form.waterfallWindowMs ?? LIMITS.waterfallWindowMs.default,
    spectrogramWindowMs: form.spectrogramWindowMs ?? LIMITS.spectrogramWindowMs.default,
  });
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
  file: UploadedFileLike,
  form: UploadForm,
  room: Room,
): Promise<MeasurementContent> {
  const fileKind =
    form.fileKind ??
    (isWav(file.buffer, file.originalname, file.mimetype) ? 'impulseResponse' : 'frequencyResponse');
  if (fileKind !== 'sweepRecording') {
    // A sweep's parameters on another file are a mistake (fileKind forgotten?), never silently ignored.
    const stray = SWEEP_FIELDS.find((k) => form[k] !== undefined);
    if (stray) {
      throw new CalculationInputError(
        `${stray} describes a sweep; it applies only with fileKind sweepRecording (this file is read as ${fileKind})`,
        `/${stray}`,
      );
    }
  }
  if (fileKind === 'frequencyResponse') {
    // Decay plots need the response over time; a text response has only its spectrum.
    const stray = DECAY_FIELDS.find((k) => form[k] !== undefined);
    if (stray) {
      throw new CalculationInputError(
        `${stray} asks for a decay plot, which needs a WAV impulse response or recorded sweep (this file is read as a text frequency response)`,
        `/${stray}`,
      );
    }
  }
  if (fileKind === 'sweepRecording') return sweepContent(work, file, form, room);
  if (fileKind === 'impulseResponse') {
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
        decayPlots: decayPlotsOfUpload(form),
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

type UploadedFileLike = { buffer: Buffer; originalname: string; mimetype: string; size: number };

const SWEEP_DEFAULT = {
  startHz: LIMITS['SweepRecordingUpload.startHz'].default,
  endHz: LIMITS['SweepRecordingUpload.endHz'].default,
  durationS: LIMITS['SweepRecordingUpload.durationS'].default,
  fadeInS: LIMITS['SweepRecordingUpload.fadeInS'].default,
  fadeOutS: LIMITS['SweepRecordingUpload.fadeOutS'].default,
  levelDbfs: LIMITS['SweepRecordingUpload.levelDbfs'].default,
};

/**
 * A recorded sweep as a measurement: deconvolved and analysed on a worker thread (the analysis of
 * `POST /v1/analysis/sweep`), stored as an impulse-response measurement whose result also carries the
 * distortion and, with a loopback channel, the timing reference plans and verification read.
 */
async function sweepContent(
  work: Pick<HeavyWork, 'run'>,
  file: UploadedFileLike,
  form: UploadForm,
  room: Room,
): Promise<MeasurementContent> {
  if (form.timingReferenceMs !== undefined) {
    throw new CalculationInputError(
      'a sweep recording is timed from its loopback channel (referenceFileChannel), not from a given time',
      '/timingReferenceMs',
    );
  }
  const sweep: PlayedSweep = {
    startHz: form.startHz ?? SWEEP_DEFAULT.startHz,
    endHz: form.endHz ?? SWEEP_DEFAULT.endHz,
    durationS: form.durationS ?? SWEEP_DEFAULT.durationS,
    fadeInS: form.fadeInS ?? SWEEP_DEFAULT.fadeInS,
    fadeOutS: form.fadeOutS ?? SWEEP_DEFAULT.fadeOutS,
    levelDbfs: form.levelDbfs ?? SWEEP_DEFAULT.levelDbfs,
  };
  const method = form.method ?? 'regularizedDivision';
  const offsetS = form.offsetS ?? 0;
  const { file: read, ...analysis } = await work.run(
    'analyseSweepWav',
    {
      bytes: file.buffer,
      channel: form.fileChannel,
      referenceChannel: form.referenceFileChannel,
      offsetS,
      lengthS: form.lengthS,
      sweep,
      method,
      smoothingOctaves: form.smoothingOctaves ?? LIMITS.smoothingOctaves.default,
      room: room.dimensions,
      temperatureC: form.temperatureC ?? 20,
      fields: { channel: '/fileChannel', referenceChannel: '/referenceFileChannel' },
      decayPlots: decayPlotsOfUpload(form),
    },
    undefined,
    [file.buffer],
  );
  const timingReference = analysis.timing && {
    source: 'loopback' as const,
    arrivalMs: analysis.timing.referenceArrivalMs,
    fileChannel: form.referenceFileChannel,
  };
  return {
    kind: 'impulseResponse',
    source: {
      type: 'wav',
      fileKind: 'sweepRecording',
      fileName: file.originalname,
      sizeBytes: file.size,
      ...read,
      sweep: { ...sweep, method, offsetS, ...(form.lengthS !== undefined && { lengthS: form.lengthS }) },
    },
    result: timingReference ? { ...analysis, timingReference } : { ...analysis },
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

/** What a JSON measurement body (the contract's `MeasurementCreate`) measures, without its labels. */
export type JsonMeasurement = components['schemas']['MeasurementCreate'] extends infer Body
  ? Body extends unknown
    ? Omit<Body, 'channel' | 'micPosition' | 'name' | 'notes' | 'stage' | 'tuningId' | 'tuningVersion'>
    : never
  : never;

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
