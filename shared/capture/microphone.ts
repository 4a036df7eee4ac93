import { parseFrequencyResponseText } from '../analysis/frequency-response-text';
import { wrapDegrees } from '../dsp/response';
import { CalculationInputError } from '../errors';
import { MAX_CALIBRATION_DB, MAX_CALIBRATION_POINTS } from '../limits';

/**
 * A measurement microphone's calibration: its own response deviation from flat, in dB (and optionally
 * its phase, degrees), as the calibration files that come with measurement microphones list it (common
 * practice). Measured responses are corrected by subtracting it.
 */
export interface MicrophoneCalibration {
  frequenciesHz: number[];
  magnitudeDb: number[];
  phaseDeg?: number[];
}

/**
 * Reads a calibration file: two or three columns (frequency in Hz, correction in dB, optional phase in
 * degrees), separated by commas, tabs or spaces (semicolons too, with decimal commas); blank lines,
 * comment lines (`#`, `*`, `;`, `//`, `%`, `!`) and text lines before the data (a quoted heading with the
 * serial and sensitivity, say) are skipped. Errors name the line.
 *
 * @param field the request field holding the text, for errors.
 * @throws CalculationInputError naming the line: a malformed row, frequencies not ascending, a correction
 *   beyond ±{@link MAX_CALIBRATION_DB} dB, fewer than 2 or more than {@link MAX_CALIBRATION_POINTS} rows.
 */
export function parseCalibrationText(text: string, field: string): MicrophoneCalibration {
  const parsed = parseFrequencyResponseText(text, field);
  if (parsed.frequenciesHz.length > MAX_CALIBRATION_POINTS) {
    throw new CalculationInputError(
      `a calibration may have at most ${MAX_CALIBRATION_POINTS} rows; this one has ${parsed.frequenciesHz.length}`,
      field,
    );
  }
  const lines = dataLineNumbers(text);
  parsed.magnitudeDb.forEach((db, i) => {
    if (Math.abs(db) > MAX_CALIBRATION_DB) {
      throw new CalculationInputError(
        `line ${lines[i]}: a correction of ${db} dB is beyond ±${MAX_CALIBRATION_DB} dB; is the second column the correction in dB?`,
        field,
      );
    }
  });
  return parsed;
}

/** The line number of each data row, as the parser counts them (the same rules, numbers only). */
function dataLineNumbers(text: string): number[] {
  const out: number[] = [];
  text.split(/\r\n|\r|\n/).forEach((raw, i) => {
    const cell = raw.trim().split(/[;\t,\s]+/)[0] ?? '';
    if (/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(cell)) out.push(i + 1);
  });
  return out;
}

/** Sensitivity of the microphone as its data sheet gives it: mV/Pa, or the level it reads at 94 dB SPL. */
export type MicrophoneSensitivity = { mvPerPa: number } | { dbfsAt94DbSpl: number };

/** 94 dB SPL is 1 Pa (20·log10(1 / 20 µPa) = 93.98 dB, IEC 60942 calibrators use 94.0 dB). */
export const PASCAL_SPL_DB = 94;

/**
 * The dBFS-to-SPL offset a sensitivity gives: with the level read at 94 dB SPL, SPL = dBFS + (94 − that);
 * mV/Pa alone gives none (the interface's gain between volts and full scale is unknown).
 */
export function offsetFromSensitivity(sensitivity: MicrophoneSensitivity | null): number | null {
  return sensitivity && 'dbfsAt94DbSpl' in sensitivity ? PASCAL_SPL_DB - sensitivity.dbfsAt94DbSpl : null;
}

/** Where the correction was applied and what it held flat. */
export interface CorrectionApplied {
  /** The calibration's own range, hertz. */
  calibratedFromHz: number;
  calibratedToHz: number;
  /** The response's frequencies below/above that range got the end value (null when none). */
  heldFlatBelowHz: number | null;
  heldFlatAboveHz: number | null;
  phaseCorrected: boolean;
}

/**
 * The calibration's value at a frequency: linear in log frequency between neighbouring points (the
 * calibration grids are logarithmic, so this follows them), held at the end values beyond them.
 */
export function calibrationAt(
  frequenciesHz: readonly number[],
  values: readonly number[],
  f: number,
): number {
  const n = frequenciesHz.length;
  if (f <= frequenciesHz[0]) return values[0];
  if (f >= frequenciesHz[n - 1]) return values[n - 1];
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (frequenciesHz[mid] <= f) lo = mid;
    else hi = mid;
  }
  const t = Math.log(f / frequenciesHz[lo]) / Math.log(frequenciesHz[hi] / frequenciesHz[lo]);
  return values[lo] + t * (values[hi] - values[lo]);
}

/**
 * A response corrected by the microphone's calibration: its deviation subtracted from the magnitude (and
 * from the phase, when both carry phase). Frequencies outside the calibration get its end values.
 */
export function correctResponse<
  R extends { frequenciesHz: number[]; magnitudeDb: number[]; phaseDeg?: number[] },
>(response: R, calibration: MicrophoneCalibration): { response: R; applied: CorrectionApplied } {
  const cal = calibration;
  const from = cal.frequenciesHz[0];
  const to = cal.frequenciesHz[cal.frequenciesHz.length - 1];
  const magnitudeDb = response.magnitudeDb.map(
    (db, i) => db - calibrationAt(cal.frequenciesHz, cal.magnitudeDb, response.frequenciesHz[i]),
  );
  const calPhase = cal.phaseDeg;
  const phaseCorrected = response.phaseDeg !== undefined && calPhase !== undefined;
  const phaseDeg =
    response.phaseDeg && calPhase
      ? response.phaseDeg.map((deg, i) =>
          wrapDegrees(deg - calibrationAt(cal.frequenciesHz, calPhase, response.frequenciesHz[i])),
        )
      : response.phaseDeg;
  const below = response.frequenciesHz.filter((f) => f < from);
  const above = response.frequenciesHz.filter((f) => f > to);
  return {
    response: { ...response, magnitudeDb, ...(phaseDeg && { phaseDeg }) },
    applied: {
      calibratedFromHz: from,
      calibratedToHz: to,
      heldFlatBelowHz: below.length > 0 ? from : null,
      heldFlatAboveHz: above.length > 0 ? to : null,
      phaseCorrected,
    },
  };
}
