import { formatFrequency, frequencyTickLabel } from './frequency-ticks';

describe('formatFrequency', () => {
  it('writes kilohertz with a k and keeps three significant digits', () => {
    expect(formatFrequency(20)).toBe('20');
    expect(formatFrequency(1000)).toBe('1k');
    expect(formatFrequency(2500)).toBe('2.5k');
    expect(formatFrequency(20000)).toBe('20k');
    expect(formatFrequency(31.25)).toBe('31.3');
    expect(formatFrequency(Number.NaN)).toBe('');
  });
});

describe('frequencyTickLabel', () => {
  it('labels only the 1-2-5 steps of each decade', () => {
    const ticks = [10, 20, 30, 40, 50, 60, 100, 200, 300, 500, 700, 1000, 2000, 5000, 8000, 10000, 20000];
    expect(ticks.map(frequencyTickLabel)).toEqual([
      '10',
      '20',
      '',
      '',
      '50',
      '',
      '100',
      '200',
      '',
      '500',
      '',
      '1k',
      '2k',
      '5k',
      '',
      '10k',
      '20k',
    ]);
  });

  it('treats floating-point neighbours of a step as the step and refuses non-positive values', () => {
    expect(frequencyTickLabel(199.99999999999997)).toBe('200');
    expect(frequencyTickLabel(299.99999999999994)).toBe('');
    expect(frequencyTickLabel(2.0000000000000004)).toBe('2');
    expect(frequencyTickLabel(0)).toBe('');
    expect(frequencyTickLabel(-100)).toBe('');
  });
});
