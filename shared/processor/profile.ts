import type { FilterType } from '../filters/biquad-design';

/** A step and a range of one processor setting. `step` 0 means the processor takes any value. */
export interface SteppedRange {
  min: number;
  max: number;
  step: number;
}

export type CoefficientName = 'b0' | 'b1' | 'b2' | 'a0' | 'a1' | 'a2';

/**
 * What one kind of speaker processor accepts, in generic terms: its sample rates, how it takes delay,
 * trim and EQ (units, steps, ranges, filter types) and how it wants biquad coefficients written.
 * Stored per owner and chosen per room; the tuning checks and the export use it.
 */
export interface ProcessorProfileSettings {
  /** Sample rates the processor runs at, Hz. */
  sampleRatesHz: number[];
  /** Delay as the processor takes it: in milliseconds or in samples, with its step and range in that unit. */
  delay: SteppedRange & { unit: 'ms' | 'samples' };
  /** Output trim, dB. */
  trimDb: SteppedRange;
  eq: {
    bandsPerChannel: number;
    filterTypes: FilterType[];
    /** Filter frequency range, Hz; `frequencyStep` is in hertz or, for `octave`, a fraction of an octave. */
    frequencyHz: SteppedRange;
    frequencyStepUnit: 'hz' | 'octave';
    gainDb: SteppedRange;
    q: SteppedRange;
  };
  coefficients: {
    /** The order the coefficients are written in; a0 is written only when it is listed (as 1). */
    order: CoefficientName[];
    /** `plus`: the denominator is 1 + a1·z⁻¹ + a2·z⁻² (a1, a2 as designed); `minus`: 1 − a1·z⁻¹ − a2·z⁻² (negated). */
    feedbackSign: 'plus' | 'minus';
    /** `decimal`: rounded to `decimalPlaces`; `float32`: rounded to the nearest IEEE 754 single. */
    numberFormat: 'decimal' | 'float32';
    decimalPlaces?: number;
  };
}

export interface ProcessorProfile extends ProcessorProfileSettings {
  id: string;
  name: string;
}
