import type { AngleRangeDeg } from '../layouts/types';

const DEG = 180 / Math.PI;

/** Wraps an angle in degrees into (−180, 180]. */
export function wrapDeg(angleDeg: number): number {
  const wrapped = ((((angleDeg + 180) % 360) + 360) % 360) - 180;
  return wrapped === -180 ? 180 : wrapped;
}

/**
 * True when `azimuthDeg` lies on the arc that starts at `range[0]` and runs anticlockwise (leftward,
 * toward larger azimuth) to `range[1]`, each end widened by `toleranceDeg`. Works across ±180°.
 */
export function insideAzimuthRange(azimuthDeg: number, range: AngleRangeDeg, toleranceDeg = 0): boolean {
  const start = range[0] - toleranceDeg;
  const span = ((((range[1] - range[0]) % 360) + 360) % 360) + 2 * toleranceDeg;
  const offset = (((azimuthDeg - start) % 360) + 360) % 360;
  return span >= 360 || offset <= span + 1e-9;
}

/** True when `elevationDeg` lies in `[range[0] − tol, range[1] + tol]`. */
export function insideElevationRange(elevationDeg: number, range: AngleRangeDeg, toleranceDeg = 0): boolean {
  return elevationDeg >= range[0] - toleranceDeg - 1e-9 && elevationDeg <= range[1] + toleranceDeg + 1e-9;
}

/**
 * Great-circle angle in degrees between two directions given as azimuth/elevation in degrees,
 * computed as atan2(|u × v|, u · v) of the unit vectors (well conditioned for small and large angles).
 */
export function angleBetweenDeg(
  a: { azimuthDeg: number; elevationDeg: number },
  b: { azimuthDeg: number; elevationDeg: number },
): number {
  const u = unitVector(a.azimuthDeg, a.elevationDeg);
  const v = unitVector(b.azimuthDeg, b.elevationDeg);
  const cross = [u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0]];
  const dot = u[0] * v[0] + u[1] * v[1] + u[2] * v[2];
  return Math.atan2(Math.hypot(cross[0], cross[1], cross[2]), dot) * DEG;
}

function unitVector(azimuthDeg: number, elevationDeg: number): [number, number, number] {
  const az = azimuthDeg / DEG;
  const el = elevationDeg / DEG;
  return [Math.cos(el) * Math.cos(az), Math.cos(el) * Math.sin(az), Math.sin(el)];
}
