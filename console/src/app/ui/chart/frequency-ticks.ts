/** Frequencies labelled on a log axis: the 1-2-5 steps engineers read at a glance. */
const LABELLED_MANTISSAS = [1, 2, 5];

/** Short label for a frequency in hertz: 20, 500, 1k, 2.5k, 20k. */
export function formatFrequency(hz: number): string {
  if (!Number.isFinite(hz)) return '';
  if (hz >= 1000) {
    const k = hz / 1000;
    return `${Number.isInteger(k) ? k : Number(k.toPrecision(3))}k`;
  }
  return `${Number.isInteger(hz) ? hz : Number(hz.toPrecision(3))}`;
}

/** The tick label for a log frequency axis, or an empty string for ticks left unlabelled. */
export function frequencyTickLabel(hz: number): string {
  if (!(hz > 0)) return '';
  const exponent = Math.floor(Math.log10(hz) + 1e-9);
  const mantissa = hz / 10 ** exponent;
  const labelled = LABELLED_MANTISSAS.some((m) => Math.abs(mantissa - m) < 1e-6);
  return labelled ? formatFrequency(hz) : '';
}
