import { PLAN_FINE_STEP_M, PLAN_STEP_M, clientToRoom, nudged, onFloor } from './plan-moves';

const room = { widthM: 6, lengthM: 7 };

describe('clientToRoom', () => {
  const box = { minX: -0.4, minY: -0.4, width: 6.8, height: 7.8 };

  it('maps the drawing’s corners to the viewBox corners when the shapes agree', () => {
    // 68 × 78 px: 10 px per metre exactly.
    const rect = { left: 100, top: 50, width: 68, height: 78 };
    expect(clientToRoom(rect, box, 100, 50)).toEqual({ x: -0.4, y: -0.4 });
    const far = clientToRoom(rect, box, 168, 128);
    expect(far.x).toBeCloseTo(6.4, 12);
    expect(far.y).toBeCloseTo(7.4, 12);
  });

  it('allows for the centred margin of a wider element (meet)', () => {
    // 200 × 78 px: still 10 px per metre (height decides), the 68 px drawing centred: 66 px each side.
    const rect = { left: 0, top: 0, width: 200, height: 78 };
    const point = clientToRoom(rect, box, 66 + 34, 39);
    expect(point.x).toBeCloseTo(3, 12);
    expect(point.y).toBeCloseTo(3.5, 12);
  });
});

describe('nudged', () => {
  const at = { x: 3, y: 1 };

  it('moves by the stated step, Up toward the front wall, and by the fine step with Shift', () => {
    expect(nudged(at, 'ArrowRight', false, room)).toEqual({ x: 3 + PLAN_STEP_M, y: 1 });
    expect(nudged(at, 'ArrowLeft', false, room)).toEqual({ x: 3 - PLAN_STEP_M, y: 1 });
    expect(nudged(at, 'ArrowUp', false, room)).toEqual({ x: 3, y: 1 - PLAN_STEP_M });
    expect(nudged(at, 'ArrowDown', true, room)).toEqual({ x: 3, y: 1 + PLAN_FINE_STEP_M });
    expect(nudged(at, 'Enter', false, room)).toBeNull();
  });

  it('stops at the walls and keeps millimetres without binary noise', () => {
    expect(nudged({ x: 0.02, y: 6.99 }, 'ArrowLeft', false, room)).toEqual({ x: 0, y: 6.99 });
    expect(nudged({ x: 0.02, y: 6.99 }, 'ArrowDown', false, room)).toEqual({ x: 0.02, y: 7 });
    // 0.1 + 0.2 in binary is 0.30000000000000004; the table shows 0.3.
    expect(nudged({ x: 0.29, y: 1 }, 'ArrowRight', true, room)).toEqual({ x: 0.3, y: 1 });
  });
});

describe('onFloor', () => {
  it('brings a point dragged past a wall back onto it', () => {
    expect(onFloor({ x: -0.3, y: 8.2 }, room)).toEqual({ x: 0, y: 7 });
    expect(onFloor({ x: 2.34567, y: 1.2 }, room)).toEqual({ x: 2.346, y: 1.2 });
  });
});
