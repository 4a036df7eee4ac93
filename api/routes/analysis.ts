import { Router, type ErrorRequestHandler, type RequestHandler } from 'express';
import multer from 'multer';
import { speedOfSoundMps } from '../../shared/acoustics/speed-of-sound';
import { analyzeImpulseResponse } from '../../shared/analysis/analyze-impulse-response';
import { MIN_SMOOTHING_OCTAVES } from '../../shared/analysis/smoothing';
import { decodeWav } from '../../shared/analysis/wav-decode';
import { requirePermission } from '../auth/permissions';
import { badRequest } from '../http/problem';
import { validate } from '../http/validate';
import { audioProblem, multerProblem, validateFormFields, WAV_UPLOAD_LIMITS } from './audio-upload';

/** POST /v1/analysis/impulse-response: arrival, level, smoothed response and decay times of one WAV file. */
export const analysisRouter = Router();

interface AnalysisForm {
  channel?: number;
  smoothingOctaves?: number;
  roomWidthM?: number;
  roomLengthM?: number;
  roomHeightM?: number;
  temperatureC?: number;
}

const upload = multer({ storage: multer.memoryStorage(), limits: WAV_UPLOAD_LIMITS }).single('file');
const receiveFile: RequestHandler = (req, res, next) =>
  upload(req, res, (err: unknown) => next(multerProblem(err)));

analysisRouter.post(
  '/analysis/impulse-response',
  requirePermission('calculate'),
  validate('analyzeImpulseResponse'),
  receiveFile,
  validateFormFields('ImpulseResponseUpload'),
  (req, res) => {
    if (!req.file)
      throw badRequest('Send the WAV file in the multipart field `file`.', [
        { pointer: '/body/file', message: 'is required' },
      ]);
    const form = req.valid.body as AnalysisForm;
    const room = roomOf(form);
    const wav = decodeWav(req.file.buffer, { channel: form.channel });
    const analysis = analyzeImpulseResponse(wav.samples, wav.sampleRateHz, {
      smoothingOctaves: Math.max(MIN_SMOOTHING_OCTAVES, form.smoothingOctaves ?? 1 / 12),
      room,
      speedOfSoundMps: speedOfSoundMps(form.temperatureC ?? 20),
    });
    const { sampleRateHz, channelCount, channelIndex, encoding, durationS } = wav;
    res.json({
      ...analysis,
      warnings: [...wav.warnings, ...analysis.warnings],
      file: { sizeBytes: req.file.size, sampleRateHz, channelCount, channelIndex, encoding, durationS },
    });
  },
);

/** The room dimensions, all three or none. */
function roomOf(form: AnalysisForm) {
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

const toAudioProblem: ErrorRequestHandler = (err, _req, _res, next) => next(audioProblem(err));
analysisRouter.use('/analysis', toAudioProblem);
