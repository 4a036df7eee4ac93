import {
  MAX_UPLOAD_BYTES,
  decayRows,
  defaultSelection,
  eqFitRequest,
  levelRange,
  measuredLabel,
  measurementRows,
  modeRows,
  responseChart,
  uploadFieldErrors,
  uploadProblems,
} from './measurement-view';
import { MAX_FIT_POINTS } from '../../../../../shared/limits';
import type { Measurement, RoomMode } from './measurement.model';

function measurement(partial: Partial<Measurement> & Pick<Measurement, 'id' | 'kind'>): Measurement {
  return {
    roomId: 'room_1',
    channel: 'M+030',
    micPosition: 'MLP',
    name: null,
    notes: null,
    source: { type: 'json' },
    summary: {},
    stage: 'before',
    tuningId: null,
    tuningVersion: null,
    createdAt: '2026-03-14T10:00:00.000Z',
    ...partial,
  };
}

const IR = measurement({
  id: 'meas_ir',
  kind: 'impulseResponse',
  channel: 'M+090',
  summary: { arrivalMs: 8.146, peakDbfs: -3.04, energyDb: -1, edtS: 0.29, t20S: 0.3, t30S: 0.305 },
});
const SPL = measurement({ id: 'meas_spl', kind: 'spl', summary: { splDb: 84.6, weighting: 'C' } });
const FR = measurement({
  id: 'meas_fr',
  kind: 'frequencyResponse',
  summary: { points: 121, fromHz: 20, toHz: 20000 },
});

describe('measurementRows', () => {
  it('shows arrival, peak level and T30 for an impulse response only', () => {
    const [ir, spl, fr] = measurementRows([IR, SPL, FR]);
    expect(ir).toMatchObject({
      kind: 'Impulse response',
      kindShort: 'IR',
      arrival: '8.15\u00a0ms',
      level: '\u22123.0\u00a0dBFS peak',
      t30: '0.30\u00a0s',
      hasResponse: true,
    });
    expect(spl).toMatchObject({ kind: 'SPL reading', arrival: '—', level: '84.6\u00a0dB (C)', t30: '—' });
    expect(spl.hasResponse).toBe(false);
    expect(fr).toMatchObject({ kind: 'Frequency response', level: '20–20k Hz', arrival: '—' });
  });

  it('reads a missing decay time as a dash rather than zero', () => {
    const [row] = measurementRows([measurement({ ...IR, summary: { ...IR.summary, t30S: null } })]);
    expect(row.t30).toBe('—');
  });
});

describe('defaultSelection', () => {
  it('prefers the newest impulse response, then the newest response, never an SPL reading', () => {
    const laterIr = measurement({ id: 'meas_ir2', kind: 'impulseResponse' });
    expect(defaultSelection([IR, FR, laterIr, SPL])).toBe('meas_ir2');
    expect(defaultSelection([SPL, FR])).toBe('meas_fr');
    expect(defaultSelection([SPL])).toBeNull();
    expect(defaultSelection([])).toBeNull();
  });
});

describe('uploadProblems', () => {
  const channels = ['M+030', 'M-030'];
  const file = { name: 'left.wav', size: 96044 };

  it('accepts a complete draft', () => {
    expect(uploadProblems({ channel: 'M+030', micPosition: 'MLP', file }, channels)).toEqual([]);
  });

  it('names each missing or bad field', () => {
    const problems = uploadProblems({ channel: '', micPosition: '  ', file: null }, channels);
    expect(problems.map((p) => p.field)).toEqual(['channel', 'micPosition', 'file']);
    expect(uploadProblems({ channel: 'U+045', micPosition: 'MLP', file }, channels)[0].message).toMatch(
      /U\+045 is not a loudspeaker/,
    );
  });

  it('applies the API limits: 32 characters of mic position, a non-empty file of at most 20 MiB', () => {
    expect(uploadProblems({ channel: 'M+030', micPosition: 'x'.repeat(32), file }, channels)).toEqual([]);
    expect(
      uploadProblems({ channel: 'M+030', micPosition: 'x'.repeat(33), file }, channels)[0].message,
    ).toMatch(/at most 32 characters \(this has 33\)/);
    const big = { name: 'big.wav', size: MAX_UPLOAD_BYTES + 1 };
    expect(uploadProblems({ channel: 'M+030', micPosition: '1', file: big }, channels)[0].message).toMatch(
      /20\.0 MiB; the limit is 20 MiB/,
    );
    const atLimit = { name: 'ok.wav', size: MAX_UPLOAD_BYTES };
    expect(uploadProblems({ channel: 'M+030', micPosition: '1', file: atLimit }, channels)).toEqual([]);
    expect(
      uploadProblems({ channel: 'M+030', micPosition: '1', file: { name: 'e.wav', size: 0 } }, channels)[0]
        .message,
    ).toBe('e.wav is empty.');
  });
});

describe('eqFitRequest', () => {
  const measured = { frequenciesHz: [20, 40, 80, 160], magnitudeDb: [85, 90, 84, 83] };
  const limits = { eqBandsPerChannel: 6, eqMaxBoostDb: 3, eqMaxCutDb: 10 };

  it('cuts only by default and takes bands and cut depth from the room limits', () => {
    expect(eqFitRequest(measured, limits, 48000, false)).toEqual({
      sampleRateHz: 48000,
      measured,
      target: { kind: 'flat' },
      maxBands: 6,
      maxBoostDb: 0,
      maxCutDb: 10,
    });
  });

  it('passes the room volume and a measured reverberation time for the transition frequency', () => {
    expect(
      eqFitRequest(measured, limits, 48000, false, { volumeM3: 137.7, reverberationTimeS: 0.31 }).room,
    ).toEqual({
      volumeM3: 137.7,
      reverberationTimeS: 0.31,
    });
    expect(
      eqFitRequest(measured, limits, 48000, false, { volumeM3: 137.7, reverberationTimeS: null }).room,
    ).toEqual({
      volumeM3: 137.7,
    });
    expect(eqFitRequest(measured, limits, 48000, false).room).toBeUndefined();
  });

  it('allows boosts only up to the room limit, and none when the room has no boost limit', () => {
    expect(eqFitRequest(measured, limits, 48000, true).maxBoostDb).toBe(3);
    expect(eqFitRequest(measured, null, 96000, true)).toMatchObject({
      maxBoostDb: 0,
      maxBands: 8,
      maxCutDb: 12,
      sampleRateHz: 96000,
    });
  });

  it('drops points the API would refuse and thins long responses to the point cap on a log scale, keeping both ends', () => {
    const odd = {
      frequenciesHz: [0, 20, 40, 80, 200000],
      magnitudeDb: [80, Number.NaN, -400, 81, 82],
    };
    expect(eqFitRequest(odd, null, 48000, false).measured).toEqual({
      frequenciesHz: [80],
      magnitudeDb: [81],
    });
    const n = 40000;
    const long = {
      frequenciesHz: Array.from({ length: n }, (_, i) => 10 + i),
      magnitudeDb: Array.from({ length: n }, (_, i) => i % 7),
    };
    const thinned = eqFitRequest(long, null, 48000, false).measured;
    expect(thinned.frequenciesHz.length).toBeLessThanOrEqual(MAX_FIT_POINTS);
    // Below about 120 Hz the 1-Hz points are sparser than the log grid, so fewer than the cap are kept.
    expect(thinned.frequenciesHz.length).toBeGreaterThan(MAX_FIT_POINTS * 0.75);
    // Log spacing keeps the 1-Hz points at the low end, where room modes sit: at 1024 points over
    // 12 octaves a step is 0.8 % of the frequency, under 1 Hz below about 120 Hz.
    for (let f = 10; f <= 100; f += 1) expect(thinned.frequenciesHz).toContain(f);
    expect(thinned.frequenciesHz[0]).toBe(10);
    expect(thinned.frequenciesHz.at(-1)).toBe(10 + n - 1);
    expect(thinned.frequenciesHz.every((f, i) => i === 0 || f > thinned.frequenciesHz[i - 1])).toBe(true);
    thinned.frequenciesHz.forEach((f, i) => expect(thinned.magnitudeDb[i]).toBe((f - 10) % 7));
  });
});

describe('decayRows and modeRows', () => {
  it('lists the octave bands then the broadband figures', () => {
    const rows = decayRows({ edtS: 0.31, t20S: 0.3, t30S: null, centreHz: 0, nominalHz: 0 }, [
      { centreHz: 125.89, nominalHz: 125, edtS: 0.42, t20S: 0.4, t30S: 0.41 },
      { centreHz: 1000, nominalHz: 1000, edtS: null, t20S: 0.25, t30S: 0.26 },
    ]);
    expect(rows).toEqual([
      { band: '125 Hz', edt: '0.42\u00a0s', t20: '0.40\u00a0s', t30: '0.41\u00a0s' },
      { band: '1k Hz', edt: '—', t20: '0.25\u00a0s', t30: '0.26\u00a0s' },
      { band: 'Broadband', edt: '0.31\u00a0s', t20: '0.30\u00a0s', t30: '—' },
    ]);
  });

  it('sorts modes upward and keeps the requested count', () => {
    const modes: RoomMode[] = [
      { nx: 1, ny: 0, nz: 0, frequencyHz: 28.14, kind: 'axial' },
      { nx: 0, ny: 1, nz: 0, frequencyHz: 23.19, kind: 'axial' },
      { nx: 1, ny: 1, nz: 0, frequencyHz: 36.47, kind: 'tangential' },
    ];
    expect(modeRows(modes, 2)).toEqual([
      { frequency: '23.2\u00a0Hz', kind: 'axial', indices: '0, 1, 0' },
      { frequency: '28.1\u00a0Hz', kind: 'axial', indices: '1, 0, 0' },
    ]);
  });
});

describe('levelRange', () => {
  it('holds every level with at least 3 dB to spare, on whole steps', () => {
    const range = levelRange([72.7, 85.1, 92.9]);
    expect(range.min).toBeLessThanOrEqual(72.7 - 3);
    expect(range.max).toBeGreaterThanOrEqual(92.9 + 3);
    expect(range.min % range.step).toBe(0);
    expect(range.max % range.step).toBe(0);
  });

  it('cuts a deep roll-off off at 50 dB below the top', () => {
    const range = levelRange([0, -10, -120]);
    expect(range.max).toBe(10);
    expect(range.min).toBe(-50);
  });
});

describe('responseChart', () => {
  const measured = {
    label: measuredLabel('M+030', ['MLP', '2']),
    frequenciesHz: [20, 40, 80, 160, 320],
    magnitudeDb: [85, 90, 84, 83, 82],
  };
  const fit = {
    predicted: { frequenciesHz: [20, 40, 80, 160, 320], magnitudeDb: [84, 84.5, 83.5, 83, 82] },
    targetOffsetDb: 83.2,
    fromHz: 20,
    toHz: 320,
  };
  const modes: RoomMode[] = [
    { nx: 0, ny: 1, nz: 0, frequencyHz: 23.19, kind: 'axial' },
    { nx: 1, ny: 1, nz: 0, frequencyHz: 36.47, kind: 'tangential' },
    { nx: 0, ny: 0, nz: 6, frequencyHz: 337.6, kind: 'axial' },
  ];

  it('overlays measured, predicted and the flat target at the fit level across the fit band', () => {
    const spec = responseChart({ measured, fit });
    expect(spec.xScale).toBe('log');
    expect(spec.series.map((s) => s.label)).toEqual([
      'M+030: spatial average of 2 positions (MLP, 2)',
      'Predicted with the fitted EQ',
      'Target (flat)',
    ]);
    expect(spec.series[2].points).toEqual([
      { x: 20, y: 83.2 },
      { x: 320, y: 83.2 },
    ]);
    expect(spec.summary).toMatch(/flat target at 83\.2 dB from 20 to 320 Hz/);
  });

  it('marks axial modes below 300 Hz along the bottom and draws the Schroeder frequency full height', () => {
    const spec = responseChart({ measured, fit: null, modes, schroederFrequencyHz: 212.4 });
    const markers = spec.series.find((s) => s.label === 'Axial room modes');
    expect(markers?.points?.map((p) => p.x)).toEqual([23.19]);
    expect(markers?.points?.[0].y).toBeGreaterThan(spec.yMin as number);
    expect(markers?.points?.[0].y).toBeLessThan(82);
    const schroeder = spec.series.find((s) => s.label.startsWith('Schroeder'));
    expect(schroeder?.points).toEqual([
      { x: 212.4, y: spec.yMin },
      { x: 212.4, y: spec.yMax },
    ]);
    expect(spec.summary).toMatch(/Schroeder frequency 212 Hz/);
  });

  it('leaves out markers and the line when the room is unknown', () => {
    const spec = responseChart({ measured, schroederFrequencyHz: null });
    expect(spec.series).toHaveLength(1);
    expect(measuredLabel('LFE1', ['MLP'])).toBe('LFE1: measured at MLP');
  });
});

describe('uploadFieldErrors', () => {
  it('names fields as the form does and drops an error that repeats the detail', () => {
    const detail = 'The file is truncated or incomplete: it has no format chunk.';
    expect(
      uploadFieldErrors(detail, [
        { pointer: '/body/file', message: detail },
        { pointer: '/body/channel', message: 'is not a loudspeaker of this room' },
        { pointer: '/body/other', message: 'is odd' },
        { pointer: '', message: 'bare' },
      ]),
    ).toEqual(['Loudspeaker: is not a loudspeaker of this room', '/body/other: is odd', 'bare']);
  });
});
