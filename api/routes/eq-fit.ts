import { Router } from 'express';
import { fitParametricEq, type PeakingBand } from '../../shared/eq-fit/fit-parametric-eq';
import { DEFAULT_SAMPLE_RATE_HZ } from '../../shared/limits';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';

/** POST /v1/eq/fit: parametric bands that bring a measured response toward a target curve. */
export const eqFitRouter = Router();

eqFitRouter.post(
  '/eq/fit',
  requirePermission('calculate'),
  validate('fitEq', ({ body }, _req, res) => {
    const sampleRateHz = body.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ;
    const result = fitParametricEq({ ...body, sampleRateHz });
    res.json({ sampleRateHz, ...result, cautions: boostCautions(result.bands) });
  }),
);

function boostCautions(bands: PeakingBand[]): Array<{ code: string; message: string }> {
  const boosts = bands.filter((b) => b.gainDb > 0);
  if (boosts.length === 0) return [];
  const largest = Math.max(...boosts.map((b) => b.gainDb));
  const lowest = Math.min(...boosts.map((b) => b.frequencyHz));
  return [
    {
      code: 'eqBoost',
      message:
        `This EQ boosts by up to ${largest} dB, down to ${lowest} Hz. Boosts, especially at low frequencies, ` +
        'can overdrive amplifiers and drivers; check headroom and raise the level slowly.',
    },
  ];
}
