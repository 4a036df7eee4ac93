import { requireInRange, requireInteger, withFieldPrefix } from '../errors';
import { MAX_EQ_BANDS } from '../limits';
import type { Caution, CalculationWarning } from '../notices';
import { DEFAULT_SAMPLE_RATE_HZ } from '../units/sample-rate';
import { responseGrid, type ResponseGridSpec } from '../dsp/grid';
import { cascadeResponse, type FrequencyResponse } from '../dsp/response';
import type { Sos } from '../dsp/sos';
import { designBiquads, type FilterSpec } from './biquad-design';
import { eqBoostCaution } from './eq-extremes';
import { presentDb } from '../present';

export interface FilterSetInput {
  filters: FilterSpec[];
  sampleRateHz?: number;
  /** Frequencies at which to return the response of the whole cascade. */
  response?: ResponseGridSpec;
  limits?: { eqBandsPerChannel?: number; eqMaxBoostDb?: number; eqMaxCutDb?: number };
}

export interface FilterSet {
  sampleRateHz: number;
  sections: Sos[];
  response?: FrequencyResponse;
  warnings: CalculationWarning[];
  cautions: Caution[];
}

/** Most filters one request may hold. */
export const MAX_FILTERS = MAX_EQ_BANDS;

/**
 * Designs a cascade of cookbook filters (see designBiquad) at `sampleRateHz` (48000 when absent),
 * optionally with the response of the whole cascade (see cascadeResponse). Filters beyond
 * `limits.eqBandsPerChannel`, or boosts and cuts beyond `limits.eqMaxBoostDb` / `eqMaxCutDb`, are
 * still designed but warned, so the caller sees what the processor will refuse. A boost carries a
 * caution with the largest boost of the bands together (eqBoostCaution), not of the largest band.
 * @throws CalculationInputError naming the field (`/filters/2/frequencyHz`, `/response/toHz`, ...).
 */
export function designFilterSet(input: FilterSetInput): FilterSet {
  // The contract has checked the sample rate and the number of filters; the core checks physics only.
  const fs = input.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ;
  const filters = input.filters;
  const sections = designBiquads(filters, fs);
  const response =
    input.response === undefined
      ? undefined
      : withFieldPrefix('/response', (): FrequencyResponse => {
          const frequenciesHz = responseGrid(input.response as ResponseGridSpec, fs);
          return { frequenciesHz, ...cascadeResponse(sections, frequenciesHz, fs) };
        });
  return {
    sampleRateHz: fs,
    sections,
    ...(response ? { response } : {}),
    warnings: limitWarnings(filters, input.limits),
    cautions: boostCautions(filters, fs),
  };
}

function limitWarnings(filters: FilterSpec[], limits: FilterSetInput['limits']): CalculationWarning[] {
  const warnings: CalculationWarning[] = [];
  if (!limits) return warnings;
  const { eqBandsPerChannel, eqMaxBoostDb, eqMaxCutDb } = limits;
  if (eqBandsPerChannel !== undefined) {
    requireInteger(eqBandsPerChannel, { min: 0 }, 'eqBandsPerChannel', '/limits/eqBandsPerChannel');
    if (filters.length > eqBandsPerChannel) {
      warnings.push({
        code: 'bandLimitExceeded',
        message: `${filters.length} filters were designed but the processor has ${eqBandsPerChannel} bands per channel.`,
      });
    }
  }
  const gains = filters.map((f, i) => ({ i, gainDb: f.gainDb ?? 0 }));
  if (eqMaxBoostDb !== undefined) {
    requireInRange(eqMaxBoostDb, { min: 0, unit: 'dB' }, 'eqMaxBoostDb', '/limits/eqMaxBoostDb');
    for (const { i, gainDb } of gains.filter((g) => g.gainDb > eqMaxBoostDb)) {
      warnings.push({
        code: 'boostLimitExceeded',
        message: `Filter ${i} boosts ${presentDb(gainDb)} dB, more than the processor's ${presentDb(eqMaxBoostDb)} dB.`,
      });
    }
  }
  if (eqMaxCutDb !== undefined) {
    requireInRange(eqMaxCutDb, { min: 0, unit: 'dB' }, 'eqMaxCutDb', '/limits/eqMaxCutDb');
    for (const { i, gainDb } of gains.filter((g) => -g.gainDb > eqMaxCutDb)) {
      warnings.push({
        code: 'cutLimitExceeded',
        message: `Filter ${i} cuts ${presentDb(-gainDb)} dB, more than the processor's ${presentDb(eqMaxCutDb)} dB.`,
      });
    }
  }
  return warnings;
}

function boostCautions(filters: FilterSpec[], sampleRateHz: number): Caution[] {
  const caution = eqBoostCaution([{ filters }], sampleRateHz);
  return caution ? [caution] : [];
}
