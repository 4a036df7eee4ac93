import { Router } from 'express';
import { planBassManagement } from '../../shared/bass-management/bass-management';
import { alignDelays } from '../../shared/delay/align-delays';
import { fitParametricEq, type PeakingBand } from '../../shared/eq-fit/fit-parametric-eq';
import { planCrossover } from '../../shared/filters/crossover';
import { eqBoostCaution } from '../../shared/filters/eq-extremes';
import { designFilterSet } from '../../shared/filters/filter-set';
import { analyseGeometry } from '../../shared/geometry';
import { computeLevelTrims } from '../../shared/level/level-trims';
import { DEFAULT_SAMPLE_RATE_HZ } from '../../shared/limits';
import { planRoom } from '../../shared/plan/plan-room';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';

/**
 * The stateless calculations: each takes the validated body, calls one pure function of `shared/`
 * and answers its result. Any key role may call them.
 */
export function calculationsRouter(): Router {
  const router = Router();
  const calculate = requirePermission('calculate');

  router.post(
    '/delays',
    calculate,
    validate('computeDelays', ({ body }, _req, res) => res.json(alignDelays(body))),
  );
  router.post(
    '/levels',
    calculate,
    validate('computeLevels', ({ body }, _req, res) => res.json(computeLevelTrims(body))),
  );
  router.post(
    '/biquads',
    calculate,
    validate('designBiquads', ({ body }, _req, res) => res.json(designFilterSet(body))),
  );
  router.post(
    '/crossovers',
    calculate,
    validate('designCrossover', ({ body }, _req, res) => res.json(planCrossover(body))),
  );
  router.post(
    '/bass-management',
    calculate,
    validate('planBassManagement', ({ body }, _req, res) => res.json(planBassManagement(body))),
  );
  router.post(
    '/plans',
    calculate,
    validate('createPlan', ({ body }, _req, res) => res.json(planRoom(body))),
  );
  router.post(
    '/geometry',
    calculate,
    validate('computeGeometry', ({ body }, _req, res) => res.json(analyseGeometry(body))),
  );
  router.post(
    '/eq/fit',
    calculate,
    validate('fitEq', ({ body }, _req, res) => {
      const sampleRateHz = body.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ;
      const result = fitParametricEq({ ...body, sampleRateHz });
      res.json({ sampleRateHz, ...result, cautions: boostCautions(result.bands, sampleRateHz) });
    }),
  );
  return router;
}

/** The fitted bands' boost caution: the largest boost of the bands together, as designed. */
function boostCautions(bands: PeakingBand[], sampleRateHz: number): Array<{ code: string; message: string }> {
  const caution = eqBoostCaution(bands, sampleRateHz);
  return caution ? [caution] : [];
}
