import { calibrationAt, correctResponse, offsetFromSensitivity, parseCalibrationText } from './microphone';

describe('parseCalibrationText', () => {
  it('reads two columns separated by tabs, with a quoted heading and comment lines', () => {
    const text =
      '"Invented mic, serial KY-0417, sens -32.5 dBFS"\n# Hz\tdB\n20\t-1.5\n\n1000\t0\n20000\t2.25\n';
    expect(parseCalibrationText(text, '/calibrationText')).toEqual({
      frequenciesHz: [20, 1000, 20000],
      magnitudeDb: [-1.5, 0, 2.25],
    });
  });

  it.each([
    ['commas', '20,-1,5\n1000,0,0\n20000,2,-10\n'],
    ['spaces', '20 -1 5\n1000   0 0\n20000 2 -10\n'],
    ['tabs', '20\t-1\t5\r\n1000\t0\t0\r\n20000\t2\t-10\r\n'],
  ])('reads three columns separated by %s, the third as phase in degrees', (_name, text) => {
    expect(parseCalibrationText(text, '/calibrationText')).toEqual({
      frequenciesHz: [20, 1000, 20000],
      magnitudeDb: [-1, 0, 2],
      phaseDeg: [5, 0, -10],
    });
  });

  it.each([
    ['a word in a data row', '# cal\n20 -1\n100 x\n', /^line 3: expected a magnitude/],
    ['frequencies out of order', '20 -1\n100 0\n50 0\n', /^line 3: frequencies must ascend/],
    ['a correction beyond ±40 dB', '# cal\n\n20 -1\n1000 94.2\n', /^line 4: a correction of 94.2 dB/],
    ['one data row', '# one\n1000 0\n', /at least 2 data rows/],
  ])('names the line of %s', (_name, text, message) => {
    expect(() => parseCalibrationText(text, '/calibrationText')).toThrow(
      expect.objectContaining({ field: '/calibrationText', message: expect.stringMatching(message) }),
    );
  });

  it('refuses more than 4096 rows', () => {
    const rows = Array.from({ length: 4097 }, (_, i) => `${10 + i} 0`).join('\n');
    expect(() => parseCalibrationText(rows, '/calibrationText')).toThrow(/at most 4096 rows/);
  });
});

describe('calibrationAt', () => {
  const hz = [100, 1000, 10000];
  const db = [-2, 0, 3];
  it('interpolates linearly on a log-frequency axis: the geometric mean sits half way', () => {
    // sqrt(100·1000) = 316.2 Hz is half way between 100 Hz and 1 kHz on a log axis: (−2 + 0)/2.
    expect(calibrationAt(hz, db, Math.sqrt(100 * 1000))).toBeCloseTo(-1, 12);
    // 2 kHz is log10(2) = 0.301 of the way from 1 kHz to 10 kHz.
    expect(calibrationAt(hz, db, 2000)).toBeCloseTo(3 * Math.log10(2), 12);
    expect(calibrationAt(hz, db, 1000)).toBe(0);
  });
  it('holds the end values beyond the ends', () => {
    expect(calibrationAt(hz, db, 20)).toBe(-2);
    expect(calibrationAt(hz, db, 20000)).toBe(3);
  });
});

describe('correctResponse', () => {
  const calibration = { frequenciesHz: [100, 1000, 10000], magnitudeDb: [-2, 0, 3], phaseDeg: [170, 0, -10] };
  it('subtracts the deviation, wraps the corrected phase into (−180, 180] and says where it held flat', () => {
    const { response, applied } = correctResponse(
      { frequenciesHz: [50, 100, 1000, 20000], magnitudeDb: [0, 0, 0, 0], phaseDeg: [-20, -20, 0, 175] },
      calibration,
    );
    expect(response.magnitudeDb).toEqual([2, 2, 0, -3]);
    // −20 − 170 = −190 → 170; 175 − (−10) = 185 → −175.
    expect(response.phaseDeg).toEqual([170, 170, 0, -175]);
    for (const p of response.phaseDeg!) expect(p > -180 && p <= 180).toBe(true);
    expect(applied).toEqual({
      calibratedFromHz: 100,
      calibratedToHz: 10000,
      heldFlatBelowHz: 100,
      heldFlatAboveHz: 10000,
      phaseCorrected: true,
    });
  });
  it('leaves the phase alone when the calibration has none', () => {
    const { response, applied } = correctResponse(
      { frequenciesHz: [200, 500], magnitudeDb: [1, 1], phaseDeg: [10, 20] },
      { frequenciesHz: [100, 1000], magnitudeDb: [1, 1] },
    );
    expect(response).toEqual({ frequenciesHz: [200, 500], magnitudeDb: [0, 0], phaseDeg: [10, 20] });
    expect(applied).toMatchObject({ heldFlatBelowHz: null, heldFlatAboveHz: null, phaseCorrected: false });
  });
});

describe('offsetFromSensitivity', () => {
  it('gives 94 − dBFS at 94 dB SPL, and nothing from mV/Pa alone', () => {
    expect(offsetFromSensitivity({ dbfsAt94DbSpl: -32.5 })).toBe(126.5);
    expect(offsetFromSensitivity({ mvPerPa: 12.5 })).toBeNull();
    expect(offsetFromSensitivity(null)).toBeNull();
  });
});
