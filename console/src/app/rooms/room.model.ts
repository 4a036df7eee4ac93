import type { components } from '../../../../shared/contract/api-types';

type Schemas = components['schemas'];

/** A stored room as `GET /v1/rooms/{roomId}` returns it. */
export type Room = Schemas['Room'];

export type RoomLoudspeaker = Schemas['RoomLoudspeaker'];

export type SpeakerGeometry = Schemas['SpeakerGeometry'];

export interface Notice {
  code: string;
  message: string;
  channel?: string;
}

export interface TuningChannel {
  id: string;
  name?: string;
  delayMs: number;
  trimDb: number;
  polarity: 'normal' | 'inverted';
  eq: unknown[];
  highPass: { family: string; order: number; frequencyHz: number } | null;
  bassManaged: boolean;
}

/** A stored tuning (the version shown is `version`). */
export interface Tuning {
  id: string;
  roomId: string;
  name: string;
  notes: string | null;
  version: number;
  latestVersion: number;
  origin: 'settings' | 'plan' | 'edit' | 'restore' | 'duplicate';
  duplicatedFromId: string | null;
  sampleRateHz: number;
  channels: TuningChannel[];
  subwoofer: { channel: string; lfeGainDb: number; headroomDb?: number } | null;
  createdAt: string;
  updatedAt: string;
  cautions: Notice[];
}

export interface TuningComparison {
  left: { tuningId: string; version: number; name: string };
  right: { tuningId: string; version: number; name: string };
  identical: boolean;
  subwoofer: { lfeGainDbDifference: number | null; lowPassChanged: boolean };
  channels: Array<{
    id: string;
    presentIn: 'both' | 'left' | 'right';
    delayMsDifference: number | null;
    trimDbDifference: number | null;
    polarityChanged: boolean;
    bassManagedChanged: boolean;
    highPassChanged: boolean;
    eqChanged: boolean;
    eqBands: { left: number; right: number };
    maxResponseDifferenceDb: number | null;
  }>;
}
