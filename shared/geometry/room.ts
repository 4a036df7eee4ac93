import { CalculationInputError, requireInRange } from '../errors';
import { requireLayout, type Layout } from '../layouts';
import {
  analyseGeometry,
  GEOMETRY_LIMITS,
  requireInsideRoom,
  requireUniqueIds,
  type GeometryResult,
  type RoomDimensions,
} from './analyse-geometry';
import { toListenerPolar, type RoomPoint } from './coordinates';

export interface RoomLoudspeaker extends RoomPoint {
  /** Channel label (`M+030`, `LFE1`). */
  id: string;
  /** Friendly name, e.g. "Left top front". */
  name?: string;
}

/** The geometric part of a room definition. */
export interface RoomDefinition {
  layout: string;
  dimensions: RoomDimensions;
  listener: RoomPoint;
  loudspeakers: readonly RoomLoudspeaker[];
}

/**
 * Checks a room before it is stored and returns its layout: known layout, dimensions in (0, 100] m,
 * listener and every loudspeaker inside the room, no repeated channel id. Fields are named relative to
 * the room object (`/loudspeakers/4/y`, `/dimensions/heightM`, `/layout`).
 */
export function checkRoomDefinition(room: RoomDefinition): Layout {
  const layout = requireLayout(room.layout, '/layout');
  for (const key of ['widthM', 'lengthM', 'heightM'] as const) {
    requireInRange(
      room.dimensions?.[key],
      { min: 0, max: GEOMETRY_LIMITS.roomMaxM, exclusiveMin: true, unit: 'm' },
      key,
      `/dimensions/${key}`,
    );
  }
  requireInsideRoom(room.listener, room.dimensions, '/listener', 'the listening position');
  requireUniqueIds(room.loudspeakers, '/loudspeakers');
  room.loudspeakers.forEach((speaker, i) => {
    requireInsideRoom(speaker, room.dimensions, `/loudspeakers/${i}`, `loudspeaker ${speaker.id}`);
    const { distanceM } = toListenerPolar(room.listener, speaker);
    if (distanceM < GEOMETRY_LIMITS.minSpeakerDistanceM) {
      throw new CalculationInputError(
        `loudspeaker ${speaker.id} is ${distanceM.toFixed(3)} m from the listening position; it must be at least ${GEOMETRY_LIMITS.minSpeakerDistanceM} m away`,
        `/loudspeakers/${i}`,
      );
    }
  });
  return layout;
}

/** The geometry analysis of a stored room (distances, angles, deviations, rule warnings). */
export function roomGeometry(room: RoomDefinition): GeometryResult {
  return analyseGeometry({
    room: room.dimensions,
    listener: room.listener,
    layout: room.layout,
    speakers: room.loudspeakers.map(({ id, x, y, z }) => ({ id, x, y, z })),
  });
}
