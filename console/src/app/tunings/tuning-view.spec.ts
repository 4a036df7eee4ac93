import { channelCorrection } from '../../../../shared/plan/channel-edit';
import {
  channelFieldOf,
  channelRows,
  correctionChart,
  crossoverLabel,
  limitsSummary,
  versionAuthor,
  versionOrigin,
  versionsPhrase,
} from './tuning-view';
import { downloadName } from './download';

const tuning = {
  sampleRateHz: 48000,
  channels: [
    {
      id: 'M+030',
      delayMs: 1.5636,
      trimDb: -1.6,
      polarity: 'normal' as const,
      eq: [{ type: 'peaking' as const, frequencyHz: 209.7, gainDb: 4, q: 2.3 }],
      highPass: { family: 'linkwitzRiley' as const, order: 4, frequencyHz: 80 },
      bassManaged: true,
    },
    {
      id: 'LFE1',
      delayMs: 0,
      trimDb: -1.2,
      polarity: 'inverted' as const,
      eq: [],
      highPass: null,
      bassManaged: false,
    },
  ],
};

describe('channelRows', () => {
  it('shows delay in samples as the export rounds it, names from the room, and what breaks the limits', () => {
    const rows = channelRows(tuning, { eqMaxBoostDb: 3 }, new Map([['M+030', 'Left']]));
    expect(rows.map((row) => [row.id, row.name, row.delaySamples, row.eqBands])).toEqual([
      ['M+030', 'Left', 75, 1],
      ['LFE1', '', 0, 0],
    ]);
    expect(rows[0].highPass).toBe('Linkwitz-Riley 24 dB/oct, 80\u00a0Hz');
    expect(rows[0].overLimits.map((problem) => problem.field)).toEqual(['/eq/0/gainDb']);
    expect(rows[1].overLimits).toEqual([]);
    expect(rows[1].highPass).toBe('Full range');
  });
});

describe('labels', () => {
  it('describes crossovers by slope (6 dB/oct per order)', () => {
    expect(crossoverLabel({ family: 'butterworth', order: 2, frequencyHz: 120 })).toBe(
      'Butterworth 12 dB/oct, 120\u00a0Hz',
    );
  });

  it('sums up the room limits with true minus signs, or says there are none', () => {
    expect(limitsSummary(null)).toBe('The room sets no processor limits.');
    expect(limitsSummary({})).toBe('The room sets no processor limits.');
    expect(limitsSummary({ delayMaxMs: 75, trimMinDb: -12, trimMaxDb: 12, eqMaxCutDb: 12 })).toBe(
      'Room limits: delay up to 75.0\u00a0ms, trim \u221212.0\u00a0dB to +12.0\u00a0dB, cut down to \u221212.0\u00a0dB.',
    );
  });

  it('names versions by how they were made and by whom, as far as the caller may know', () => {
    expect(versionOrigin({ origin: 'restore', restoredFromVersion: 2 })).toBe('Restored from v2');
    expect(versionOrigin({ origin: 'plan', restoredFromVersion: null })).toBe('Made from a plan');
    expect(versionAuthor({ createdBy: { userId: 'usr_1', keyId: null } }, 'usr_1')).toBe(
      'You, in the console',
    );
    expect(versionAuthor({ createdBy: { userId: 'usr_2', keyId: 'key_9' } }, 'usr_1')).toBe(
      'User usr_2, with key key_9',
    );
    expect(versionAuthor({ createdBy: { userId: null, keyId: null } }, 'usr_1')).toBe('Not known');
  });

  it('counts versions in words where a number reads oddly', () => {
    expect([1, 2, 5].map(versionsPhrase)).toEqual(['Its one version', 'Both versions', 'All 5 versions']);
  });

  it('makes file names from tuning names', () => {
    expect(downloadName('Bass-managed 80 Hz', 3, 'csv')).toBe('Bass-managed-80-Hz-v3.csv');
    expect(downloadName('***', 1, 'json')).toBe('tuning-v1.json');
  });
});

describe('channelFieldOf', () => {
  it('turns the API pointer of the one channel sent into a field of the editor', () => {
    expect(channelFieldOf('/body/channels/0/eq/1/gainDb')).toBe('/eq/1/gainDb');
    expect(channelFieldOf('/body/channels/0')).toBe('');
    expect(channelFieldOf('/body/channels/10/trimDb')).toBeNull();
    expect(channelFieldOf('/body/name')).toBeNull();
  });
});

describe('correctionChart', () => {
  it('draws the whole channel, the EQ alone and the boost ceiling, with a range that holds them', () => {
    const correction = channelCorrection(tuning.channels[0], null, 48000);
    const chart = correctionChart(correction, 'M+030', { eqMaxBoostDb: 3 });
    expect(chart.series.map((series) => series.label)).toEqual([
      'Whole channel (trim, EQ, crossover)',
      'EQ bands',
      'Boost limit +3.0\u00a0dB',
    ]);
    const eqPeak = Math.max(...correction.eqDb);
    expect(eqPeak).toBeGreaterThan(3.9);
    expect(chart.yMax).toBeGreaterThanOrEqual(eqPeak);
    expect(chart.yMin).toBe(-36);
    expect(chart.summary).toMatch(/EQ alone ranges from 0.0\u00a0dB to \+4.0\u00a0dB/);
  });
});
