import type { components } from '../../../../shared/contract/api-types';

type Schemas = components['schemas'];

/** A stored room as `GET /v1/rooms/{roomId}` returns it. */
export type Room = Schemas['Room'];

export type RoomLoudspeaker = Schemas['RoomLoudspeaker'];

export type SpeakerGeometry = Schemas['SpeakerGeometry'];

export type { Tuning, TuningComparison } from '../tunings/tuning.model';

export type RoomCreate = Schemas['RoomCreate'];
export type RoomUpdate = Schemas['RoomUpdate'];
export type Layout = Schemas['Layout'];
export type ProcessorProfile = Schemas['ProcessorProfile'];
