import { webAudioResponses } from '../../tests/reference/web-audio';
import { eqBoostCaution, eqExtremes } from './eq-extremes';

describe('eqExtremes: the largest boost of the bands together, as designed', () => {
  // Independent reference: node-web-audio-api's BiquadFilterNode (lowshelf with S = 1, peaking with Q),
  // the two responses multiplied (dB added) on a fine grid around the peak; float32 inside, so 0.01 dB.
  it('a +9 dB low shelf at 30 Hz under a +12 dB peak at 40 Hz boosts 14.35 dB near 40 Hz, not 12 dB', () => {
    const filters = [
      { type: 'lowShelf' as const, frequencyHz: 30, gainDb: 9 },
      { type: 'peaking' as const, frequencyHz: 40, gainDb: 12, q: 2 },
    ];
    const x = eqExtremes(filters, 48000);
    const grid = Array.from({ length: 2001 }, (_, i) => 20 * Math.pow(4, i / 2000));
    const [shelf, peak] = webAudioResponses([
      {
        sampleRateHz: 48000,
        frequenciesHz: grid,
        biquad: { type: 'lowshelf', frequency: 30, Q: 1, gain: 9 },
      },
      {
        sampleRateHz: 48000,
        frequenciesHz: grid,
        biquad: { type: 'peaking', frequency: 40, Q: 2, gain: 12 },
      },
    ]);
    const summed = grid.map((_, i) => 20 * Math.log10(shelf.magnitude[i] * peak.magnitude[i]));
    const top = Math.max(...summed);
    expect(Math.abs(x.maxBoostDb - top)).toBeLessThan(0.01);
    expect(x.maxBoostDb).toBeGreaterThan(14.3);
    expect(Math.abs(Math.log2((x.maxBoostHz ?? 0) / grid[summed.indexOf(top)]))).toBeLessThan(1 / 48);
    // One wording for every answer: the summed figure, rounded as answers round dB and Hz.
    expect(eqBoostCaution([{ filters }], 48000)?.message).toMatch(
      /^Boosts: EQ \+14\.3\d dB at 39\.\d\d? Hz \(EQ figures are the bands together, as designed\)/,
    );
    expect(eqBoostCaution([{ channel: 'LFE1', filters, trimDb: 2 }], 48000, true)?.message).toMatch(
      /^Loading these settings puts boosts into the processor: LFE1 \(EQ \+14\.3\d dB at 39\.\d\d? Hz, trim \+2 dB\)/,
    );
  });

  it('cuts only: no boost and no caution; passes and notches are not boosts', () => {
    const cut = [{ type: 'peaking' as const, frequencyHz: 63, gainDb: -6, q: 4 }];
    expect(eqExtremes(cut, 48000)).toMatchObject({ maxBoostDb: 0, maxBoostHz: null });
    expect(eqExtremes(cut, 48000).maxCutDb).toBeCloseTo(6, 6);
    expect(eqBoostCaution([{ filters: [{ type: 'notch', frequencyHz: 60, q: 10 }] }], 48000)).toBeNull();
  });
});
