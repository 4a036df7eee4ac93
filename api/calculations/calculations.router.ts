import { Router } from 'express';
import { planBassManagement } from '../../shared/bass-management/bass-management';
import { alignDelays } from '../../shared/delay/align-delays';
import { eqBoostCaution } from '../../shared/filters/eq-extremes';
import { planCrossover } from '../../shared/filters/crossover';
import { designFilterSet } from '../../shared/filters/filter-set';
import { analyseGeometry } from '../../shared/geometry';
import { computeLevelTrims } from '../../shared/level/level-trims';
import { DEFAULT_SAMPLE_RATE_HZ } from '../../shared/limits';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { TargetCurvesService } from '../target-curves/target-curves.service';
import { whenClientGone } from '../work/heavy-work';

/**
 * The stateless calculations: each takes the validated body, calls one pure function of `shared/`
 * and answers its result. Any key role may call them; naming a stored target curve needs the tuning role.
 * Plans and EQ fits run on a worker thread (`services.work`); the rest take microseconds and stay on the
 * event loop.
 */
export function calculationsRouter(services: Services): Router {
  const { work } = services;
  const targetCurves = new TargetCurvesService(services.db);
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
    validate('createPlan', async ({ body }, req, res) => {
      const curve = await targetCurves.resolve(callerOf(req), body.targets?.curve, '/targets/curve');
      const input = { ...body, targets: body.targets && { ...body.targets, curve } };
      res.json(await work.run('planRoom', input, whenClientGone(res)));
    }),
  );
  router.post(
    '/geometry',
    calculate,
    validate('computeGeometry', ({ body }, _req, res) => res.json(analyseGeometry(body))),
  );
  router.post(
    '/eq/fit',
    calculate,
    validate('fitEq', async ({ body }, req, res) => {
      const sampleRateHz = body.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ;
      const target = await targetCurves.resolve(callerOf(req), body.target, '/target');
      const result = await work.run('fitEq', { ...body, target, sampleRateHz }, whenClientGone(res));
      const caution = eqBoostCaution([{ filters: result.bands }], sampleRateHz);
      res.json({ sampleRateHz, ...result, cautions: caution ? [caution] : [] });
    }),
  );
  return router;
}
