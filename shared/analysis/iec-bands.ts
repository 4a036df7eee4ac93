import { requireInRange, requireInteger } from '../errors';

/** Octave frequency ratio of IEC 61260-1:2014 (base-10 system), G = 10^(3/10) ≈ 1.99526. */
export const OCTAVE_RATIO_G = Math.pow(10, 3 / 10);
/** Reference frequency of the band series, hertz (IEC 61260-1). */
export const REFERENCE_FREQUENCY_HZ = 1000;

export interface FractionalOctaveBand {
  /** Band number x relative to the reference band (x = 0 is the band at or just above 1 kHz). */
  index: number;
  /** Exact mid-band frequency, hertz. */
  centreHz: number;
  lowerHz: number;
  upperHz: number;
}

/**
 * Exact mid-band frequency of band x of a 1/b-octave series, IEC 61260-1:2014 (base-ten system):
 * `fm = 1000·G^(x/b)` for odd b and `fm = 1000·G^((2x+1)/(2b))` for even b, G = 10^(3/10).
 * @param index band number x (integer, may be negative).
 * @param bandsPerOctave b, 1..48.
 * @returns mid-band frequency in hertz.
 */
export function bandCentreHz(index: number, bandsPerOctave: number): number {
  requireInteger(index, {}, 'index', '/index');
  const b = requireBandsPerOctave(bandsPerOctave);
  const exponent = b % 2 === 1 ? index / b : (2 * index + 1) / (2 * b);
  return REFERENCE_FREQUENCY_HZ * Math.pow(OCTAVE_RATIO_G, exponent);
}

/**
 * Band-edge frequencies of a 1/b-octave band, IEC 61260-1:2014: `f1 = fm·G^(−1/(2b))`,
 * `f2 = fm·G^(+1/(2b))`.
 * @param centreHz exact mid-band frequency in hertz.
 * @param bandsPerOctave b, 1..48.
 */
export function bandEdgesHz(centreHz: number, bandsPerOctave: number): { lowerHz: number; upperHz: number } {
  requireInRange(centreHz, { min: 0, exclusiveMin: true, unit: 'Hz' }, 'centreHz', '/centreHz');
  const b = requireBandsPerOctave(bandsPerOctave);
  const half = Math.pow(OCTAVE_RATIO_G, 1 / (2 * b));
  return { lowerHz: centreHz / half, upperHz: centreHz * half };
}

/**
 * Every band of a 1/b-octave series whose exact mid-band frequency lies in [fromHz, toHz], in ascending
 * order, with its edges (IEC 61260-1:2014).
 */
export function bandsBetween(fromHz: number, toHz: number, bandsPerOctave: number): FractionalOctaveBand[] {
  requireInRange(fromHz, { min: 0, exclusiveMin: true, unit: 'Hz' }, 'fromHz', '/fromHz');
  requireInRange(toHz, { min: fromHz, unit: 'Hz' }, 'toHz', '/toHz');
  const b = requireBandsPerOctave(bandsPerOctave);
  // Inverting fm = 1000·G^(e) for the band number, with a margin against rounding at the ends.
  const exponentOffset = b % 2 === 1 ? 0 : 1 / (2 * b);
  const toIndex = (hz: number) =>
    (Math.log(hz / REFERENCE_FREQUENCY_HZ) / Math.log(OCTAVE_RATIO_G) - exponentOffset) * b;
  const bands: FractionalOctaveBand[] = [];
  for (let x = Math.ceil(toIndex(fromHz) - 1e-9); x <= Math.floor(toIndex(toHz) + 1e-9); x++) {
    const centreHz = bandCentreHz(x, b);
    bands.push({ index: x, centreHz, ...bandEdgesHz(centreHz, b) });
  }
  return bands;
}

/** Nominal octave-band mid-frequencies (the ISO 266 preferred numbers used to name bands), by band number x. */
const NOMINAL_OCTAVE_CENTRES_HZ: Record<number, number> = {
  [-6]: 16,
  [-5]: 31.5,
  [-4]: 63,
  [-3]: 125,
  [-2]: 250,
  [-1]: 500,
  0: 1000,
  1: 2000,
  2: 4000,
  3: 8000,
  4: 16000,
};

/** Nominal name of octave band x (e.g. 63 for x = −4), or the exact centre rounded to 3 figures elsewhere. */
export function nominalOctaveCentreHz(index: number): number {
  return NOMINAL_OCTAVE_CENTRES_HZ[index] ?? Number(bandCentreHz(index, 1).toPrecision(3));
}

function requireBandsPerOctave(bandsPerOctave: number): number {
  return requireInteger(bandsPerOctave, { min: 1, max: 48 }, 'bandsPerOctave', '/bandsPerOctave');
}
