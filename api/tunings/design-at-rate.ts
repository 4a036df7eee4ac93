import { CalculationInputError } from '../../shared/errors';
import { designTuning, type DesignedTuning, type TuningSettings } from '../../shared/plan';
import { ProblemError } from '../http/problem';

/**
 * designTuning for an export: a stored filter that cannot be built at the requested rate (at or above
 * its Nyquist frequency) is the query's fault, so the 422 names `/query/sampleRateHz` and says which
 * stored filter is in the way.
 */
export function designAtRate(settings: TuningSettings, sampleRateHz: number): DesignedTuning {
  try {
    return designTuning(settings, sampleRateHz);
  } catch (error) {
    if (!(error instanceof CalculationInputError)) throw error;
    throw new ProblemError({
      status: 422,
      title: 'Value cannot be used',
      type: 'calculation-input',
      detail: `The stored filter at ${error.field} cannot be designed at ${sampleRateHz} Hz: ${error.message}`,
      errors: [{ pointer: '/query/sampleRateHz', message: `stored filter ${error.field}: ${error.message}` }],
    });
  }
}
