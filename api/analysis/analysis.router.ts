import { Router } from 'express';
import { speedOfSoundMps } from '../../shared/acoustics/speed-of-sound';
import { MIN_SMOOTHING_OCTAVES } from '../../shared/analysis/smoothing';
import { openWav } from '../../shared/analysis/wav-decode';
import { analyzeSweepRecording } from '../../shared/capture/sweep-analysis';
import { CalculationInputError } from '../../shared/errors';
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
  const wav = openWav(file.buffer);
  const { sampleRateHz: fs } = wav;
  const measured = wav.channel(form.channel, '/channel');
  const reference =
    form.referenceChannel === undefined ? undefined : wav.channel(form.referenceChannel, '/referenceChannel');
  const from = Math.round(form.offsetS * fs);
  if (from >= wav.frameCount) {
    throw new CalculationInputError(
      `offsetS must lie inside the file (${wav.durationS.toFixed(3)} s); received ${form.offsetS} s`,
      '/offsetS',
    );
  }
  const to =
    form.lengthS === undefined
      ? wav.frameCount
      : Math.min(wav.frameCount, from + Math.round(form.lengthS * fs));
  const analysis = analyzeSweepRecording(
    measured.samples.subarray(from, to),
    {
      sampleRateHz: fs,
      startHz: form.startHz,
      endHz: form.endHz,
      durationS: form.durationS,
      fadeInS: form.fadeInS,
      fadeOutS: form.fadeOutS,
      levelDbfs: form.levelDbfs,
      silenceAfterS: 0,
    },
    {
      method: form.method,
      reference: reference?.samples.subarray(from, to),
      smoothingOctaves: Math.max(MIN_SMOOTHING_OCTAVES, form.smoothingOctaves),
      room: roomOf(form),
      speedOfSoundMps: speedOfSoundMps(form.temperatureC),
    },
  );
  const { channelCount, encoding, durationS } = wav;
  return {
    ...analysis,
    warnings: [...measured.warnings, ...(reference?.warnings ?? []), ...analysis.warnings],
    file: {
      sizeBytes: file.size,
      sampleRateHz: fs,
      channelCount,
      channelIndex: measured.channelIndex,
      encoding,
      durationS,
    },
  };
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
