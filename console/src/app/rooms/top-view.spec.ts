import { speakerMarkKind as speakerLayer } from '../../../../shared/geometry/speaker-marks';
import { topViewChart } from './top-view';

// Layer letters follow ITU-R BS.2051-3 loudspeaker labels: M = middle (ear level), U = upper,
// T = top, B = bottom, LFE = low-frequency effects.
describe('speakerLayer', () => {
  it('reads the layer from the BS.2051 label', () => {
    expect(['M+030', 'M-110', 'U+045', 'T+000', 'B+000', 'LFE1', 'LFE2', 'Sub A'].map(speakerLayer)).toEqual([
      'middle',
      'middle',
      'upper',
      'upper',
      'bottom',
      'lfe',
      'lfe',
      'other',
    ]);
  });
});

describe('topViewChart', () => {
  const room = {
    name: 'Stage 3',
    dimensions: { widthM: 6.1, lengthM: 7.4, heightM: 3.05 },
    listener: { x: 3.05, y: 3.3, z: 1.2 },
    loudspeakers: [
      { id: 'M+030', x: 1.49, y: 0.6, z: 1.2 },
      { id: 'M-030', x: 4.61, y: 0.6, z: 1.2 },
      { id: 'U+045', x: 1.88, y: 2.13, z: 2.85 },
      { id: 'LFE1', x: 0.9, y: 0.5, z: 0.25 },
    ],
  };
  const spec = topViewChart(room);

  it('draws the walls as a closed outline in room coordinates', () => {
    expect(spec.series[0].points).toEqual([
      { x: 0, y: 0 },
      { x: 6.1, y: 0 },
      { x: 6.1, y: 7.4 },
      { x: 0, y: 7.4 },
      { x: 0, y: 0 },
    ]);
    expect(spec.series[0].showLine).toBe(true);
  });

  it('groups loudspeakers by layer, labels each with its channel, and marks the listener', () => {
    expect(spec.series.slice(1).map((series) => [series.label, series.pointLabels])).toEqual([
      ['Ear level', ['M+030', 'M-030']],
      ['Overhead', ['U+045']],
      ['Subwoofer', ['LFE1']],
      ['Listening position', ['Listener']],
    ]);
    expect(spec.series[1].points).toEqual([
      { x: 1.49, y: 0.6 },
      { x: 4.61, y: 0.6 },
    ]);
  });

  it('puts the front wall at the top and keeps a margin round the room', () => {
    expect(spec.yReverse).toBe(true);
    const bounds = [spec.xMin, spec.xMax, spec.yMin, spec.yMax] as number[];
    [-0.4, 6.5, -0.4, 7.8].forEach((expected, i) => expect(bounds[i]).toBeCloseTo(expected, 12));
    expect(spec.aspectRatio).toBeCloseTo((6.9 / 8.2) * 1.1, 10);
    expect(spec.summary).toContain('6.10 m wide and 7.40 m long, 4 loudspeakers');
  });
});

describe('topViewChart marks', () => {
  it('rings the loudspeakers outside the permitted range and names them for screen readers', () => {
    const room = {
      name: 'Test',
      dimensions: { widthM: 6, lengthM: 7, heightM: 3 },
      listener: { x: 3, y: 3.5, z: 1.2 },
      loudspeakers: [
        { id: 'M+030', x: 1.8, y: 1.4, z: 1.2 },
        { id: 'M-030', x: 5.5, y: 3.4, z: 1.2 },
      ],
    };
    const spec = topViewChart(room, [
      { id: 'M+030', withinTolerance: true },
      { id: 'M-030', withinTolerance: false },
    ]);
    const ring = spec.series.find((series) => series.label === 'Outside the permitted range');
    expect(ring?.points).toEqual([{ x: 5.5, y: 3.4 }]);
    expect(ring?.hollow).toBe(true);
    expect(spec.summary).toContain("Outside the layout's permitted range: M-030.");
    expect(topViewChart(room, []).series.some((series) => series.hollow)).toBe(false);
  });
});
