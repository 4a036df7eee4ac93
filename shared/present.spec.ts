import { presentationDecimals, presentationReplacer, presentNumbers, roundTo } from './present';

// The rule is the contract's (openapi.yaml, "Numbers in answers"); these checks spell its cases out.
describe('presentation rule for numbers in answers', () => {
  it('reads the unit from the property name', () => {
    expect(presentationDecimals('delayMs')).toBe(4);
    expect(presentationDecimals('delayMsDifference')).toBe(4);
    expect(presentationDecimals('trimDb')).toBe(2);
    expect(presentationDecimals('peakDbfs')).toBe(2);
    expect(presentationDecimals('rmsDbfsSineReferenced')).toBe(2);
    expect(presentationDecimals('frequenciesHz')).toBe(2);
    expect(presentationDecimals('delaySamples')).toBe(4);
    expect(presentationDecimals('quantizationErrorUs')).toBe(1);
    for (const full of [
      'b0',
      'a2',
      'q',
      'distanceM',
      'azimuthDeg',
      'status',
      'samples',
      'items',
      'version',
    ]) {
      expect(presentationDecimals(full)).toBeUndefined();
    }
  });

  it('rounds half away from zero without float noise, and never answers −0', () => {
    expect(roundTo(-1.5999999999999943, 2)).toBe(-1.6);
    expect(String(roundTo(-1.5999999999999943, 2))).toBe('-1.6');
    expect(roundTo(2.25e-13, 4)).toBe(0);
    expect(Object.is(roundTo(-2.25e-13, 4), 0)).toBe(true);
    expect(roundTo(0.125, 2)).toBe(0.13);
    expect(roundTo(-0.125, 2)).toBe(-0.13);
    expect(String(roundTo(20.24184057376063, 2))).toBe('20.24');
    expect(roundTo(Number.NaN, 2)).toBeNaN();
  });

  it('rounds unit-named values and arrays, keeps coefficients and other numbers, leaves the input alone', () => {
    const answer = {
      delayMs: 1.23456789,
      channels: [{ id: 'M+030', trimDb: -1.5999999999999943, q: 0.7071067811865476 }],
      magnitudeDb: [0.123456, -2.25e-13],
      residualRmsDb: { before: 0.9734962476279889, after: 0.5 },
      sections: [{ b0: 0.99123456789, a1: -1.98123456789 }],
      name: 'delay 1.23456789 ms',
    };
    const copy = structuredClone(answer);
    const expected = {
      delayMs: 1.2346,
      channels: [{ id: 'M+030', trimDb: -1.6, q: 0.7071067811865476 }],
      magnitudeDb: [0.12, 0],
      residualRmsDb: { before: 0.97, after: 0.5 },
      sections: [{ b0: 0.99123456789, a1: -1.98123456789 }],
      name: 'delay 1.23456789 ms',
    };
    expect(presentNumbers(answer)).toEqual(expected);
    expect(answer).toEqual(copy);
    // The replacer Express uses writes the same text as presenting first.
    expect(JSON.parse(JSON.stringify(answer, presentationReplacer))).toEqual(expected);
  });
});
