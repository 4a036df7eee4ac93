import type { components, operations } from '../../../../../shared/contract/api-types';

type Schemas = components['schemas'];

/** The kinds of stored measurement the API knows. */
export type MeasurementKind = Schemas['Measurement']['kind'];

/** A few numbers per measurement for lists; which ones depends on the kind. */
export type MeasurementSummary = Schemas['Measurement']['summary'];

/** A stored measurement as the API returns it; lists leave out `result`. */
export type Measurement = Schemas['Measurement'];

/** The analysis the API stores for an uploaded impulse response (without the uploaded file's details). */
export type ImpulseResponseAnalysis = Omit<Schemas['ImpulseResponseAnalysis'], 'file'>;

export type DecayTimes = Schemas['DecayTimes'];

/** Decay times in one octave band. */
export type BandDecay = ImpulseResponseAnalysis['decay']['bands'][number];

export type RoomMode = NonNullable<ImpulseResponseAnalysis['room']>['modes'][number];

/** `GET /v1/rooms/{roomId}/measurements/average?channel=`. */
export type AverageResponse =
  operations['averageMeasurements']['responses'][200]['content']['application/json'];

/** The two kinds of stored response a channel's average can be made of. */
export type ResponseKind = NonNullable<operations['averageMeasurements']['parameters']['query']['kind']>;

/** WAV-only fields of a measurement upload the room page offers. */
export type UploadOptions = Pick<
  Schemas['MeasurementUpload'],
  'fileChannel' | 'referenceFileChannel' | 'smoothingOctaves' | 'name' | 'notes'
>;

/** A target point: level in dB at a frequency. */
export type TargetPoint = Schemas['TargetPoint'];

/** `GET /v1/target-curves` item. */
export type StoredTargetCurve = Schemas['StoredTargetCurve'];

/** A fit of one measured response (the room page does not send `positions`). */
export type EqFitRequest = Schemas['EqFitRequest'] & Required<Pick<Schemas['EqFitRequest'], 'measured'>>;

export type EqFitResult = Schemas['EqFitResult'];
