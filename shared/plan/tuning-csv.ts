import { toCsv, type CsvCell } from '../csv';
import type { DesignedTuning } from './tuning-design';

const HEADER = [
  'channel',
  'delayMs',
  'delaySamples',
  'trimDb',
  'polarity',
  'stage',
  'section',
  'filterType',
  'b0',
  'b1',
  'b2',
  'a1',
  'a2',
];

/**
 * A designed tuning as CSV (RFC 4180: comma-separated, CRLF line ends, quoted where needed): one row
 * per section with the channel's delay, trim and polarity repeated, and one row with empty filter
 * columns for a channel without sections. Text cells (a channel's id is free text) get the
 * formula-injection guard of `toCsv`; numbers are written as numbers. Coefficients are written with JavaScript's shortest
 * round-trip form, so parsing them gives back the exact doubles. Sections are a0 = 1 with the
 * `+a1, +a2` denominator.
 */
export function tuningToCsv(designed: DesignedTuning): string {
  const rows: CsvCell[][] = [];
  for (const c of designed.channels) {
    const head = [c.id, c.delayMs, c.delaySamples, c.trimDb, c.polarity];
    if (c.sections.length === 0) rows.push([...head, null, null, null, null, null, null, null, null]);
    c.sections.forEach((s, i) =>
      rows.push([...head, s.stage, i, s.type ?? null, s.b0, s.b1, s.b2, s.a1, s.a2]),
    );
  }
  return toCsv(HEADER, rows);
}
