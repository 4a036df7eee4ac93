import type { UsageRow } from './usage-report';

const COLUMNS: Array<keyof UsageRow> = [
  'bucket',
  'keyId',
  'keyName',
  'userId',
  'route',
  'count',
  'errorCount',
];

/**
 * One CSV cell (RFC 4180). Text that a spreadsheet would run as a formula (starting with `=`, `+`, `-`,
 * `@`, tab or carriage return: a key name is free text) gets a leading apostrophe, as the OWASP
 * "CSV injection" guidance advises.
 */
export function csvCell(value: string | number | null): string {
  if (value === null) return '';
  if (typeof value === 'number') return String(value);
  const text = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The report as CSV with a header line and CRLF line ends (RFC 4180). */
export function usageCsv(rows: UsageRow[]): string {
  const lines = [COLUMNS.join(',')];
  for (const row of rows) lines.push(COLUMNS.map((column) => csvCell(row[column])).join(','));
  return lines.join('\r\n') + '\r\n';
}
