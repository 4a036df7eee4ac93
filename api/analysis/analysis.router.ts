import { Router } from 'express';
import { speedOfSoundMps } from '../../shared/acoustics/speed-of-sound';
import { analyzeImpulseResponse } from '../../shared/analysis/analyze-impulse-response';
import { MIN_SMOOTHING_OCTAVES } from '../../shared/analysis/smoothing';
import { decodeWav } from '../../shared/analysis/wav-decode';
import { requirePermission } from '../auth/permissions';
import { badRequest } from '../http/problem';
import { validate, type UploadedFile } from '../http/validate';

/** POST /v1/analysis/impulse-response: arrival, level, smoothed response and decay times of one WAV file. */
export function analysisRouter(): Router {
  const router = Router();
  router.post(
    '/analysis/impulse-response',
    requirePermission('calculate'),
    validate('analyzeImpulseResponse', ({ body, file }, _req, res) => res.json(analyseUpload(body, file))),
  );
  return router;
}

interface RoomFields {
  roomWidthM?: number;
  roomLengthM?: number;
  roomHeightM?: number;
}

/** A WAV upload's analysis, with what was read from the file. */
function analyseUpload(
  form: RoomFields & { channel?: number; smoothingOctaves: number; temperatureC: number },
  file: UploadedFile,
) {
  const wav = decodeWav(file.buffer, { channel: form.channel });
  const analysis = analyzeImpulseResponse(wav.samples, wav.sampleRateHz, {
    smoothingOctaves: Math.max(MIN_SMOOTHING_OCTAVES, form.smoothingOctaves),
    room: roomOf(form),
    speedOfSoundMps: speedOfSoundMps(form.temperatureC),
  });
  const { sampleRateHz, channelCount, channelIndex, encoding, durationS } = wav;
  return {
    ...analysis,
    warnings: [...wav.warnings, ...analysis.warnings],
    file: { sizeBytes: file.size, sampleRateHz, channelCount, channelIndex, encoding, durationS },
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
