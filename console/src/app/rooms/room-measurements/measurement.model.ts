import type { components, operations } from '../../../../../shared/contract/api-types';

type Schemas = components['schemas'];

/** The kinds of stored measurement the API knows. */
export type MeasurementKind = Schemas['Measurement']['kind'];

/** A few numbers per measurement for lists; which ones depends on the kind. */
export type MeasurementSummary = Schemas['Measurement']['summary'];

/** A stored measurement as the API returns it; lists leave out `result`. */
export type Measurement = Schemas['Measurement'];

/**
 * The analysis the API stores for an uploaded impulse response (without the uploaded file's details), with
 * the deconvolution, distortion and loopback timing of a recorded sweep when it was one.
 */
export type ImpulseResponseAnalysis = Schemas['MeasuredImpulseResponse'];

export type DecayTimes = Schemas['DecayTimes'];

/** Decay times in one octave band. */
export type BandDecay = ImpulseResponseAnalysis['decay']['bands'][number];

export type RoomMode = NonNullable<ImpulseResponseAnalysis['room']>['modes'][number];

/**
 * A measurement's impulse-response analysis, or null when it is of another kind or was read from a list
 * (lists leave out `result`). `arrival` is required of an impulse response's result and of no other kind's.
 */
export function impulseResponseOf(m: Measurement | null | undefined): ImpulseResponseAnalysis | null {
  const result = m?.kind === 'impulseResponse' ? m.result : undefined;
  return result && 'arrival' in result ? result : null;
}

/** `GET /v1/rooms/{roomId}/measurements/average?channel=`. */
export type AverageResponse =
  operations['averageMeasurements']['responses'][200]['content']['application/json'];

/** The two kinds of stored response a channel's average can be made of. */
export type ResponseKind = NonNullable<operations['averageMeasurements']['parameters']['query']['kind']>;

/**
 * WAV-only fields of a measurement upload the room page offers, and the multipart fields asking for decay
 * plots as `decayFormFields` writes them (field name and text value, already checked against the contract's
 * bounds by `decayRequestProblems`).
 */
export type UploadOptions = Pick<
  Schemas['MeasurementUpload'],
  'fileChannel' | 'referenceFileChannel' | 'smoothingOctaves' | 'name' | 'notes'
> & { decayFields?: Array<[string, string]> };

/** A target point: level in dB at a frequency. */
export type TargetPoint = Schemas['TargetPoint'];

/** `GET /v1/target-curves` item. */
export type StoredTargetCurve = Schemas['StoredTargetCurve'];

/**
 * A fit of one measured response as the room page sends it: always with the room's rate, the measured
 * response (never `positions`) and a target.
 */
export type EqFitRequest = Schemas['EqFitRequest'] &
  Required<Pick<Schemas['EqFitRequest'], 'sampleRateHz' | 'measured' | 'target'>>;

export type EqFitResult = Schemas['EqFitResult'];
