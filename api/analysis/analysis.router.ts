import { Router } from 'express';
import { decayPlotsOf, type DecayPlotFields } from '../../shared/analysis/decay-plots';
import { playedSweep } from '../../shared/capture/sweep-wav';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { MicrophonesService, withMicrophone } from '../microphones/microphones.service';
import { badRequest } from '../http/problem';
import { validate, type UploadedFile, type ValidInput } from '../http/validate';
import type { Services } from '../services';
import { whenClientGone, type HeavyWork } from '../work/heavy-work';

/**
 * POST /v1/analysis/impulse-response: arrival, level, smoothed response and decay times of one WAV
 * file; POST /v1/analysis/sweep: a recorded sweep deconvolved and analysed. Decoding and analysis run on
 * a worker thread; the uploaded file's memory moves there rather than being copied.
 */
export function analysisRouter({ work, db }: Services): Router {
  const router = Router();
  const microphones = new MicrophonesService(db, work);
  router.post(
    '/analysis/impulse-response',
    requirePermission('calculate'),
    validate('analyzeImpulseResponse', async ({ body, file }, req, res) => {
      const mic = await microphones.resolve(callerOf(req), body.microphoneId, '/microphoneId');
      res.json(withMicrophone(await analyseUpload(work, body, file, whenClientGone(res)), mic, 0));
    }),
  );
  router.post(
    '/analysis/sweep',
    requirePermission('calculate'),
    validate('analyzeSweepRecording', async ({ body, file }, req, res) => {
      const mic = await microphones.resolve(callerOf(req), body.microphoneId, '/microphoneId');
      res.json(
        withMicrophone(await analyseSweepUpload(work, body, file, whenClientGone(res)), mic, body.levelDbfs),
      );
    }),
  );
  return router;
}

/** The room's dimensions an upload may give for its modes (the same three fields on both analysis routes). */
type RoomFields = Pick<
  ValidInput<'analyzeImpulseResponse'>['body'],
  'roomWidthM' | 'roomLengthM' | 'roomHeightM'
>;

/** A WAV upload's analysis, with what was read from the file. */
async function analyseUpload(
  work: HeavyWork,
  form: RoomFields & DecayPlotFields & { channel?: number; smoothingOctaves: number; temperatureC: number },
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
      decayPlots: decayPlotsOf(form),
    },
    signal,
    [file.buffer],
  );
  return { ...analysis, file: { sizeBytes: file.size, ...read } };
}

type SweepForm = ValidInput<'analyzeSweepRecording'>['body'];

/** A recorded sweep's analysis, with what was read from the file. */
async function analyseSweepUpload(work: HeavyWork, form: SweepForm, file: UploadedFile, signal: AbortSignal) {
  const { file: read, ...analysis } = await work.run(
    'analyseSweepWav',
    {
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
      decayPlots: decayPlotsOf(form),
    },
    signal,
    [file.buffer],
  );
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
