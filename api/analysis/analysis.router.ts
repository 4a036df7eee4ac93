import { Router } from 'express';
import { analyseSweepWav, playedSweep } from '../../shared/capture/sweep-wav';
import { requirePermission } from '../auth/permissions';
import { badRequest } from '../http/problem';
import { validate, type UploadedFile, type ValidInput } from '../http/validate';
import type { Services } from '../services';
import { whenClientGone, type HeavyWork } from '../work/heavy-work';

/**
 * POST /v1/analysis/impulse-response: arrival, level, smoothed response and decay times of one WAV
 * file. Decoding and analysis run on a worker thread.
 */
export function analysisRouter({ work }: Services): Router {
  const router = Router();
  router.post(
    '/analysis/impulse-response',
    requirePermission('calculate'),
    validate('analyzeImpulseResponse', async ({ body, file }, _req, res) => {
      res.json(await analyseUpload(work, body, file, whenClientGone(res)));
    }),
  );
  // On the main thread for now: a 10 s sweep at 48 kHz takes about 100 ms of CPU (npm run bench).
  router.post(
    '/analysis/sweep',
    requirePermission('calculate'),
    validate('analyzeSweepRecording', ({ body, file }, _req, res) =>
      res.json(analyseSweepUpload(body, file)),
    ),
  );
  return router;
}

interface RoomFields {
  roomWidthM?: number;
  roomLengthM?: number;
  roomHeightM?: number;
}

/** A WAV upload's analysis, with what was read from the file. */
async function analyseUpload(
  work: HeavyWork,
  form: RoomFields & { channel?: number; smoothingOctaves: number; temperatureC: number },
  file: UploadedFile,
  signal: AbortSignal,
) {
  const { analysis, file: read } = await work.run(
    'analyseWav',
    {
      bytes: file.buffer,
      channel: form.channel,
      smoothingOctaves: form.smoothingOctaves,
      room: roomOf(form),
      temperatureC: form.temperatureC,
    },
    signal,
  );
  return { ...analysis, file: { sizeBytes: file.size, ...read } };
}

type SweepForm = ValidInput<'analyzeSweepRecording'>['body'];

/** A recorded sweep's analysis, with what was read from the file. */
export function analyseSweepUpload(form: SweepForm, file: UploadedFile) {
  const { file: read, ...analysis } = analyseSweepWav({
    bytes: file.buffer,
    channel: form.channel,
    referenceChannel: form.referenceChannel,
    offsetS: form.offsetS,
    lengthS: form.lengthS,
    sweep: playedSweep(form),
    method: form.method,
    smoothingOctaves: form.smoothingOctaves,
    room: roomOf(form),
    temperatureC: form.temperatureC,
  });
  return { ...analysis, file: { sizeBytes: file.size, ...read } };
}

/** The room dimensions, all three or none. */
function roomOf(form: RoomFields) {
  const { roomWidthM: widthM, roomLengthM: lengthM, roomHeightM: heightM } = form;
  if (widthM !== undefined && lengthM !== undefined && heightM !== undefined)
    return { widthM, lengthM, heightM };
  const missing = (['roomWidthM', 'roomLengthM', 'roomHeightM'] as const).filter(
    (k) => form[k] === undefined,
  );
  if (missing.length === 3) return undefined;
  throw badRequest(
    'Give all three room dimensions, or none.',
    missing.map((k) => ({ pointer: `/body/${k}`, message: 'is required with the other room dimensions' })),
  );
}
