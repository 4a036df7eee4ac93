import type { LayoutChannel } from '../layouts/types';
import type { RoomDimensions } from './analyse-geometry';
import { fromListenerPolar, type RoomPoint } from './coordinates';

/** Keep placed loudspeakers this far inside the walls, floor and ceiling (a cabinet's half-depth). */
export const WALL_CLEARANCE_M = 0.1;
/** Height of a subwoofer placed by default (on the floor, cabinet centre). */
export const SUBWOOFER_HEIGHT_M = 0.25;

export interface PlacedLoudspeaker extends RoomPoint {
  id: string;
  /** True when the nominal direction at the chosen distance lands outside the room and the point was
   * pulled back inside along its own line to the listener, so it keeps the nominal direction but is nearer. */
  pulledIn: boolean;
}

/**
 * Places every loudspeaker of a layout at its nominal azimuth and elevation (ITU-R BS.2051 convention,
 * azimuth positive to the left, elevation positive up), `distanceM` from the listener. A direction whose
 * point at that distance falls outside the room (less `WALL_CLEARANCE_M`) is shortened along the same
 * line until it fits, so the angles stay nominal and only the distance changes; delay and trim correct
 * the distance later. LFE channels without a nominal direction go to the front wall, on the floor, a
 * quarter of the width in from the left wall (common practice: a starting point to move, not a rule).
 */
export function placeLayoutLoudspeakers(
  channels: readonly Pick<LayoutChannel, 'label' | 'azimuthDeg' | 'elevationDeg'>[],
  listener: RoomPoint,
  distanceM: number,
  room: RoomDimensions,
): PlacedLoudspeaker[] {
  const lo = { x: WALL_CLEARANCE_M, y: WALL_CLEARANCE_M, z: WALL_CLEARANCE_M };
  const hi = {
    x: room.widthM - WALL_CLEARANCE_M,
    y: room.lengthM - WALL_CLEARANCE_M,
    z: room.heightM - WALL_CLEARANCE_M,
  };
  return channels.map((channel) => {
    if (channel.azimuthDeg === null || channel.elevationDeg === null) {
      return {
        id: channel.label,
        x: Math.max(lo.x, room.widthM / 4),
        y: lo.y + 0.2,
        z: Math.min(SUBWOOFER_HEIGHT_M, hi.z),
        pulledIn: false,
      };
    }
    const far = fromListenerPolar(listener, {
      distanceM,
      azimuthDeg: channel.azimuthDeg,
      elevationDeg: channel.elevationDeg,
    });
    // The largest fraction t of the listener→point segment that stays inside the box on every axis.
    let t = 1;
    for (const axis of ['x', 'y', 'z'] as const) {
      const d = far[axis] - listener[axis];
      if (d > 0 && far[axis] > hi[axis]) t = Math.min(t, (hi[axis] - listener[axis]) / d);
      if (d < 0 && far[axis] < lo[axis]) t = Math.min(t, (lo[axis] - listener[axis]) / d);
    }
    t = Math.max(0, t);
    const at = (axis: 'x' | 'y' | 'z') => listener[axis] + (far[axis] - listener[axis]) * t;
    return { id: channel.label, x: at('x'), y: at('y'), z: at('z'), pulledIn: t < 1 };
  });
}
