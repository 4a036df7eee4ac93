import { expectWithin } from '../filters/test-helpers';
import { CalculationInputError } from '../errors';
import { bandCentreHz, bandEdgesHz, bandsBetween, nominalOctaveCentreHz, OCTAVE_RATIO_G } from './iec-bands';

// IEC 61260-1:2014 base-ten system [lib]: G = 10^(3/10), fm = 1000·G^(x/b) (odd b),
// fm = 1000·G^((2x+1)/(2b)) (even b), edges fm·G^(∓1/(2b)). For b = 3, G^(x/3) = 10^(x/10), so the
// one-third-octave centres are 1000·10^(x/10): 31.62 Hz, 1000 Hz and 10 000 Hz exactly.
describe('IEC 61260-1 fractional-octave bands', () => {
  it('uses the base-ten octave ratio G = 10^(3/10) = 1.995262315', () => {
    expectWithin(OCTAVE_RATIO_G, 1.9952623149688795, 1e-15, 'G');
  });

  it.each([
    [-15, 31.622776601683793],
    [-10, 100],
    [0, 1000],
    [10, 10000],
    [-17, 19.952623149688797],
    [13, 19952.623149688796],
  ])('one-third-octave band x = %d has centre 1000·10^(x/10) = %f Hz', (x, expected) => {
    expectWithin(bandCentreHz(x, 3), expected, 1e-9 * expected, `fm(x=${x})`);
  });

  it('octave centres are 1000·10^(3x/10): 63.096 Hz for x = −4, 125.89 Hz for x = −3', () => {
    expectWithin(bandCentreHz(-4, 1), 1000 * Math.pow(10, -1.2), 1e-9, 'fm(−4)');
    expectWithin(bandCentreHz(-3, 1), 1000 * Math.pow(10, -0.9), 1e-9, 'fm(−3)');
  });

  it('even b puts the reference frequency on a band edge: b = 2, x = 0 → 1000·G^(1/4) = 1188.5 Hz', () => {
    expectWithin(bandCentreHz(0, 2), 1000 * Math.pow(10, 0.075), 1e-9, 'fm');
    expectWithin(bandEdgesHz(bandCentreHz(0, 2), 2).lowerHz, 1000, 1e-9, 'lower edge');
    expectWithin(bandEdgesHz(bandCentreHz(-1, 6), 6).upperHz, 1000, 1e-9, 'upper edge, b = 6');
  });

  it('band edges: octave at 1 kHz 707.946..1412.538 Hz; one-third octave 891.251..1122.018 Hz', () => {
    const octave = bandEdgesHz(1000, 1);
    expectWithin(octave.lowerHz, 1000 * Math.pow(10, -0.15), 1e-9, 'octave lower');
    expectWithin(octave.upperHz, 1000 * Math.pow(10, 0.15), 1e-9, 'octave upper');
    expectWithin(octave.lowerHz, 707.9457843841379, 1e-9, 'octave lower, decimal');
    const third = bandEdgesHz(1000, 3);
    expectWithin(third.lowerHz, 891.2509381337456, 1e-9, 'third lower');
    expectWithin(third.upperHz, 1122.0184543019636, 1e-9, 'third upper');
  });

  it('adjacent bands share their edges and the edges are geometric means of neighbouring centres', () => {
    for (const b of [1, 2, 3, 6, 12, 24, 48]) {
      for (let x = -5; x < 5; x++) {
        const upper = bandEdgesHz(bandCentreHz(x, b), b).upperHz;
        const nextLower = bandEdgesHz(bandCentreHz(x + 1, b), b).lowerHz;
        expectWithin(upper, nextLower, 1e-9 * upper, `b=${b} x=${x}`);
        expectWithin(upper, Math.sqrt(bandCentreHz(x, b) * bandCentreHz(x + 1, b)), 1e-9 * upper, 'mean');
      }
    }
  });

  it('lists the 31 one-third-octave bands from 20 Hz to 20 kHz (common practice: nominal 20 Hz..20 kHz)', () => {
    const bands = bandsBetween(19, 21000, 3);
    expect(bands).toHaveLength(31);
    expectWithin(bands[0].centreHz, 19.952623149688797, 1e-9, 'first');
    expectWithin(bands[30].centreHz, 19952.623149688796, 1e-6, 'last');
    expect(bands.map((b) => b.index)).toEqual(Array.from({ length: 31 }, (_, i) => i - 17));
  });

  it('includes a band whose centre equals an end of the range exactly', () => {
    expect(bandsBetween(1000, 1000, 3).map((b) => b.centreHz)).toEqual([1000]);
  });

  it('names octave bands by their nominal mid-frequencies (ISO 266 preferred numbers)', () => {
    expect([-5, -4, -3, -2, -1, 0, 1, 2, 3, 4].map(nominalOctaveCentreHz)).toEqual([
      31.5, 63, 125, 250, 500, 1000, 2000, 4000, 8000, 16000,
    ]);
  });

  it.each([0, 49, 2.5])('refuses bandsPerOctave = %p, naming the field', (b) => {
    expect(() => bandCentreHz(0, b)).toThrow(CalculationInputError);
    try {
      bandCentreHz(0, b);
    } catch (error) {
      expect((error as CalculationInputError).field).toBe('/bandsPerOctave');
      expect((error as Error).message).toContain(String(b));
    }
  });

  it('refuses a non-positive centre frequency', () => {
    expect(() => bandEdgesHz(0, 3)).toThrow(/centreHz/);
  });
});
