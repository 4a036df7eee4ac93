const DEG = 180 / Math.PI;

/** A point in room coordinates, metres: origin at the floor's front-left corner seen from the listening
 * position, x to the right, y toward the back wall, z up. */
export interface RoomPoint {
  x: number;
  y: number;
  z: number;
}

/** Where a point lies as seen from the listening position. */
export interface ListenerPolar {
  /** Straight-line distance in metres. */
  distanceM: number;
  /** Azimuth in degrees, 0 straight ahead, positive to the left, in (−180, 180]. */
  azimuthDeg: number;
  /** Elevation in degrees, positive upward, in [−90, 90]. */
  elevationDeg: number;
}

/**
 * Converts a room point to distance, azimuth and elevation seen from `listener`, facing the front wall
 * (toward −y). With d = point − listener: forward = −d.y, left = −d.x, so
 * azimuth = atan2(left, forward) (ITU-R BS.2051 convention, positive left) and
 * elevation = atan2(d.z, hypot(d.x, d.y)).
 */
export function toListenerPolar(listener: RoomPoint, point: RoomPoint): ListenerPolar {
  const dx = point.x - listener.x;
  const dy = point.y - listener.y;
  const dz = point.z - listener.z;
  const horizontal = Math.hypot(dx, dy);
  const azimuth = horizontal === 0 ? 0 : Math.atan2(-dx, -dy) * DEG;
  return {
    distanceM: Math.hypot(dx, dy, dz),
    azimuthDeg: azimuth === -180 ? 180 : azimuth + 0,
    elevationDeg: Math.atan2(dz, horizontal) * DEG,
  };
}

/**
 * The inverse of toListenerPolar: the room point at `distanceM`, `azimuthDeg`, `elevationDeg` from the
 * listener. Used to place demo loudspeakers at chosen angles and in tests as an independent round trip.
 */
export function fromListenerPolar(listener: RoomPoint, polar: ListenerPolar): RoomPoint {
  const az = polar.azimuthDeg / DEG;
  const el = polar.elevationDeg / DEG;
  const horizontal = polar.distanceM * Math.cos(el);
  return {
    x: listener.x - horizontal * Math.sin(az),
    y: listener.y - horizontal * Math.cos(az),
    z: listener.z + polar.distanceM * Math.sin(el),
  };
}
