import { CalculationInputError, requireInRange } from '../errors';

/**
 * Exponential (logarithmic) sine sweep, Farina, "Simultaneous measurement of impulse response and
 * distortion with a swept-sine technique", AES 108th Convention, 2000, preprint 5093:
 *
 *   x(t) = A·sin( 2π·f1·L·(e^(t/L) − 1) ),   L = T / ln(f2/f1),   0 ≤ t < T
 *
 * Its instantaneous frequency is f1·e^(t/L), so it spends equal time per octave and its spectrum falls
 * 3 dB per octave (pink). A memoryless non-linearity turns it into harmonics whose deconvolved responses
 * land T·ln(N)/ln(f2/f1) = L·ln N before the linear one (Farina 2000; Farina, "Advancements in impulse
 * response measurements by sine sweeps", AES 122nd Convention, 2007).
 */
export interface SweepSpec {
  sampleRateHz: number;
  /** f1, hertz. */
  startHz: number;
  /** f2, hertz (≤ Nyquist). */
  endHz: number;
  /** T, seconds: the sweep itself, fades included, silence excluded. */
  durationS: number;
  /** Half-Hann fade-in at the start, seconds (common practice, to avoid a click). */
  fadeInS: number;
  /** Half-Hann fade-out at the end, seconds. */
  fadeOutS: number;
  /** Sine peak A in dBFS (±1.0 = 0 dBFS). */
  levelDbfs: number;
  /** Digital silence after the sweep, seconds, for the room's decay to be recorded. */
  silenceAfterS: number;
}

/** Sweep rate constant L = T/ln(f2/f1), seconds per neper of frequency. */
export function sweepRateS(spec: Pick<SweepSpec, 'startHz' | 'endHz' | 'durationS'>): number {
  return spec.durationS / Math.log(spec.endHz / spec.startHz);
}

/** How long before the linear response the N-th harmonic's response lands: T·ln(N)/ln(f2/f1), seconds. */
export function harmonicAdvanceS(
  spec: Pick<SweepSpec, 'startHz' | 'endHz' | 'durationS'>,
  harmonic: number,
): number {
  return sweepRateS(spec) * Math.log(harmonic);
}

/** Sweep samples (`round(T·fs)`), without the silence after. */
export function sweepLength(spec: Pick<SweepSpec, 'sampleRateHz' | 'durationS'>): number {
  return Math.round(spec.durationS * spec.sampleRateHz);
}

/**
 * Checks the physics the contract cannot: f2 above f1 by at least an octave and at most Nyquist, and
 * fades that fit inside the sweep. Fields are relative to the sweep object.
 */
export function checkSweep(spec: SweepSpec): void {
  const nyquist = spec.sampleRateHz / 2;
  requireInRange(
    spec.endHz,
    { max: nyquist, unit: 'Hz' },
    `endHz (Nyquist at ${spec.sampleRateHz} Hz)`,
    '/endHz',
  );
  if (spec.endHz < 2 * spec.startHz) {
    throw new CalculationInputError(
      `endHz must be at least an octave above startHz (${2 * spec.startHz} Hz); received ${spec.endHz} Hz`,
      '/endHz',
    );
  }
  if (spec.fadeInS + spec.fadeOutS > spec.durationS / 2) {
    throw new CalculationInputError(
      `fadeInS + fadeOutS must be at most half the sweep (${spec.durationS / 2} s); received ${spec.fadeInS + spec.fadeOutS} s`,
      '/fadeInS',
    );
  }
  if (sweepLength(spec) < 64) {
    throw new CalculationInputError(
      `the sweep must last at least 64 samples; ${spec.durationS} s at ${spec.sampleRateHz} Hz is ${sweepLength(spec)}`,
      '/durationS',
    );
  }
}

/**
 * The sweep's samples, followed by `silenceAfterS` of zeros.
 * @returns samples at full scale ±1.
 */
export function exponentialSweep(spec: SweepSpec): Float64Array {
  checkSweep(spec);
  const { sampleRateHz: fs, startHz: f1 } = spec;
  const n = sweepLength(spec);
  const total = n + Math.round(spec.silenceAfterS * fs);
  const out = new Float64Array(total);
  const rate = sweepRateS(spec);
  const amplitude = Math.pow(10, spec.levelDbfs / 20);
  const phaseScale = 2 * Math.PI * f1 * rate;
  for (let i = 0; i < n; i++) {
    out[i] = amplitude * Math.sin(phaseScale * Math.expm1(i / fs / rate));
  }
  applyFades(out, n, Math.round(spec.fadeInS * fs), Math.round(spec.fadeOutS * fs));
  return out;
}

/** Half-Hann fades in place over the first `fadeIn` and the last `fadeOut` of the first `n` samples. */
function applyFades(x: Float64Array, n: number, fadeIn: number, fadeOut: number): void {
  for (let i = 0; i < fadeIn; i++) x[i] *= 0.5 * (1 - Math.cos((Math.PI * i) / fadeIn));
  for (let i = 0; i < fadeOut; i++) x[n - 1 - i] *= 0.5 * (1 - Math.cos((Math.PI * i) / fadeOut));
}

/**
 * Farina's inverse filter for the sweep (AES 108th, 2000): the sweep (without the silence) reversed in
 * time, with an amplitude envelope falling 6 dB per octave along the reversed time, so that the sweep
 * convolved with it is a band-limited impulse at lag `n − 1` (n = sweep length). The caller normalises
 * its gain.
 */
export function inverseFilterEnvelope(spec: SweepSpec, sweep: Float64Array): Float64Array {
  const n = sweepLength(spec);
  const rate = sweepRateS(spec);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    // Reversed sample i is original time t = (n − 1 − i)/fs: the gain e^((t − T)/L) is 1 where the
    // reversed filter starts (at f2) and falls 6 dB per octave toward f1, offsetting the sweep's pink spectrum.
    out[i] = sweep[n - 1 - i] * Math.exp(((n - 1 - i) / spec.sampleRateHz - spec.durationS) / rate);
  }
  return out;
}
