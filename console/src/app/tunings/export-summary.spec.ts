import { exportSummary, ROUNDING_NOTICE_DB, type ExportSummaryInput } from './export-summary';

interface ChannelPart {
  id: string;
  delayMs: number;
  delaySamples: number;
  trimDb: number;
  bands: number;
  maxDeviationDb: number;
  atHz: number | null;
}

/** The parts of an export the summary reads. */
function exportOf(profileName: string | null, channels: ChannelPart[]): ExportSummaryInput {
  return {
    header: { profile: profileName === null ? null : { name: profileName } },
    channels: channels.map((c) => ({
      id: c.id,
      delayMs: c.delayMs,
      delaySamples: c.delaySamples,
      trimDb: c.trimDb,
      eq: Array.from({ length: c.bands }, () => ({})),
      eqRounding: { maxDeviationDb: c.maxDeviationDb, atHz: c.atHz },
    })),
  };
}

const left = { id: 'M+030', delayMs: 1.5625, delaySamples: 75, trimDb: -1.5, bands: 3 };

describe('exportSummary', () => {
  it('names the worst channel, where, and how many pass the notice figure', () => {
    const s = exportSummary(
      exportOf('Generic 8-band', [
        { ...left, maxDeviationDb: 0.1, atHz: 117 },
        { ...left, id: 'LFE1', maxDeviationDb: 0.62, atHz: 45.6 },
        { ...left, id: 'M+000', maxDeviationDb: 0.55, atHz: 2000 },
      ]),
    );
    expect(s.notableCount).toBe(2);
    expect(s.rows.map((r) => r.notable)).toEqual([false, true, true]);
    expect(s.headline).toContain('Generic 8-band');
    expect(s.headline).toContain('0.62\u00a0dB (LFE1 at 45.6 Hz)');
    expect(s.headline).toContain(`2 channels by more than ${ROUNDING_NOTICE_DB} dB`);
    expect(s.rows[2].rounding).toBe('0.55\u00a0dB at 2k Hz');
  });

  it('says rounding cost nothing for exact values, and shows fractional samples to two places', () => {
    const s = exportSummary(
      exportOf(null, [
        { ...left, delayMs: 1.56, delaySamples: 74.88, maxDeviationDb: 0.001, atHz: 100 },
        { ...left, id: 'M-030', bands: 0, maxDeviationDb: 0, atHz: null },
      ]),
    );
    expect(s.headline).toBe(
      'Rounding to exact values (no processor profile) changes no channel’s EQ by 0.01 dB or more.',
    );
    expect(s.notableCount).toBe(0);
    expect(s.rows[0].delay).toBe('1.560\u00a0ms (74.88 samples)');
    expect(s.rows[0].rounding).toBe('under 0.01 dB');
    expect(s.rows[0].trim).toBe('\u22121.50\u00a0dB');
    expect(s.rows[1].rounding).toBe('no EQ');
    expect(s.rows[1].delay).toBe('1.563\u00a0ms (75 samples)'); // 1.5625 is exact in binary; toFixed rounds it up
  });

  it('keeps every channel within the notice figure in the headline when none passes it', () => {
    const s = exportSummary(exportOf('P', [{ ...left, maxDeviationDb: 0.3, atHz: 40 }]));
    expect(s.headline).toContain(`every channel within ${ROUNDING_NOTICE_DB} dB`);
  });
});
