import type { Sos } from '../dsp/sos';
import { cascadeResponse, wrapDegrees } from '../dsp/response';
import type { Polarity } from '../filters/crossover';

/** Phase differences within this of 90° count as a tie, degrees. */
const TIE_DEG = 1e-6;

export interface SubwooferAlignment {
  /** Polarity that puts the subwoofer's low-pass in phase with the mains' high-pass at the crossover. */
  polarity: Polarity;
  /** Delay to add to the subwoofer's distance-aligned delay, ms (negative: less delay). */
  correctionMs: number;
  /** Phase of the subwoofer path minus the mains' path at the crossover before correction, degrees. */
  phaseDifferenceDeg: number;
}

/**
 * Polarity and delay of the subwoofer that line its low-pass up in phase with the mains' high-pass at
 * the crossover frequency, once both are time-aligned acoustically (delays from distance or arrival).
 *
 * With φ the phase of each filter cascade at fc (cascadeResponse) and the mains' polarity applied,
 * Δ = wrap(φ_LP − φ_HP). A delay d shifts the phase by −360·fc·d, so d = Δ / (360·fc) brings the two in
 * phase. When |Δ| > 90° the subwoofer's polarity is inverted instead (Δ + 180°), which needs the smaller
 * delay. Alignment at the one frequency where both contribute equally is common practice; the result
 * is a starting point to confirm by measuring the summed response around the crossover.
 * For a Linkwitz-Riley pair (both outputs in phase, REFERENCES.md §2) Δ = 0: normal polarity, no change.
 *
 * @param lowPass the subwoofer low-pass sections.
 * @param highPass the mains' high-pass sections, with `highPassPolarity` their output polarity.
 * @param frequencyHz crossover frequency, hertz.
 */
export function alignSubwooferAtCrossover(
  lowPass: Sos[],
  highPass: Sos[],
  highPassPolarity: Polarity,
  frequencyHz: number,
  sampleRateHz: number,
): SubwooferAlignment {
  const [phaseLow] = cascadeResponse(lowPass, [frequencyHz], sampleRateHz).phaseDeg;
  const [phaseHigh] = cascadeResponse(highPass, [frequencyHz], sampleRateHz).phaseDeg;
  const mains = phaseHigh + (highPassPolarity === 'inverted' ? 180 : 0);
  const difference = wrapDegrees(phaseLow - mains);
  // At exactly 90° both choices need the same delay; normal polarity is kept (the simpler setting).
  const invert = Math.abs(difference) > 90 + TIE_DEG;
  const residual = invert ? wrapDegrees(difference + 180) : difference;
  return {
    polarity: invert ? 'inverted' : 'normal',
    correctionMs: (residual / (360 * frequencyHz)) * 1000,
    phaseDifferenceDeg: difference,
  };
}
