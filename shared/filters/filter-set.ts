import { requireInRange, requireInteger, withFieldPrefix } from '../errors';
import type { Caution, CalculationWarning } from '../notices';
import { DEFAULT_SAMPLE_RATE_HZ, requireSampleRate } from '../units/sample-rate';
import { responseGrid, type ResponseGridSpec } from '../dsp/grid';
import { cascadeResponse, type FrequencyResponse } from '../dsp/response';
import type { Sos } from '../dsp/sos';
import { designBiquads, type FilterSpec } from './biquad-design';

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
export const MAX_FILTERS = 64;

/**
 * Designs a cascade of cookbook filters (see designBiquad) at `sampleRateHz` (48000 when absent),
 * optionally with the response of the whole cascade (see cascadeResponse). Filters beyond
 * `limits.eqBandsPerChannel`, or boosts and cuts beyond `limits.eqMaxBoostDb` / `eqMaxCutDb`, are
 * still designed but warned, so the caller sees what the processor will refuse. Boosts carry a caution.
 * @throws CalculationInputError naming the field (`/filters/2/frequencyHz`, `/response/toHz`, ...).
 */
export function designFilterSet(input: FilterSetInput): FilterSet {
  const fs = requireSampleRate(input.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ);
  const filters = input.filters;
  requireInteger(filters?.length, { min: 1, max: MAX_FILTERS }, 'the number of filters', '/filters');
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
    cautions: boostCautions(filters),
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
        message: `Filter ${i} boosts ${gainDb} dB, more than the processor's ${eqMaxBoostDb} dB.`,
      });
    }
  }
  if (eqMaxCutDb !== undefined) {
    requireInRange(eqMaxCutDb, { min: 0, unit: 'dB' }, 'eqMaxCutDb', '/limits/eqMaxCutDb');
    for (const { i, gainDb } of gains.filter((g) => -g.gainDb > eqMaxCutDb)) {
      warnings.push({
        code: 'cutLimitExceeded',
        message: `Filter ${i} cuts ${-gainDb} dB, more than the processor's ${eqMaxCutDb} dB.`,
      });
    }
  }
  return warnings;
}

function boostCautions(filters: FilterSpec[]): Caution[] {
  const boosts = filters.filter((f) => (f.gainDb ?? 0) > 0);
  if (boosts.length === 0) return [];
  const lowest = Math.min(...boosts.map((f) => f.frequencyHz));
  return [
    {
      code: 'eqBoost',
      message:
        `This EQ boosts by up to ${Math.max(...boosts.map((f) => f.gainDb ?? 0))} dB` +
        (lowest < 200 ? `, down to ${lowest} Hz` : '') +
        '. Boosts, especially at low frequencies, can overdrive amplifiers and drivers; prefer cuts and check headroom.',
    },
  ];
}
