import type { DecayPlotData } from '../../ui/decay-plot/decay-scale';

/** The kinds of stored measurement the API knows. */
export type MeasurementKind = 'impulseResponse' | 'frequencyResponse' | 'spl';

/** A few numbers per measurement for lists; which ones depends on the kind. */
export interface MeasurementSummary {
  arrivalMs?: number;
  peakDbfs?: number;
  energyDb?: number;
  edtS?: number | null;
  t20S?: number | null;
  t30S?: number | null;
  points?: number;
  fromHz?: number;
  toHz?: number;
  splDb?: number;
  weighting?: string;
}

export interface MagnitudeResponse {
  frequenciesHz: number[];
  magnitudeDb: number[];
  phaseDeg?: number[];
}

export interface DecayTimes {
  edtS: number | null;
  t20S: number | null;
  t30S: number | null;
}

export interface BandDecay extends DecayTimes {
  centreHz: number;
  nominalHz: number;
}

export interface RoomMode {
  nx: number;
  ny: number;
  nz: number;
  frequencyHz: number;
  kind: 'axial' | 'tangential' | 'oblique';
}

/** The analysis the API stores for an uploaded impulse response. */
export interface ImpulseResponseAnalysis {
  sampleRateHz: number;
  durationS: number;
  arrival: { arrivalMs: number; peakMs: number; thresholdDb: number };
  level: {
    peakDbfs: number;
    rmsDbfs: number;
    energyDb: number;
    noiseFloorDbfs: number;
    peakToNoiseDb: number;
  };
  frequencyResponse: MagnitudeResponse & { smoothingOctaves: number };
  decay: DecayTimes & { impulseToNoiseDb: number; truncationMs: number; bands: BandDecay[] };
  room?: {
    volumeM3: number;
    speedOfSoundMps: number;
    schroederFrequencyHz: number | null;
    modesUpToHz: number;
    modes: RoomMode[];
  };
  warnings: Array<{ code: string; message: string }>;
  waterfall?: DecayPlotData;
  spectrogram?: DecayPlotData;
}

/** A stored measurement as the API returns it; lists leave out `result`. */
export interface Measurement {
  id: string;
  roomId: string;
  channel: string;
  micPosition: string;
  kind: MeasurementKind;
  name: string | null;
  notes: string | null;
  source: { type: 'wav' | 'text' | 'json'; fileName?: string; sampleRateHz?: number; durationS?: number };
  summary: MeasurementSummary;
  result?: Record<string, unknown>;
  createdAt: string;
}

/** `GET /v1/rooms/{roomId}/measurements/average?channel=`. */
export interface AverageResponse {
  channel: string;
  measurementIds: string[];
  micPositions: string[];
  frequenciesHz: number[];
  magnitudeDb: number[];
}

/** The two kinds of stored response a channel's average can be made of. */
export type ResponseKind = 'impulseResponse' | 'frequencyResponse';

/** WAV-only fields of a measurement upload. */
export interface UploadOptions {
  /** 0-based channel of a multichannel file. */
  fileChannel?: number;
  /** 0-based channel holding the loopback of the test signal (timing reference). */
  referenceFileChannel?: number;
  smoothingOctaves?: number;
  /** Multipart fields asking for decay plots (`decayFormFields`). */
  decayFields?: Array<[string, string]>;
  name?: string;
  notes?: string;
}

/** A target point: level in dB at a frequency. */
export interface TargetPoint {
  frequencyHz: number;
  gainDb: number;
}

/** `GET /v1/target-curves` item. */
export interface StoredTargetCurve {
  id: string;
  name: string;
  notes: string | null;
  points: TargetPoint[];
}

/** The fit's target: flat, or one of the caller's stored curves by name. */
export type FitTarget = { kind: 'flat' } | { kind: 'stored'; name: string };

export interface EqFitRequest {
  sampleRateHz: number;
  measured: { frequenciesHz: number[]; magnitudeDb: number[] };
  target: FitTarget;
  maxBands: number;
  maxBoostDb: number;
  maxCutDb: number;
  fromHz?: number;
  toHz?: number;
  /** The room's volume and measured reverberation time, for the transition frequency the fit starts below. */
  room?: { volumeM3: number; reverberationTimeS?: number };
}

export interface EqFitResult {
  sampleRateHz: number;
  bands: Array<{ type: 'peaking'; frequencyHz: number; gainDb: number; q: number }>;
  predicted: { frequenciesHz: number[]; magnitudeDb: number[] };
  residualRmsDb: { before: number; after: number };
  targetOffsetDb: number;
  fromHz: number;
  toHz: number;
  warnings: Array<{ code: string; message: string; channel?: string }>;
  cautions: Array<{ code: string; message: string }>;
}
