import type { PlanPoint } from './plan-moves';

/** A rectangle in room metres, y downward as the plan draws it. */
export interface LabelBox {
  left: number;
  top: number;
  right: number;
  bottom: number;
}

/** Where a mark's label goes: its centre relative to the mark, and a leader line when it stands off. */
export interface LabelPlace {
  dx: number;
  dy: number;
  /** From the mark's edge to the label's edge, relative to the mark; null when the label sits beside it. */
  leader: { x1: number; y1: number; x2: number; y2: number } | null;
  box: LabelBox;
}

export interface LabelledMark extends PlanPoint {
  text: string;
}

/**
 * Width of a label in ems: Roboto's capitals and digits run 0.55–0.85 em (M widest), so 0.62 em a
 * character, plus a little air either side, keeps an estimate of the drawn width on the safe side
 * without measuring text in the browser (which the plan would then have to wait for).
 */
const EM_PER_CHAR = 0.62;
const PAD_EM = 0.3;

/** The box a label of `text` takes, centred at `x`,`y`, at `fontSizeM` metres. */
export function labelBox(text: string, x: number, y: number, fontSizeM: number): LabelBox {
  const halfWidth = ((text.length * EM_PER_CHAR + PAD_EM) * fontSizeM) / 2;
  const halfHeight = (1.1 * fontSizeM) / 2;
  return { left: x - halfWidth, top: y - halfHeight, right: x + halfWidth, bottom: y + halfHeight };
}

/** The area two boxes share, square metres (0 when apart). */
export function overlapArea(a: LabelBox, b: LabelBox): number {
  const w = Math.min(a.right, b.right) - Math.max(a.left, b.left);
  const h = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
  return w > 0 && h > 0 ? w * h : 0;
}

/** How much of `box` lies outside `bounds`, square metres. */
function outsideArea(box: LabelBox, bounds: LabelBox): number {
  const area = (box.right - box.left) * (box.bottom - box.top);
  return area - overlapArea(box, bounds);
}

/**
 * Directions to try, in order of preference: above (where a reader looks first), below, the sides, the
 * diagonals; each first beside the mark, then twice as far off with a leader line to the mark.
 */
const DIRECTIONS: ReadonlyArray<[number, number]> = [
  [0, -1],
  [0, 1],
  [1, 0],
  [-1, 0],
  [1, -1],
  [-1, -1],
  [1, 1],
  [-1, 1],
];
const REACHES = [1, 2.2, 3.4];

/**
 * Places every mark's label where it overlaps no other label, no mark and nothing in `obstacles` (the
 * listener and its label, the wall's name), inside `bounds`, so labels of loudspeakers that stand close
 * (a subwoofer beside a main) never print over each other. Greedy, in the marks' order: each takes the
 * first free place of {@link DIRECTIONS} × {@link REACHES}; a label that stands off gets a leader line so
 * it still reads as the mark's. With no free place (a crowd of marks in a small room) it takes the
 * place that overlaps least.
 *
 * `markRadiusM`: how far a mark's shape reaches from its centre (what other labels keep off);
 * `labelGapM`: how far from its mark's centre a label's near edge stands (clear of the range ring too).
 */
export function placeLabels(
  marks: readonly LabelledMark[],
  options: {
    fontSizeM: number;
    markRadiusM: number;
    labelGapM: number;
    bounds: LabelBox;
    obstacles?: readonly LabelBox[];
  },
): LabelPlace[] {
  const { fontSizeM, markRadiusM, labelGapM, bounds } = options;
  const markBoxes = marks.map((m) => ({
    left: m.x - markRadiusM,
    top: m.y - markRadiusM,
    right: m.x + markRadiusM,
    bottom: m.y + markRadiusM,
  }));
  const taken: LabelBox[] = [...markBoxes, ...(options.obstacles ?? [])];
  return marks.map((mark) => {
    const probe = labelBox(mark.text, 0, 0, fontSizeM);
    const halfWidth = probe.right;
    const halfHeight = probe.bottom;
    let best: { place: LabelPlace; cost: number } | null = null;
    for (const reach of REACHES) {
      for (const [ux, uy] of DIRECTIONS) {
        // Centre far enough along the direction that the box's near edge is `labelGapM` off, times the reach.
        const clearX = ux === 0 ? 0 : ux * (labelGapM + halfWidth);
        const clearY = uy === 0 ? 0 : uy * (labelGapM + halfHeight);
        const extra = (reach - 1) * (labelGapM + halfHeight);
        const dx = clearX + ux * extra;
        const dy = clearY + uy * extra;
        const box = labelBox(mark.text, mark.x + dx, mark.y + dy, fontSizeM);
        const cost =
          taken.reduce((sum, other) => sum + overlapArea(box, other), 0) + 4 * outsideArea(box, bounds);
        const place: LabelPlace = {
          dx,
          dy,
          leader: reach > 1 ? leaderLine(dx, dy, halfWidth, halfHeight, markRadiusM) : null,
          box,
        };
        if (!best || cost < best.cost) best = { place, cost };
        if (cost === 0) break;
      }
      if (best?.cost === 0) break;
    }
    const chosen = (best as { place: LabelPlace }).place;
    taken.push(chosen.box);
    return chosen;
  });
}

/** A line from the mark's edge toward the label's centre, ending at the label's box. */
function leaderLine(dx: number, dy: number, halfWidth: number, halfHeight: number, markRadiusM: number) {
  const length = Math.hypot(dx, dy);
  const ux = dx / length;
  const uy = dy / length;
  // Where the ray from the label's centre back to the mark leaves the label's box.
  const toEdge = Math.min(
    ux === 0 ? Infinity : halfWidth / Math.abs(ux),
    uy === 0 ? Infinity : halfHeight / Math.abs(uy),
  );
  return {
    x1: ux * markRadiusM,
    y1: uy * markRadiusM,
    x2: dx - ux * toEdge,
    y2: dy - uy * toEdge,
  };
}
