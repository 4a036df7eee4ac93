import { speakerMarkKind as speakerLayer } from '../../../../shared/geometry/speaker-marks';
import { topViewSummary } from './top-view';

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

describe('topViewSummary', () => {
  const room = {
    name: 'Stage 3',
    dimensions: { widthM: 6.1, lengthM: 7.4, heightM: 3.05 },
    listener: { x: 3.05, y: 3.3, z: 1.2 },
    loudspeakers: [
      { id: 'M+030', x: 1.49, y: 0.6, z: 1.2 },
      { id: 'M-030', x: 4.61, y: 0.6, z: 1.2 },
      { id: 'LFE1', x: 0.9, y: 0.5, z: 0.25 },
    ],
  };

  it('gives the size, the loudspeaker count and the listening position, front wall at the top', () => {
    expect(topViewSummary(room, new Set())).toBe(
      'Floor plan of Stage 3 seen from above, front wall at the top: 6.10 m wide and 7.40 m long, ' +
        '3 loudspeakers, listening position at x 3.05 m, y 3.30 m.',
    );
  });

  it('names the loudspeakers outside the permitted range', () => {
    expect(topViewSummary(room, new Set(['M-030', 'LFE1']))).toMatch(
      /Outside the layout's permitted range: M-030, LFE1\.$/,
    );
  });
});
