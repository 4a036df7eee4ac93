import { toCsv } from '../../shared/csv';
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

/** The usage report as CSV; a key name is free text, so it gets the formula-injection guard. */
export function usageCsv(rows: UsageRow[]): string {
  return toCsv(
    COLUMNS,
    rows.map((row) => COLUMNS.map((column) => row[column])),
  );
}
