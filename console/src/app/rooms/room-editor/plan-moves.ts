import { mm } from '../room-form';

/** One arrow-key press moves a loudspeaker this far on the plan, in metres (5 cm). */
export const PLAN_STEP_M = 0.05;
/** With Shift held, the finer step, in metres (1 cm). */
export const PLAN_FINE_STEP_M = 0.01;

export interface PlanPoint {
  x: number;
  y: number;
}

export interface PlanBox {
  /** The drawing's viewBox in room metres: left, top, width, height. */
  minX: number;
  minY: number;
  width: number;
  height: number;
}

/**
 * The room point under a pointer: client pixels through the element's box into the viewBox, as an SVG
 * with `preserveAspectRatio="xMidYMid meet"` draws it (scaled evenly, centred on the spare axis).
 */
export function clientToRoom(
  rect: { left: number; top: number; width: number; height: number },
  box: PlanBox,
  clientX: number,
  clientY: number,
): PlanPoint {
  const scale = Math.min(rect.width / box.width, rect.height / box.height);
  const offsetX = (rect.width - box.width * scale) / 2;
  const offsetY = (rect.height - box.height * scale) / 2;
  return {
    x: box.minX + (clientX - rect.left - offsetX) / scale,
    y: box.minY + (clientY - rect.top - offsetY) / scale,
  };
}

/** Keeps a point on the floor (0…width, 0…length), to the millimetre the table shows. */
export function onFloor(point: PlanPoint, dimensions: { widthM: number; lengthM: number }): PlanPoint {
  return {
    x: mm(Math.min(dimensions.widthM, Math.max(0, point.x))),
    y: mm(Math.min(dimensions.lengthM, Math.max(0, point.y))),
  };
}

/**
 * Where an arrow key takes a loudspeaker on the plan (front wall at the top): Left/Right along x, Up
 * toward the front wall (smaller y), Down toward the back; {@link PLAN_STEP_M}, or
 * {@link PLAN_FINE_STEP_M} with Shift. Null for any other key.
 */
export function nudged(
  point: PlanPoint,
  key: string,
  fine: boolean,
  dimensions: { widthM: number; lengthM: number },
): PlanPoint | null {
  const step = fine ? PLAN_FINE_STEP_M : PLAN_STEP_M;
  const delta: Record<string, PlanPoint> = {
    ArrowLeft: { x: -step, y: 0 },
    ArrowRight: { x: step, y: 0 },
    ArrowUp: { x: 0, y: -step },
    ArrowDown: { x: 0, y: step },
  };
  const move = delta[key];
  return move ? onFloor({ x: point.x + move.x, y: point.y + move.y }, dimensions) : null;
}
