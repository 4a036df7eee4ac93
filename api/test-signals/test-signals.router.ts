import { Router } from 'express';
import { fieldsForOtherKinds, type TestSignal } from '../../shared/capture/test-signal';
import { requirePermission } from '../auth/permissions';
import { badRequest, ProblemError } from '../http/problem';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { whenClientGone } from '../work/heavy-work';

/**
 * POST /v1/test-signals: a sweep, pink noise or a layout's sweep sequence, as WAV or as its description.
 * Generated and written on a worker thread (a file may be 64 MiB); the file comes back without a copy.
 */
export function testSignalsRouter({ work }: Services): Router {
  const router = Router();
  router.post(
    '/test-signals',
    requirePermission('calculate'),
    validate('createTestSignal', async ({ body }, req, res) => {
      const wanted = req.accepts(['audio/wav', 'application/json']);
      if (!wanted) {
        throw new ProblemError({
          status: 406,
          title: 'Not acceptable',
          detail: 'This operation answers audio/wav or application/json.',
        });
      }
      const foreign = fieldsForOtherKinds(body);
      if (foreign.length > 0) {
        throw badRequest(
          `${foreign.join(', ')} do${foreign.length === 1 ? 'es' : ''} not apply to a ${body.kind}.`,
          foreign.map((name) => ({
            pointer: `/body/${name}`,
            message: `does not apply to kind ${body.kind}`,
          })),
        );
      }
      const json = wanted === 'application/json';
      const { signal, wav } = await work.run(
        'testSignal',
        { request: body, wav: !json },
        whenClientGone(res),
      );
      if (json || !wav) return res.json(signal);
      return res
        .type('audio/wav')
        .attachment(fileName(signal))
        .set('Test-Signal-Caution', asciiCaution(signal))
        .send(Buffer.from(wav.buffer, wav.byteOffset, wav.byteLength));
    }),
  );
  return router;
}

function fileName(signal: TestSignal): string {
  const rate = `${signal.sampleRateHz / 1000}k`;
  if (signal.kind === 'pinkNoise') return `isochron-pink-${signal.pinkNoise?.band}-${rate}.wav`;
  const sweep = signal.sweep;
  const what = signal.kind === 'sweep' ? 'sweep' : `sequence-${signal.channelCount}ch`;
  return `isochron-${what}-${sweep?.startHz}-${sweep?.endHz}Hz-${sweep?.durationS}s-${rate}.wav`;
}

/** The cautions as one header value: HTTP header text is Latin-1, so non-ASCII signs are spelled out. */
function asciiCaution(signal: TestSignal): string {
  return signal.cautions
    .map((c) => c.message)
    .join(' ')
    .replace(/−/g, '-')
    .replace(/[–—]/g, '-')
    .replace(/[^\x20-\x7e]/g, '');
}
