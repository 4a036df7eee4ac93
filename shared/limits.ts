/**
 * Every bound and default of the contract, written once, for the calculation core, the API and the
 * console alike. Keys name where a bound sits in `openapi/`: a property or parameter name
 * (`temperatureC`), or `Schema.property` where one name has different bounds in different places;
 * `name[]` bounds each item of an array, `Schema|type` one alternative of a `oneOf`. Values use JSON
 * Schema's keyword names. `tests/contract/limits.test.ts` checks that every bound in the contract
 * equals its entry here and that no entry is left over, so changing a limit means changing it here
 * and in the contract together.
 */
export interface Bound {
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
  minLength?: number;
  maxLength?: number;
  default?: number | string | boolean;
}

/** Lowest and highest processor sample rates the calculations accept, in hertz. */
export const SAMPLE_RATE_MIN_HZ = 8000;
export const SAMPLE_RATE_MAX_HZ = 384000;
const SAMPLE_RATE_RANGE_HZ = { minimum: SAMPLE_RATE_MIN_HZ, maximum: SAMPLE_RATE_MAX_HZ };
/** The sample rate used when a request gives none (the common rate of studio processors). */
export const DEFAULT_SAMPLE_RATE_HZ = 48000;
/*
 * Work budgets. Each bound below sizes what a request may ask the service to compute, from what real
 * rooms and processors need, so that one request inside the contract stays a bounded amount of work
 * (the heavy ones also run on a worker thread and weigh more against the rate limit: api/work/).
 */
/**
 * Most channels (loudspeaker feeds) one request, room or tuning may carry. The largest ITU-R BS.2051-3
 * layout, system H (9+10+3, "22.2"), has 24 channels; large immersive and cinema rooms drive up to 64
 * loudspeaker outputs (common practice, from memory). 64 takes both with room to spare.
 */
export const MAX_CHANNELS = 64;
/**
 * Most EQ sections per channel: per `/v1/biquads` request, per stored channel, per fit
 * (`/v1/eq/fit` `maxBands`, a plan's `eqBandsPerChannel`). Loudspeaker processors commonly offer 8 to 16
 * parametric bands per output (common practice, from memory). The fit's time grows with the band count
 * (each band is one more search over the grid), so this is also its budget.
 */
export const MAX_EQ_BANDS = 16;
/** Highest frequency a filter or a response point may name, in hertz (Nyquist of 384 kHz). */
export const MAX_FREQUENCY_HZ = 192000;
/** A room's width, length and height in the geometry and the stored rooms, metres. */
const ROOM_EXTENT_M = { maximum: 100, exclusiveMinimum: 0 };
/** Inside dimensions of a room whose modes are computed, metres. */
const ROOM_SIDE_RANGE_M = { minimum: 0.5, maximum: 200 };
/** Air temperature range, °C. */
const TEMPERATURE_RANGE_C = { minimum: -40, maximum: 60 };
/**
 * Most points of a measured response to fit (`/v1/eq/fit`, a plan channel's `measuredResponse`). The fit
 * works on a 1/48-octave grid, which from 20 Hz to 20 kHz has 48 · log2(1000) + 1 = 480 points; finer
 * input is resampled to it and adds nothing. 1024 takes a 1/96-octave export or a wider range (10 Hz to
 * 24 kHz at 1/48 octave is 540 points); longer exports (FFT bins) are thinned on a log scale first.
 */
export const MAX_FIT_POINTS = 1024;
/**
 * Most channels of one plan with a `measuredResponse` to fit EQ to: every channel of the largest
 * ITU-R BS.2051-3 layout (system H, 24 channels). Each fit costs about as much as one `/v1/eq/fit`
 * request, so this bounds a plan's work; a larger room is planned in parts. Not a schema bound (the
 * contract cannot count items with a property), so the plan checks it (`shared/plan/plan-budget.ts`).
 */
export const MAX_PLAN_FITS = 24;
/** Most points of a stored frequency-response measurement. */
export const MAX_MEASURED_POINTS = 100000;
/** Most frequencies of a response grid a calculation evaluates. */
export const MAX_RESPONSE_POINTS = 4096;
/** Longest name of a room, tuning, key, measurement or user. */
export const NAME_MAX_LENGTH = 120;
/** Most measurement ids a room plan may include or exclude by name. */
export const MAX_PLAN_MEASUREMENT_IDS = 1000;
/** Most rows of a microphone calibration (real ones have tens to a few hundred, from memory). */
export const MAX_CALIBRATION_POINTS = 4096;
/** Largest calibration deviation accepted, dB either way: a measurement microphone's stays within a few dB (from memory). */
export const MAX_CALIBRATION_DB = 40;
/** Longest channel label or microphone position. */
export const LABEL_MAX_LENGTH = 32;

export const LIMITS = {
  'acceptInvitation.password': { minLength: 12, maxLength: 256 },
  'AboveTransition.maxBands': { minimum: 0, maximum: 4, default: 2 },
  'AboveTransition.maxBoostDb': { minimum: 0, maximum: 24, default: 2 },
  'AboveTransition.maxCutDb': { minimum: 0, maximum: 48, default: 3 },
  'AboveTransition.qMax': { minimum: 0.3, maximum: 2, default: 1 },
  'AboveTransition.toHz': { minimum: 1, maximum: MAX_FREQUENCY_HZ },
  AngleRange: { minItems: 2, maxItems: 2 },
  angleToleranceDeg: { minimum: 0, maximum: 15, default: 2 },
  arrivalMs: { minimum: 0, maximum: 1000 },
  bandwidthOctaves: { minimum: 0.01, maximum: 8 },
  'BandSteps.frequencyHz': { minimum: 0, maximum: 1000 },
  'BandSteps.gainDb': { minimum: 0, maximum: 6 },
  'BandSteps.q': { minimum: 0, maximum: 10 },
  'BassManagementRequest.lfeGainDb': { minimum: -40, maximum: 20, default: 10 },
  ChannelLabel: { minLength: 1, maxLength: LABEL_MAX_LENGTH },
  channels: { minItems: 1, maxItems: MAX_CHANNELS },
  cornerHz: { minimum: 10, maximum: 2000 },
  count: { minimum: 0 },
  crossoverHz: { minimum: 1, maximum: MAX_FREQUENCY_HZ, default: 80 },
  crossoverOrder: { minimum: 1, maximum: 8, default: 4 },
  dbPerOctave: { minimum: -6, maximum: 6 },
  delayMaxMs: { minimum: 0, maximum: 10000 },
  delayMs: { minimum: 0, maximum: 1000 },
  delaySamples: { minimum: 0 },
  'DelaysRequest.temperatureC': { ...TEMPERATURE_RANGE_C },
  'Distance|number': { maximum: 1000, exclusiveMinimum: 0 },
  'Distance|string': { minLength: 1, maxLength: 40 },
  'duplicateTuning.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  eq: { maxItems: MAX_EQ_BANDS },
  eqBandsPerChannel: { minimum: 0, maximum: MAX_EQ_BANDS },
  'EqFitRequest.filterTypes': { maxItems: 8 },
  'EqFitRequest.fromHz': { minimum: 1, maximum: MAX_FREQUENCY_HZ },
  'EqFitRequest.positions': { minItems: 1, maxItems: 16 },
  'EqFitRequest.toHz': { minimum: 1, maximum: MAX_FREQUENCY_HZ },
  'EqFitPosition.label': { minLength: 1, maxLength: LABEL_MAX_LENGTH },
  eqMaxCutDb: { minimum: 0, maximum: 48 },
  eqToHz: { minimum: 1, maximum: MAX_FREQUENCY_HZ },
  errorCount: { minimum: 0 },
  fileChannel: { minimum: 0, maximum: 127 },
  filters: { minItems: 1, maxItems: MAX_EQ_BANDS },
  'FilterSpec.gainDb': { minimum: -48, maximum: 24 },
  frequencyHz: { minimum: 1, maximum: MAX_FREQUENCY_HZ },
  frequencyMaxHz: { minimum: 1, maximum: MAX_FREQUENCY_HZ },
  frequencyMinHz: { minimum: 1, maximum: MAX_FREQUENCY_HZ },
  headroomDb: { minimum: 0, maximum: 100 },
  headroomWarningDb: { minimum: 0, maximum: 60, default: 12 },
  heightM: { ...ROOM_EXTENT_M },
  'ImpulseResponseUpload.channel': { minimum: 0, maximum: 127 },
  'ImpulseResponseUpload.temperatureC': { ...TEMPERATURE_RANGE_C, default: 20 },
  'inviteUser.email': { maxLength: 254 },
  'inviteUser.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  KeyName: { minLength: 1, maxLength: NAME_MAX_LENGTH },
  KeyRateLimit: { minimum: 1, maximum: 1000000 },
  layout: { minLength: 1, maxLength: LABEL_MAX_LENGTH },
  leftVersion: { minimum: 1 },
  lengthM: { ...ROOM_EXTENT_M },
  levelAt1mDb: { minimum: -150, maximum: 150 },
  limit: { minimum: 1, maximum: 100, default: 20 },
  'Limits.eqMaxBoostDb': { minimum: 0, maximum: 24 },
  'magnitudeDb[]': { minimum: -300, maximum: 300 },
  'MagnitudeResponse.frequenciesHz': { minItems: 2, maxItems: MAX_FIT_POINTS },
  'MagnitudeResponse.frequenciesHz[]': { maximum: MAX_FREQUENCY_HZ, exclusiveMinimum: 0 },
  'MagnitudeResponse.magnitudeDb': { minItems: 2, maxItems: MAX_FIT_POINTS },
  max: { minimum: 0.025, maximum: 100 },
  maxBands: { minimum: 0, maximum: MAX_EQ_BANDS },
  maxBoostDb: { minimum: 0, maximum: 24, default: 0 },
  maxCutDb: { minimum: 0, maximum: 48, default: 12 },
  measuredDb: { minimum: -150, maximum: 150 },
  'MeasurementCreate|object.frequenciesHz': { minItems: 2, maxItems: MAX_MEASURED_POINTS },
  'MeasurementCreate|object.magnitudeDb': { minItems: 2, maxItems: MAX_MEASURED_POINTS },
  'MeasurementCreate|object.micPosition': { minLength: 1, maxLength: LABEL_MAX_LENGTH },
  'MeasurementCreate|object.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'MeasurementCreate|object.notes': { maxLength: 2000 },
  'MeasurementUpload.channel': { minLength: 1, maxLength: LABEL_MAX_LENGTH },
  'MeasurementUpload.micPosition': { minLength: 1, maxLength: LABEL_MAX_LENGTH, default: '1' },
  'MeasurementUpload.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'MeasurementUpload.notes': { maxLength: 2000 },
  'MeasurementUpload.temperatureC': { ...TEMPERATURE_RANGE_C, default: 20 },
  'MeasurementUpload.startHz': { minimum: 1, maximum: 20000 },
  // Decay plots: at most 128 × 256 values (about 0.3 MB of JSON) per plot.
  decaySlices: { minimum: 2, maximum: 128, default: 32 },
  decayBins: { minimum: 16, maximum: 256, default: 96 },
  decayFromHz: { minimum: 1, maximum: 96000, default: 20 },
  decayToHz: { minimum: 10, maximum: 96000, default: 20000 },
  decaySpanMs: { minimum: 1, maximum: 2000, default: 300 },
  waterfallWindowMs: { minimum: 2, maximum: 3000, default: 500 },
  spectrogramWindowMs: { minimum: 1, maximum: 1000, default: 50 },
  // The same plots on a stored measurement: no defaults in the contract, so a decay field sent with a
  // text response (which has no time axis) can be told from one left out; the defaults above apply.
  'MeasurementUpload.decaySlices': { minimum: 2, maximum: 128 },
  'MeasurementUpload.decayBins': { minimum: 16, maximum: 256 },
  'MeasurementUpload.decayFromHz': { minimum: 1, maximum: 96000 },
  'MeasurementUpload.decayToHz': { minimum: 10, maximum: 96000 },
  'MeasurementUpload.decaySpanMs': { minimum: 1, maximum: 2000 },
  'MeasurementUpload.waterfallWindowMs': { minimum: 2, maximum: 3000 },
  'MeasurementUpload.spectrogramWindowMs': { minimum: 1, maximum: 1000 },
  'MicrophoneCreate.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'MicrophoneCreate.serial': { minLength: 1, maxLength: 64 },
  'MicrophoneCreate.notes': { maxLength: 4000 },
  'MicrophoneCreate.calibrationText': { minLength: 1, maxLength: 262144 },
  'MicrophoneCreate.calibrationFileName': { minLength: 1, maxLength: 255 },
  'MicrophoneUpdate.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'MicrophoneUpdate.serial': { minLength: 1, maxLength: 64 },
  'MicrophoneUpdate.notes': { maxLength: 4000 },
  'MicrophoneUpdate.calibrationText': { minLength: 1, maxLength: 262144 },
  'MicrophoneUpdate.calibrationFileName': { minLength: 1, maxLength: 255 },
  mvPerPa: { minimum: 0.01, maximum: 10000 },
  dbfsAt94DbSpl: { minimum: -160, maximum: 0 },
  'CalibratorUpload.channel': { minimum: 0, maximum: 127 },
  'CalibratorUpload.inputGain': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'MeasurementUpload.endHz': { minimum: 10, maximum: 96000 },
  'MeasurementUpload.durationS': { minimum: 0.1, maximum: 60 },
  'MeasurementUpload.fadeInS': { minimum: 0, maximum: 5 },
  'MeasurementUpload.fadeOutS': { minimum: 0, maximum: 5 },
  'MeasurementUpload.levelDbfs': { minimum: -80, maximum: 0 },
  'MeasurementUpload.offsetS': { minimum: 0, maximum: 30 },
  'MeasurementUpload.lengthS': { minimum: 0.1, maximum: 30 },
  referenceFileChannel: { minimum: 0, maximum: 127 },
  timingReferenceMs: { minimum: 0, maximum: 1000 },
  MeasuredTuningVersion: { minimum: 1 },
  min: { minimum: 0.025, maximum: 100 },
  minGainDb: { minimum: 0, maximum: 6, default: 0.5 },
  'name|string': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  order: { minimum: 1, maximum: 8 },
  phaseDeg: { minItems: 2, maxItems: MAX_MEASURED_POINTS },
  pivotHz: { minimum: 10, maximum: 20000 },
  'ProcessorProfileSettings.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'ProcessorProfileSettings.sampleRatesHz': { minItems: 1, maxItems: 16 },
  'ProcessorProfileSettings.sampleRatesHz[]': { ...SAMPLE_RATE_RANGE_HZ },
  'ProfileCoefficients.decimalPlaces': { minimum: 1, maximum: 17 },
  'ProfileCoefficients.order': { minItems: 5, maxItems: 6 },
  'ProfileDelay.max': { minimum: 0, maximum: 1000000 },
  'ProfileDelay.min': { minimum: 0, maximum: 1000000 },
  'ProfileDelay.step': { minimum: 0, maximum: 1000 },
  'ProfileEq.bandsPerChannel': { minimum: 0, maximum: MAX_EQ_BANDS },
  'ProfileEq.filterTypes': { minItems: 1, maxItems: 8 },
  'ProfileFrequency.max': { minimum: 1, maximum: MAX_FREQUENCY_HZ },
  'ProfileFrequency.min': { minimum: 1, maximum: MAX_FREQUENCY_HZ },
  'ProfileFrequency.step': { minimum: 0, maximum: 1000 },
  'ProfileGain.max': { minimum: 0, maximum: 24 },
  'ProfileGain.min': { minimum: -48, maximum: 0 },
  'ProfileGain.step': { minimum: 0, maximum: 10 },
  'ProfileQ.max': { minimum: 0.025, maximum: 100 },
  'ProfileQ.min': { minimum: 0.025, maximum: 100 },
  'ProfileQ.step': { minimum: 0, maximum: 10 },
  'ProfileTrim.max': { minimum: 0, maximum: 40 },
  'ProfileTrim.min': { minimum: -100, maximum: 0 },
  'ProfileTrim.step': { minimum: 0, maximum: 10 },
  'PlanRequest.temperatureC': { ...TEMPERATURE_RANGE_C },
  'PlanTargets.eqMaxBoostDb': { minimum: 0, maximum: 24, default: 0 },
  'PlanTargets.lfeGainDb': { minimum: -40, maximum: 20, default: 10 },
  pointsPerOctave: { minimum: 1, maximum: 96 },
  q: { minimum: 0.025, maximum: 100 },
  referenceDb: { minimum: -150, maximum: 150 },
  removeChannels: { maxItems: MAX_CHANNELS },
  'removeChannels[]': { maxLength: 32 },
  'ResponseGrid|object.frequenciesHz': { minItems: 1, maxItems: MAX_RESPONSE_POINTS },
  'ResponseGrid|object.frequenciesHz[]': { exclusiveMinimum: 0 },
  'ResponseGrid|object.fromHz': { exclusiveMinimum: 0 },
  'ResponseGrid|object.toHz': { exclusiveMinimum: 0 },
  reverberationTimeS: { minimum: 0.05, maximum: 20 },
  rightVersion: { minimum: 1 },
  engineer: { minLength: 1, maxLength: NAME_MAX_LENGTH },
  microphone: { minLength: 1, maxLength: NAME_MAX_LENGTH },
  referenceLevelDb: { minimum: 0, maximum: 150 },
  positions: { minItems: 1, maxItems: 64 },
  'positions[]': { minLength: 1, maxLength: LABEL_MAX_LENGTH },
  'SignOffRequest.notes': { maxLength: 4000 },
  micPosition: { minLength: 1, maxLength: LABEL_MAX_LENGTH },
  arrivalToleranceMs: { exclusiveMinimum: 0, maximum: 10 },
  levelToleranceDb: { exclusiveMinimum: 0, maximum: 20 },
  responseRmsToleranceDb: { exclusiveMinimum: 0, maximum: 40 },
  responseMaxToleranceDb: { exclusiveMinimum: 0, maximum: 40 },
  crossoverDipToleranceDb: { exclusiveMinimum: 0, maximum: 40 },
  'RoomPlanRequest.temperatureC': { ...TEMPERATURE_RANGE_C },
  'RoomPlanRequest.bassManaged': { maxItems: MAX_CHANNELS },
  'RoomPlanRequest.include': { maxItems: MAX_PLAN_MEASUREMENT_IDS },
  'RoomPlanRequest.exclude': { maxItems: MAX_PLAN_MEASUREMENT_IDS },
  'RoomPlanRequest.micPosition': { minLength: 1, maxLength: LABEL_MAX_LENGTH },
  'RoomPlanRequest.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'RoomPlanRequest.notes': { maxLength: 4000 },
  'RoomCreate.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'RoomCreate.notes': { maxLength: 4000 },
  roomHeightM: { ...ROOM_SIDE_RANGE_M },
  roomLengthM: { ...ROOM_SIDE_RANGE_M },
  'RoomLoudspeaker.name': { maxLength: NAME_MAX_LENGTH },
  RoomLoudspeakers: { minItems: 1, maxItems: MAX_CHANNELS },
  'RoomUpdate.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'RoomUpdate.notes': { maxLength: 4000 },
  roomWidthM: { ...ROOM_SIDE_RANGE_M },
  route: { minLength: 1, maxLength: NAME_MAX_LENGTH },
  sampleRateHz: { ...SAMPLE_RATE_RANGE_HZ },
  SampleRateHz: { ...SAMPLE_RATE_RANGE_HZ, default: DEFAULT_SAMPLE_RATE_HZ },
  shelfSlope: { minimum: 0.01, maximum: 1 },
  'signIn.email': { minLength: 1, maxLength: 254 },
  'signIn.password': { minLength: 1, maxLength: 1024 },
  smoothingOctaves: { minimum: 0.0208, maximum: 1, default: 1 / 12 },
  speakers: { minItems: 1, maxItems: MAX_CHANNELS },
  speedOfSoundMps: { minimum: 300, maximum: 400 },
  splDb: { minimum: 0, maximum: 150 },
  subwooferCount: { minimum: 1, maximum: 16, default: 1 },
  'TargetCurve|object.gainDb': { minimum: -20, maximum: 20 },
  'TargetCurve|object.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  TargetPoints: { minItems: 2, maxItems: 256 },
  'TargetPoint.gainDb': { minimum: -40, maximum: 40 },
  'TargetCurveCreate.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'TargetCurveCreate.notes': { maxLength: 4000 },
  'TargetCurveUpdate.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'TargetCurveUpdate.notes': { maxLength: 4000 },
  targetDb: { minimum: -150, maximum: 150 },
  targetOffsetDb: { minimum: -40, maximum: 40 },
  'SweepRecordingUpload.channel': { minimum: 0, maximum: 127 },
  'SweepRecordingUpload.durationS': { minimum: 0.1, maximum: 60, default: 10 },
  'SweepRecordingUpload.endHz': { minimum: 10, maximum: 96000, default: 20000 },
  'SweepRecordingUpload.fadeInS': { minimum: 0, maximum: 5, default: 0.05 },
  'SweepRecordingUpload.fadeOutS': { minimum: 0, maximum: 5, default: 0.01 },
  'SweepRecordingUpload.lengthS': { minimum: 0.1, maximum: 30 },
  'SweepRecordingUpload.levelDbfs': { minimum: -80, maximum: 0, default: -12 },
  'SweepRecordingUpload.offsetS': { minimum: 0, maximum: 30, default: 0 },
  'SweepRecordingUpload.referenceChannel': { minimum: 0, maximum: 127 },
  'SweepRecordingUpload.startHz': { minimum: 1, maximum: 20000, default: 20 },
  'SweepRecordingUpload.temperatureC': { ...TEMPERATURE_RANGE_C, default: 20 },
  'TestSignalRequest.durationS': { minimum: 0.1, maximum: 60, default: 10 },
  'TestSignalRequest.endHz': { minimum: 10, maximum: 96000 },
  'TestSignalRequest.fadeInS': { minimum: 0, maximum: 5 },
  'TestSignalRequest.fadeOutS': { minimum: 0, maximum: 5 },
  'TestSignalRequest.gapS': { minimum: 0.5, maximum: 30 },
  'TestSignalRequest.levelDbfs': { minimum: -80, maximum: 0 },
  'TestSignalRequest.sampleRateHz': { minimum: 44100, maximum: 192000, default: DEFAULT_SAMPLE_RATE_HZ },
  'TestSignalRequest.seed': { minimum: 0, maximum: 2147483647 },
  'TestSignalRequest.silenceAfterS': { minimum: 0, maximum: 30 },
  'TestSignalRequest.startHz': { minimum: 1, maximum: 20000 },
  text: { minLength: 1, maxLength: 1000000 },
  token: { minLength: 1, maxLength: 128 },
  trimDb: { minimum: -60, maximum: 24 },
  trimMaxDb: { minimum: 0, maximum: 40 },
  trimMinDb: { minimum: -100, maximum: 0 },
  'TuningChannelInput.name': { maxLength: NAME_MAX_LENGTH },
  TuningChannelInputs: { maxItems: MAX_CHANNELS },
  'TuningCreate.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'TuningCreate.notes': { maxLength: 4000 },
  'TuningCreate.temperatureC': { ...TEMPERATURE_RANGE_C },
  'TuningSubwoofer.lfeGainDb': { minimum: -20, maximum: 20 },
  'TuningUpdate.name': { minLength: 1, maxLength: NAME_MAX_LENGTH },
  'TuningUpdate.notes': { maxLength: 4000 },
  version: { minimum: 1 },
  volumeM3: { minimum: 1, maximum: 1000000 },
  widthM: { ...ROOM_EXTENT_M },
  x: { minimum: -1000, maximum: 1000 },
  y: { minimum: -1000, maximum: 1000 },
  z: { minimum: -1000, maximum: 1000 },
} as const satisfies Record<string, Bound>;

/** Largest uploaded file (a WAV impulse response or a text frequency response), bytes (20 MiB). */
export const MAX_UPLOAD_BYTES = 20 * 1024 * 1024;

/** multer's limits for one uploaded file and a few short text fields. */
export const UPLOAD_LIMITS = {
  fileSize: MAX_UPLOAD_BYTES,
  files: 1,
  // A stored sweep upload names its channels, labels, tuning and the sweep itself: 22 fields; room to spare.
  fields: 32,
  fieldSize: 4096,
  parts: 34,
} as const;
