/** One cell of a CSV export: text is guarded, numbers are written as numbers, null is an empty cell. */
export type CsvCell = string | number | boolean | null | undefined;

/**
 * Text whose first visible character a spreadsheet reads as the start of a formula (`=`, `+`, `-`, `@`,
 * their full-width forms `＝＋－＠`), or that starts with a tab or carriage return. Leading spaces are
 * skipped first: some spreadsheets trim them and then run the formula.
 */
const FORMULA_START = /^(?:[\t\r]|[\s\u3000]*[=+\-@\uFF1D\uFF0B\uFF0D\uFF20])/;

/**
 * One CSV cell (RFC 4180 quoting). Text that could run as a formula gets a leading apostrophe and is
 * quoted, as the OWASP "CSV Injection" guidance advises. The guard goes by type, not by first
 * character alone: a number stays a number (a trim of −1.6 dB is written `-1.6`), or every spreadsheet
 * and processor import would read it as text.
 */
export function csvCell(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return String(value);
  const guarded = FORMULA_START.test(value);
  const text = guarded ? `'${value}` : value;
  return guarded || /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** A whole CSV document: a header line, one line per row, CRLF line ends (RFC 4180). */
export function toCsv(header: readonly string[], rows: ReadonlyArray<readonly CsvCell[]>): string {
  const lines = [header.map(csvCell).join(',')];
  for (const row of rows) lines.push(row.map(csvCell).join(','));
  return lines.join('\r\n') + '\r\n';
}
