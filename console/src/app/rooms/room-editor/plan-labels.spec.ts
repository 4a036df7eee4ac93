import { type LabelBox, labelBox, overlapArea, placeLabels } from './plan-labels';

const bounds: LabelBox = { left: -0.4, top: -0.4, right: 6.5, bottom: 7.8 };
// The plan's sizes for a 6.1 m × 7.4 m room: a unit of 1/60 of the longer side of the drawing.
const unit = 7.8 / 60;
const options = { fontSizeM: unit * 1.8, markRadiusM: unit * 1.2, labelGapM: unit * 2, bounds };

const apart = (boxes: LabelBox[]) => {
  for (let i = 0; i < boxes.length; i++)
    for (let j = i + 1; j < boxes.length; j++) expect(overlapArea(boxes[i], boxes[j])).toBe(0);
};
const markBox = (m: { x: number; y: number }): LabelBox => ({
  left: m.x - options.markRadiusM,
  top: m.y - options.markRadiusM,
  right: m.x + options.markRadiusM,
  bottom: m.y + options.markRadiusM,
});

describe('placeLabels', () => {
  it('puts a label above its mark when nothing is in the way', () => {
    const [place] = placeLabels([{ text: 'M+000', x: 3, y: 3 }], options);
    expect(place.dx).toBe(0);
    expect(place.dy).toBeLessThan(-options.markRadiusM);
    expect(place.leader).toBeNull();
    // Clear of its own mark.
    expect(overlapArea(place.box, markBox({ x: 3, y: 3 }))).toBe(0);
  });

  it('keeps a subwoofer’s label off the main beside it (LFE1 at 0.59 m from M+030)', () => {
    const marks = [
      { text: 'M+030', x: 1.49, y: 0.6 },
      { text: 'M+000', x: 3.05, y: 0.55 },
      { text: 'LFE1', x: 0.9, y: 0.5 },
    ];
    // Both above their marks, as before, the two labels would print over each other.
    const above = marks.map((m) => labelBox(m.text, m.x, m.y - unit * 2.6, options.fontSizeM));
    expect(overlapArea(above[0], above[2])).toBeGreaterThan(0);

    const places = placeLabels(marks, options);
    apart(places.map((p) => p.box));
    for (const place of places) for (const m of marks) expect(overlapArea(place.box, markBox(m))).toBe(0);
    // The first keeps the preferred place; the subwoofer's label moves.
    expect(places[0].dy).toBeLessThan(0);
    expect(places[0].dx).toBe(0);
    expect(places[2].dx !== 0 || places[2].dy > 0).toBe(true);
  });

  it('stands labels off with a leader line in a crowd, none over another, all inside the drawing', () => {
    // Six marks within 40 cm of a corner.
    const marks = [
      [0.1, 0.1],
      [0.3, 0.1],
      [0.1, 0.3],
      [0.3, 0.3],
      [0.5, 0.2],
      [0.2, 0.5],
    ].map(([x, y], i) => ({ text: `M+0${i}0`, x, y }));
    const places = placeLabels(marks, options);
    apart(places.map((p) => p.box));
    for (const place of places) {
      expect(place.box.left).toBeGreaterThanOrEqual(bounds.left);
      expect(place.box.top).toBeGreaterThanOrEqual(bounds.top);
    }
    const led = places.filter((p) => p.leader);
    expect(led.length).toBeGreaterThan(0);
    for (const place of led) {
      const leader = place.leader!;
      // The line starts at the mark's edge and ends at the label's box, pointing from mark to label.
      expect(Math.hypot(leader.x1, leader.y1)).toBeCloseTo(options.markRadiusM, 6);
      expect(Math.hypot(leader.x2, leader.y2)).toBeGreaterThan(options.labelGapM);
      expect(Math.hypot(leader.x2, leader.y2)).toBeLessThan(Math.hypot(place.dx, place.dy));
    }
  });

  it('keeps clear of the obstacles it is given (the listener’s name)', () => {
    const listenerName = labelBox('Listener', 3, 3.3 + 3 * unit, options.fontSizeM);
    const [place] = placeLabels([{ text: 'M+000', x: 3, y: 3.3 + 5.2 * unit }], {
      ...options,
      obstacles: [listenerName],
    });
    expect(overlapArea(place.box, listenerName)).toBe(0);
  });
});
