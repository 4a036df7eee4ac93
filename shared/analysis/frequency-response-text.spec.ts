import { CalculationInputError } from '../errors';
import { parseFrequencyResponseText, requireFrequencyResponse } from './frequency-response-text';

describe('frequency-response text columns', () => {
  it.each([
    ['comma', '20,85.5\n40,86.25\n80,84'],
    ['semicolon', '20;85.5\n40;86.25\n80;84'],
    ['tab', '20\t85.5\n40\t86.25\n80\t84'],
    ['spaces', '  20   85.5\n40 86.25\n80    84  '],
    ['comma and spaces', '20, 85.5\n40, 86.25\n80, 84'],
  ])('reads %s separated columns', (_name, text) => {
    expect(parseFrequencyResponseText(text)).toEqual({
      frequenciesHz: [20, 40, 80],
      magnitudeDb: [85.5, 86.25, 84],
    });
  });

  it('reads a phase column, comment lines, a heading and Windows line ends', () => {
    const text = [
      '* Measurement export (demo data)',
      '# Sweep 20 Hz - 20 kHz',
      'Freq(Hz)  SPL(dB)  Phase(degrees)',
      '',
      '20.0  78.1  -12.5',
      '// mid-file comment',
      '25.0  79.4  -20',
      '31.5  80.0  1.5e1',
    ].join('\r\n');
    expect(parseFrequencyResponseText(text)).toEqual({
      frequenciesHz: [20, 25, 31.5],
      magnitudeDb: [78.1, 79.4, 80],
      phaseDeg: [-12.5, -20, 15],
    });
  });

  it('accepts decimal commas with semicolon or tab separators', () => {
    expect(parseFrequencyResponseText('20,5;-3,25\n40;-2,5')).toEqual({
      frequenciesHz: [20.5, 40],
      magnitudeDb: [-3.25, -2.5],
    });
    expect(parseFrequencyResponseText('20,5\t-3,25\t10,5\n40\t-2,5\t11').phaseDeg).toEqual([10.5, 11]);
  });

  it('ignores columns after the third', () => {
    expect(parseFrequencyResponseText('20 80 10 0.99\n40 81 12 0.98').magnitudeDb).toEqual([80, 81]);
  });

  it.each([
    ['a word in the data', '20 80\n40 loud', /line 2: expected a magnitude/],
    ['a missing magnitude', '20 80\n40', /line 2: expected a magnitude/],
    ['descending frequencies', '40 80\n20 81', /line 2: frequencies must ascend/],
    ['a repeated frequency', '20 80\n20 81', /line 2: frequencies must ascend/],
    ['a zero frequency', '0 80\n20 81', /line 1: frequency must be above 0/],
    ['phase on some rows only', '20 80 1\n40 81', /line 2: some rows have a phase/],
    ['text after the data', '20 80\n40 81\nend of data', /line 3: expected a frequency/],
    ['a single row', '# only\n20 80', /at least 2 data rows/],
    ['nothing', '', /at least 2 data rows/],
  ])('refuses %s with the line named', (_name, text, message) => {
    expect(() => parseFrequencyResponseText(text, '/frequencyResponse')).toThrow(message);
    try {
      parseFrequencyResponseText(text, '/frequencyResponse');
    } catch (error) {
      expect(error).toBeInstanceOf(CalculationInputError);
      expect((error as CalculationInputError).field).toBe('/frequencyResponse');
    }
  });
});

describe('frequency responses given as arrays', () => {
  it('accepts ascending positive frequencies with one magnitude (and phase) each', () => {
    const response = { frequenciesHz: [20, 40], magnitudeDb: [80, 81], phaseDeg: [0, -10] };
    expect(requireFrequencyResponse(response)).toBe(response);
  });

  it.each([
    [{ frequenciesHz: [20], magnitudeDb: [80] }, '/response/frequenciesHz'],
    [{ frequenciesHz: [20, 40], magnitudeDb: [80] }, '/response/magnitudeDb'],
    [{ frequenciesHz: [20, 40], magnitudeDb: [80, 81], phaseDeg: [1] }, '/response/phaseDeg'],
    [{ frequenciesHz: [40, 20], magnitudeDb: [80, 81] }, '/response/frequenciesHz/1'],
    [{ frequenciesHz: [0, 20], magnitudeDb: [80, 81] }, '/response/frequenciesHz/0'],
    [{ frequenciesHz: [20, 40], magnitudeDb: [80, Number.NaN] }, '/response/magnitudeDb/1'],
  ])('refuses %j, naming %s', (response, field) => {
    expect(() => requireFrequencyResponse(response)).toThrow(expect.objectContaining({ field }));
  });
});
