import { toCsv, type CsvCell } from '../csv';
import type { ProcessorExport } from './processor-export';
import { presentationDecimals, roundTo } from '../present';

export interface ExportHeader {
  /** Set when the room changed since the settings were made; written first. */
  stale: { since: string; reasons: string[] } | null;
  tuningId: string;
  version: number;
  name: string;
  roomId: string;
  roomName: string;
  sampleRateHz: number;
  profile: { id: string; name: string } | null;
  createdAt: string;
  isochronVersion: string;
  convention: string;
  cautions: Array<{ code: string; message: string }>;
}

const PARAMETER_COLUMNS = [
  'channel',
  'name',
  'stage',
  'band',
  'type',
  'frequencyHz',
  'gainDb',
  'q',
  'order',
  'delayMs',
  'delaySamples',
  'trimDb',
  'polarity',
  'routeTo',
  'routeGainDb',
] as const;

/**
 * A processor export as CSV: a header block (`field,value` rows, the stale notice first when there is
 * one, then one row per caution), a blank line, the parameters table (one row per channel with its
 * delay, trim and polarity, one per EQ band, crossover and routing), a blank line, and the coefficients
 * table (one row per section, coefficients in the profile's order and sign). Every cell goes through the
 * one CSV writer, so text a spreadsheet would run as a formula (a channel named `=HYPERLINK(…)`) is made
 * inert and numbers stay numbers.
 */
export function processorExportToCsv(header: ExportHeader, exported: ProcessorExport): string {
  const head: CsvCell[][] = [];
  if (header.stale) {
    head.push(['stale', `since ${header.stale.since}: ${header.stale.reasons.join('; ')}`]);
  }
  head.push(
    ['tuningId', header.tuningId],
    ['version', header.version],
    ['name', header.name],
    ['roomId', header.roomId],
    ['roomName', header.roomName],
    ['sampleRateHz', header.sampleRateHz],
    ['profile', header.profile ? `${header.profile.name} (${header.profile.id})` : 'none'],
    ['createdAt', header.createdAt],
    ['isochronVersion', header.isochronVersion],
    ['convention', header.convention],
    ['coefficientOrder', exported.coefficientLayout.order.join(' ')],
    ['feedbackSign', exported.coefficientLayout.feedbackSign],
    ...header.cautions.map((c): CsvCell[] => ['caution', `${c.code}: ${c.message}`]),
  );

  const parameters: CsvCell[][] = [];
  // Parameters are presented as JSON answers present them (shared/present.ts: ms 4 decimals, dB and Hz
  // 2, samples 4), so the CSV and the JSON export agree; coefficients keep every digit.
  const row = (cells: Partial<Record<(typeof PARAMETER_COLUMNS)[number], CsvCell>>): CsvCell[] =>
    PARAMETER_COLUMNS.map((column) => {
      const cell = cells[column] ?? null;
      const decimals = presentationDecimals(column);
      return typeof cell === 'number' && decimals !== undefined ? roundTo(cell, decimals) : cell;
    });
  for (const c of exported.channels) {
    parameters.push(
      row({
        channel: c.id,
        name: c.name ?? null,
        stage: 'output',
        delayMs: c.delayMs,
        delaySamples: c.delaySamples,
        trimDb: c.trimDb,
        polarity: c.polarity,
      }),
    );
    c.eq.forEach((band, i) =>
      parameters.push(
        row({
          channel: c.id,
          stage: 'eq',
          band: i,
          type: band.type,
          frequencyHz: band.frequencyHz,
          gainDb: band.gainDb,
          q: band.q,
        }),
      ),
    );
    for (const [stage, xo] of [
      ['highPass', c.highPass],
      ['lowPass', c.lowPass],
    ] as const) {
      if (xo) {
        parameters.push(
          row({ channel: c.id, stage, type: xo.family, frequencyHz: xo.frequencyHz, order: xo.order }),
        );
      }
    }
  }
  for (const route of exported.bassManagement?.routing ?? []) {
    parameters.push(
      row({
        channel: route.from,
        stage: route.via === 'direct' ? 'lfe' : 'bassManagement',
        routeTo: route.to,
        routeGainDb: route.gainDb,
      }),
    );
  }

  const coefficients: CsvCell[][] = [];
  for (const c of exported.channels) {
    c.eq.forEach((band, i) => coefficients.push([c.id, 'eq', i, ...band.coefficients]));
    for (const [stage, xo] of [
      ['highPass', c.highPass],
      ['lowPass', c.lowPass],
    ] as const) {
      xo?.sections.forEach((s, i) => coefficients.push([c.id, stage, i, ...s]));
    }
  }

  return [
    toCsv(['field', 'value'], head),
    toCsv(PARAMETER_COLUMNS, parameters),
    toCsv(['channel', 'stage', 'section', ...exported.coefficientLayout.order], coefficients),
  ].join('\r\n');
}
