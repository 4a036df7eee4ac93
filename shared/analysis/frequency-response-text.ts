import { CalculationInputError } from '../errors';

export interface ParsedFrequencyResponse {
  frequenciesHz: number[];
  magnitudeDb: number[];
  /** Present when every data row has a third column. */
  phaseDeg?: number[];
}

/** Most data rows accepted in one text response. */
export const MAX_TEXT_RESPONSE_ROWS = 100000;

const COMMENT_PREFIXES = ['#', '*', ';', '//', '%', '!'];
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function splitFields(line: string): { fields: string[]; decimalComma: boolean } {
  if (line.includes(';')) return { fields: line.split(';'), decimalComma: true };
  if (line.includes('\t')) return { fields: line.split('\t'), decimalComma: true };
  if (line.includes(',')) return { fields: line.split(','), decimalComma: false };
  return { fields: line.split(/\s+/), decimalComma: false };
}

function parseNumber(text: string, decimalComma: boolean): number | null {
  const normalised = decimalComma ? text.replace(',', '.') : text;
  return NUMBER.test(normalised) ? Number(normalised) : null;
}

/**
 * Reads a frequency response exported as text columns: frequency in hertz, magnitude in dB and an optional
 * phase in degrees; further columns are ignored. Columns are separated by commas, semicolons, tabs or
 * spaces; with semicolons or tabs a decimal comma is accepted. Blank lines and lines starting with `#`,
 * `*`, `;`, `//`, `%` or `!` are comments; text lines before the first data row are taken as headings.
 *
 * @param text the file's text.
 * @param field JSON-pointer-like name of the input, used in errors (default `/text`).
 * @throws CalculationInputError naming the line when a row is malformed, a frequency is not positive or not
 *   ascending, rows disagree on the phase column, or there are fewer than 2 or more than 100 000 rows.
 */
export function parseFrequencyResponseText(text: string, field = '/text'): ParsedFrequencyResponse {
  const frequenciesHz: number[] = [];
  const magnitudeDb: number[] = [];
  const phaseDeg: number[] = [];
  let rowsWithPhase = 0;
  const lineError = (lineNumber: number, message: string) =>
    new CalculationInputError(`line ${lineNumber}: ${message}`, field);

  text.split(/\r\n|\r|\n/).forEach((rawLine, i) => {
    const lineNumber = i + 1;
    const line = rawLine.trim();
    if (line === '' || COMMENT_PREFIXES.some((prefix) => line.startsWith(prefix))) return;
    const { fields, decimalComma } = splitFields(line);
    const cells = fields.map((cell) => cell.trim()).filter((cell, index) => cell !== '' || index < 2);
    const frequency = parseNumber(cells[0] ?? '', decimalComma);
    if (frequency === null) {
      if (frequenciesHz.length === 0) return;
      throw lineError(lineNumber, `expected a frequency in hertz, found "${cells[0]}"`);
    }
    const magnitude = parseNumber(cells[1] ?? '', decimalComma);
    if (magnitude === null)
      throw lineError(
        lineNumber,
        `expected a magnitude in dB in the second column, found "${cells[1] ?? ''}"`,
      );
    if (!(frequency > 0) || !Number.isFinite(frequency))
      throw lineError(lineNumber, `frequency must be above 0 Hz; found ${frequency}`);
    if (frequenciesHz.length > 0 && frequency <= frequenciesHz[frequenciesHz.length - 1]) {
      throw lineError(
        lineNumber,
        `frequencies must ascend; ${frequency} Hz follows ${frequenciesHz[frequenciesHz.length - 1]} Hz`,
      );
    }
    if (!Number.isFinite(magnitude))
      throw lineError(lineNumber, `magnitude must be a finite number of dB; found ${magnitude}`);
    if (frequenciesHz.length >= MAX_TEXT_RESPONSE_ROWS)
      throw lineError(lineNumber, `at most ${MAX_TEXT_RESPONSE_ROWS} rows are accepted`);
    frequenciesHz.push(frequency);
    magnitudeDb.push(magnitude);
    if (cells.length >= 3 && cells[2] !== '') {
      const phase = parseNumber(cells[2], decimalComma);
      if (phase === null || !Number.isFinite(phase))
        throw lineError(lineNumber, `expected a phase in degrees in the third column, found "${cells[2]}"`);
      phaseDeg.push(phase);
      rowsWithPhase++;
    }
    if (rowsWithPhase !== 0 && rowsWithPhase !== frequenciesHz.length) {
      throw lineError(lineNumber, 'some rows have a phase column and others do not');
    }
  });

  if (frequenciesHz.length < 2) {
    throw new CalculationInputError(
      `a frequency response needs at least 2 data rows (frequency, dB); found ${frequenciesHz.length}`,
      field,
    );
  }
  return rowsWithPhase > 0 ? { frequenciesHz, magnitudeDb, phaseDeg } : { frequenciesHz, magnitudeDb };
}

/**
 * Checks a frequency response given as arrays: 2..100 000 points, frequencies above 0 and strictly
 * ascending, finite magnitudes, and a phase per point when phase is given.
 * @param field JSON-pointer-like path of the response, used in errors (e.g. `/response`).
 * @returns the same response.
 */
export function requireFrequencyResponse(
  response: ParsedFrequencyResponse,
  field = '/response',
): ParsedFrequencyResponse {
  const { frequenciesHz, magnitudeDb, phaseDeg } = response;
  if (frequenciesHz.length < 2 || frequenciesHz.length > MAX_TEXT_RESPONSE_ROWS) {
    throw new CalculationInputError(
      `a frequency response needs 2..${MAX_TEXT_RESPONSE_ROWS} points; received ${frequenciesHz.length}`,
      `${field}/frequenciesHz`,
    );
  }
  for (const [name, values] of [
    ['magnitudeDb', magnitudeDb],
    ['phaseDeg', phaseDeg],
  ] as const) {
    if (values !== undefined && values.length !== frequenciesHz.length) {
      throw new CalculationInputError(
        `${name} must have one value per frequency (${frequenciesHz.length}); received ${values.length}`,
        `${field}/${name}`,
      );
    }
  }
  frequenciesHz.forEach((f, i) => {
    if (!(f > 0) || !Number.isFinite(f) || (i > 0 && f <= frequenciesHz[i - 1])) {
      throw new CalculationInputError(
        `frequencies must be above 0 Hz and ascend; ${f} Hz at index ${i} does not`,
        `${field}/frequenciesHz/${i}`,
      );
    }
  });
  magnitudeDb.forEach((db, i) => {
    if (!Number.isFinite(db)) {
      throw new CalculationInputError(
        `magnitude must be finite; received ${db}`,
        `${field}/magnitudeDb/${i}`,
      );
    }
  });
  return response;
}
