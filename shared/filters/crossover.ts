import { CalculationInputError, requireInRange, requireInteger, withFieldPrefix } from '../errors';
import type { CalculationWarning } from '../notices';
import { DEFAULT_SAMPLE_RATE_HZ } from '../units/sample-rate';
import { responseGrid, type ResponseGridSpec } from '../dsp/grid';
import { cascadeResponse, parallelResponse, type SosResponse } from '../dsp/response';
import type { Sos } from '../dsp/sos';
import { LIMITS } from '../limits';
import { designBiquad, FILTER_LIMITS } from './biquad-design';
import { presentHz } from '../present';

export type CrossoverFamily = 'linkwitzRiley' | 'butterworth';
export type Polarity = 'normal' | 'inverted';

export const LINKWITZ_RILEY_ORDERS = [2, 4, 8] as const;

export interface CrossoverSpec {
  family: CrossoverFamily;
  /** Filter order: 1..8 for Butterworth, 2, 4 or 8 for Linkwitz-Riley (slope = 6·order dB/octave). */
  order: number;
  /** Crossover frequency in hertz, 1 Hz ≤ f < sampleRateHz/2. */
  frequencyHz: number;
}

export interface Crossover extends CrossoverSpec {
  lowPass: { sections: Sos[] };
  highPass: { sections: Sos[] };
  /** Polarity to give the high-pass output so the two outputs sum as flat as the family allows. */
  highPassPolarity: Polarity;
  warnings: CalculationWarning[];
}

export interface CrossoverResponse {
  lowPass: SosResponse;
  highPass: SosResponse;
  /** Complex sum of the low-pass and the high-pass with highPassPolarity applied. */
  sum: SosResponse;
}

/**
 * Q of each second-order section of an order-N Butterworth filter:
 * `Q_k = 1 / (2·sin((2k − 1)π / (2N)))`, k = 1..⌊N/2⌋, in ascending order (odd N adds one
 * first-order section). Same pole placement as scipy.signal.butter.
 */
export function butterworthQs(order: number): number[] {
  const n = requireInteger(
    order,
    { min: LIMITS.order.minimum, max: LIMITS.order.maximum },
    'order',
    '/order',
  );
  return Array.from(
    { length: Math.floor(n / 2) },
    (_, i) => 1 / (2 * Math.sin(((2 * (i + 1) - 1) * Math.PI) / (2 * n))),
  ).sort((a, b) => a - b);
}

/**
 * A Butterworth low- or high-pass of order 1..8 as second-order sections: cookbook sections
 * (bilinear transform, pre-warped at `frequencyHz`) with the Q values of butterworthQs, plus for odd
 * orders a first-order bilinear section (b2 = a2 = 0) with `K = tan(π·f/fs)`:
 * low-pass `(K + K z⁻¹)/((1 + K) + (K − 1) z⁻¹)`, high-pass `(1 − z⁻¹)/((1 + K) + (K − 1) z⁻¹)`.
 * Every order is −3.0103 dB at `frequencyHz`. The first-order section comes first, then sections in
 * ascending Q, which keeps internal gain peaks late in the cascade.
 */
export function butterworthSections(
  kind: 'lowPass' | 'highPass',
  order: number,
  frequencyHz: number,
  sampleRateHz: number,
): Sos[] {
  const fs = sampleRateHz;
  const f = requireCrossoverFrequency(frequencyHz, fs);
  const sections: Sos[] = [];
  if (order % 2 === 1) sections.push(firstOrderSection(kind, f, fs));
  for (const q of butterworthQs(order)) sections.push(designBiquad({ type: kind, frequencyHz: f, q }, fs));
  return sections;
}

/**
 * A Linkwitz-Riley low- or high-pass of order 2, 4 or 8: a Butterworth of half the order, squared
 * (S. H. Linkwitz, JAES 24(1), 1976). LR2 is one Q = 0.5 section (the square of the first-order
 * Butterworth); LR4 two Q = 1/√2 sections; LR8 the two sections of Butterworth 4 (Q 0.5412, 1.3066), each twice.
 * Every order is −6.0206 dB at `frequencyHz`.
 */
export function linkwitzRileySections(
  kind: 'lowPass' | 'highPass',
  order: number,
  frequencyHz: number,
  sampleRateHz: number,
): Sos[] {
  const fs = sampleRateHz;
  const f = requireCrossoverFrequency(frequencyHz, fs);
  if (!(LINKWITZ_RILEY_ORDERS as readonly number[]).includes(order)) {
    throw new CalculationInputError(
      `order must be ${LINKWITZ_RILEY_ORDERS.slice(0, -1).join(', ')} or ${LINKWITZ_RILEY_ORDERS.at(-1)} for a Linkwitz-Riley crossover; received ${order}`,
      '/order',
    );
  }
  if (order === 2) return [designBiquad({ type: kind, frequencyHz: f, q: 0.5 }, fs)];
  return butterworthSections(kind, order / 2, f, fs).flatMap((s) => [s, { ...s }]);
}

/**
 * Designs a two-way crossover. `highPassPolarity` is `inverted` when order ≡ 2 (mod 4) and `normal`
 * otherwise: then `LP + (±)HP` is an all-pass for Linkwitz-Riley (flat magnitude sum, S. H. Linkwitz, JAES 24(1), 1976; scipy.signal butter)
 * and for odd Butterworth orders, while even Butterworth orders sum to +3.01 dB at the crossover
 * frequency instead of a null (warned as `sumNotFlat`).
 * @throws CalculationInputError naming `/family`, `/order` or `/frequencyHz`.
 */
export function designCrossover(spec: CrossoverSpec, sampleRateHz: number): Crossover {
  const fs = sampleRateHz;
  const { family, order, frequencyHz } = spec;
  let design: (kind: 'lowPass' | 'highPass', o: number, f: number, rate: number) => Sos[];
  if (family === 'butterworth') {
    design = butterworthSections;
  } else if (family === 'linkwitzRiley') {
    design = linkwitzRileySections;
  } else {
    throw new CalculationInputError(
      `family must be linkwitzRiley or butterworth; received ${String(family)}`,
      '/family',
    );
  }
  const warnings: CalculationWarning[] = [];
  if (family === 'butterworth' && order % 2 === 0) {
    warnings.push({
      code: 'sumNotFlat',
      message: `An order-${order} Butterworth crossover sums to +3.01 dB at ${presentHz(frequencyHz)} Hz with the returned polarity; a Linkwitz-Riley crossover sums flat.`,
    });
  }
  return {
    family,
    order,
    frequencyHz,
    lowPass: { sections: design('lowPass', order, frequencyHz, fs) },
    highPass: { sections: design('highPass', order, frequencyHz, fs) },
    highPassPolarity: order % 4 === 2 ? 'inverted' : 'normal',
    warnings,
  };
}

/**
 * Responses of both outputs (the high-pass as designed, without its polarity) and of their
 * complex sum with `highPassPolarity` applied.
 */
export function crossoverResponse(
  crossover: Crossover,
  frequenciesHz: number[],
  sampleRateHz: number,
): CrossoverResponse {
  const polarity = crossover.highPassPolarity === 'inverted' ? -1 : 1;
  return {
    lowPass: cascadeResponse(crossover.lowPass.sections, frequenciesHz, sampleRateHz),
    highPass: cascadeResponse(crossover.highPass.sections, frequenciesHz, sampleRateHz),
    sum: parallelResponse(
      [
        { sections: crossover.lowPass.sections, gain: 1 },
        { sections: crossover.highPass.sections, gain: polarity },
      ],
      frequenciesHz,
      sampleRateHz,
    ),
  };
}

function firstOrderSection(kind: 'lowPass' | 'highPass', frequencyHz: number, fs: number): Sos {
  const k = Math.tan((Math.PI * frequencyHz) / fs);
  const a1 = (k - 1) / (k + 1);
  return kind === 'lowPass'
    ? { type: 'lowPass', b0: k / (1 + k), b1: k / (1 + k), b2: 0, a1, a2: 0 }
    : { type: 'highPass', b0: 1 / (1 + k), b1: -1 / (1 + k), b2: 0, a1, a2: 0 };
}

function requireCrossoverFrequency(frequencyHz: number, fs: number): number {
  return requireInRange(
    frequencyHz,
    { min: FILTER_LIMITS.frequencyMinHz, max: fs / 2, exclusiveMax: true, unit: 'Hz' },
    'frequencyHz',
    '/frequencyHz',
  );
}

export interface CrossoverRequest extends CrossoverSpec {
  sampleRateHz?: number;
  response?: ResponseGridSpec;
}

export interface CrossoverPlan extends Crossover {
  sampleRateHz: number;
  response?: CrossoverResponse & { frequenciesHz: number[] };
}

/**
 * designCrossover at `sampleRateHz` (48000 when absent), with the responses of both outputs and of
 * their sum on the requested grid.
 */
export function planCrossover(input: CrossoverRequest): CrossoverPlan {
  const fs = input.sampleRateHz ?? DEFAULT_SAMPLE_RATE_HZ;
  const crossover = designCrossover(
    { family: input.family, order: input.order, frequencyHz: input.frequencyHz },
    fs,
  );
  if (input.response === undefined) return { ...crossover, sampleRateHz: fs };
  const frequenciesHz = withFieldPrefix('/response', () =>
    responseGrid(input.response as ResponseGridSpec, fs),
  );
  return {
    ...crossover,
    sampleRateHz: fs,
    response: { frequenciesHz, ...crossoverResponse(crossover, frequenciesHz, fs) },
  };
}
