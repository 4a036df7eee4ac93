import type { components } from '../../../../shared/contract/api-types';

type Schemas = components['schemas'];

/** A stored tuning at one version, as `GET /v1/tunings/{tuningId}` returns it. */
export type Tuning = Schemas['Tuning'];
/** One immutable version, as `GET /v1/tunings/{tuningId}/versions` lists it. */
export type TuningVersion = Schemas['TuningVersion'];
export type TuningComparison = Schemas['TuningComparison'];
export type TuningChannel = Schemas['TuningChannel'];
export type TuningChannelInput = Schemas['TuningChannelInput'];
export type TuningUpdate = Schemas['TuningUpdate'];
export type TuningCreate = Schemas['TuningCreate'];
export type FilterSpec = Schemas['FilterSpec'];
export type FilterType = Schemas['FilterType'];
export type StoredCrossover = Schemas['StoredCrossover'];
export type CrossoverFamily = Schemas['CrossoverFamily'];
export type ProcessorLimits = Schemas['Limits'];

/** One side of a comparison: a tuning and, optionally, one of its versions (default the latest). */
export interface TuningSide {
  tuningId: string;
  version?: number;
}
