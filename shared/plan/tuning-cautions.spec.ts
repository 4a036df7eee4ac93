import type { TuningChannel, TuningSettings } from './tuning';
import { tuningCautions } from './tuning-cautions';

const channel = (over: Partial<TuningChannel>): TuningChannel => ({
  id: 'M+030',
  delayMs: 0,
  trimDb: 0,
  polarity: 'normal',
  eq: [],
  highPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
  bassManaged: true,
  ...over,
});
const settings = (channels: TuningChannel[]): TuningSettings => ({
  sampleRateHz: 48000,
  channels,
  subwoofer: {
    channel: 'LFE1',
    lowPass: { family: 'linkwitzRiley', order: 4, frequencyHz: 80 },
    lfeGainDb: 10,
  },
});
const byCode = (list: Array<{ code: string; message: string }>, code: string) =>
  list.find((c) => c.code === code)?.message;

describe('tuningCautions', () => {
  it('reports the boost of a channel’s bands together: +9 dB shelf at 30 Hz and +12 dB peak at 40 Hz → 14.35 dB', () => {
    // The figure is checked against node-web-audio-api in eq-extremes.spec.ts.
    const cautions = tuningCautions(
      settings([
        channel({
          id: 'LFE1',
          highPass: null,
          bassManaged: false,
          eq: [
            { type: 'lowShelf', frequencyHz: 30, gainDb: 9 },
            { type: 'peaking', frequencyHz: 40, gainDb: 12, q: 2 },
          ],
        }),
      ]),
    );
    expect(byCode(cautions, 'eqBoost')).toMatch(/^Boosts: LFE1 \(EQ \+14\.3\d dB at 39\.\d+ Hz\)/);
  });

  it('at export says the boosts reach the processor now', () => {
    const cautions = tuningCautions(settings([channel({ trimDb: 2 })]), { forExport: true });
    expect(byCode(cautions, 'eqBoost')).toMatch(
      /^Loading these settings puts boosts into the processor: M\+030 \(trim \+2 dB\)/,
    );
  });

  it('a main without a high-pass is fed full range; the subwoofer output and LFE channels are not named', () => {
    const cautions = tuningCautions(
      settings([
        channel({}),
        channel({ id: 'M-030', highPass: null, bassManaged: false }),
        channel({ id: 'LFE1', highPass: null }),
      ]),
    );
    expect(byCode(cautions, 'fullRangeNoHighPass')).toMatch(
      /^M-030 has no high-pass and will be fed full range/,
    );
  });

  it('a trim at the room’s limit asks to check the loudspeaker and its wiring', () => {
    const cautions = tuningCautions(
      settings([channel({ trimDb: 12 }), channel({ id: 'M-030', trimDb: 11.9 })]),
      {
        limits: { trimMaxDb: 12 },
      },
    );
    expect(byCode(cautions, 'trimAtLimit')).toMatch(
      /^M\+030 \(\+12 dB\) is trimmed up to the room's limit of \+12 dB.*Check the loudspeaker and its wiring before adding gain/,
    );
  });

  it('the hearing caution defers to local occupational limits', () => {
    expect(byCode(tuningCautions(settings([channel({})])), 'testSignalLevel')).toMatch(
      /occupational noise limits that apply where you work; for reference, NIOSH/,
    );
  });
});
