import { LAYOUTS } from '../layouts';
import { SPEAKER_MARKS, speakerMark, speakerMarkKind } from './speaker-marks';

describe('speaker marks', () => {
  it('gives every layer of every layout its own shape and colour', () => {
    const layerToKind = {
      middle: 'middle',
      upper: 'upper',
      upperHigh: 'upper',
      top: 'upper',
      bottom: 'bottom',
      lfe: 'lfe',
    };
    for (const layout of LAYOUTS) {
      for (const channel of layout.channels) {
        expect([channel.label, speakerMarkKind(channel.label)]).toEqual([
          channel.label,
          layerToKind[channel.layer],
        ]);
      }
    }
    const shapes = new Set(SPEAKER_MARKS.filter((m) => m.kind !== 'other').map((m) => m.shape));
    expect(shapes.size).toBe(4);
    expect(new Set(SPEAKER_MARKS.map((m) => m.printColour)).size).toBe(SPEAKER_MARKS.length);
    expect(speakerMark('X1').kind).toBe('other');
  });
});
