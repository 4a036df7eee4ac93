import { CalculationInputError, requireInRange } from '../errors';
import { bandEdgesHz } from './iec-bands';

/** A second-order section normalised to a0 = 1: H(z) = (b0 + b1 z⁻¹ + b2 z⁻²) / (1 + a1 z⁻¹ + a2 z⁻²). */
export interface SosSection {
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
}

interface Complex {
  re: number;
  im: number;
}

const csqrt = ({ re, im }: Complex): Complex => {
  const r = Math.hypot(re, im);
  const sr = Math.sqrt((r + re) / 2);
  const si = Math.sqrt(Math.max(0, (r - re) / 2));
  return { re: sr, im: im < 0 ? -si : si };
};

/**
 * Sixth-order Butterworth band-pass for one 1/b-octave band: the third-order low-pass prototype mapped to
 * a band-pass with −3 dB points at the IEC 61260-1 band edges, then to digital by the bilinear transform
 * with both edges pre-warped. This is the filter IEC 61260-1 describes as meeting class 1 for octave bands
 * [memory]. Returned as three sections with unit gain at the pass-band centre.
 *
 * @param centreHz exact band mid-frequency, hertz.
 * @param bandsPerOctave b (1 for octave bands, 3 for one-third-octave bands).
 * @param sampleRateHz sample rate, hertz; the upper band edge must lie below Nyquist.
 */
export function designBandPass(centreHz: number, bandsPerOctave: number, sampleRateHz: number): SosSection[] {
  const { lowerHz, upperHz } = bandEdgesHz(centreHz, bandsPerOctave);
  requireInRange(
    upperHz,
    { max: sampleRateHz / 2, exclusiveMax: true, unit: 'Hz' },
    'upper band edge',
    '/centreHz',
  );
  const fs2 = 2 * sampleRateHz;
  const w1 = fs2 * Math.tan((Math.PI * lowerHz) / sampleRateHz);
  const w2 = fs2 * Math.tan((Math.PI * upperHz) / sampleRateHz);
  const w0squared = w1 * w2;
  const bandwidth = w2 - w1;

  // Upper-half-plane analogue poles: each prototype pole p gives the roots of s² − pBs + w0² = 0.
  const prototypePoles: Complex[] = [
    { re: -0.5, im: Math.sqrt(3) / 2 },
    { re: -1, im: 0 },
  ];
  const analoguePoles: Complex[] = [];
  for (const p of prototypePoles) {
    const half = { re: (p.re * bandwidth) / 2, im: (p.im * bandwidth) / 2 };
    const root = csqrt({ re: half.re * half.re - half.im * half.im - w0squared, im: 2 * half.re * half.im });
    const roots = [
      { re: half.re + root.re, im: half.im + root.im },
      { re: half.re - root.re, im: half.im - root.im },
    ];
    // A real prototype pole gives one conjugate pair; keep one member of it.
    if (p.im === 0) analoguePoles.push(roots[0].im >= 0 ? roots[0] : roots[1]);
    else analoguePoles.push(...roots);
  }

  const centreDigital = 2 * Math.atan(Math.sqrt(w0squared) / fs2);
  return analoguePoles.map((s) => {
    // Bilinear transform z = (2fs + s) / (2fs − s).
    const den = { re: fs2 - s.re, im: -s.im };
    const num = { re: fs2 + s.re, im: s.im };
    const d2 = den.re * den.re + den.im * den.im;
    const z = { re: (num.re * den.re + num.im * den.im) / d2, im: (num.im * den.re - num.re * den.im) / d2 };
    const a1 = -2 * z.re;
    const a2 = z.re * z.re + z.im * z.im;
    // Zeros at z = 1 (s = 0) and z = −1 (s = ∞): numerator 1 − z⁻².
    const gain = 1 / sectionMagnitude({ b0: 1, b1: 0, b2: -1, a1, a2 }, centreDigital);
    return { b0: gain, b1: 0, b2: -gain, a1, a2 };
  });
}

/** |H(e^{jω})| of one section at ω radians per sample. */
export function sectionMagnitude(section: SosSection, omega: number): number {
  const c1 = Math.cos(omega);
  const s1 = Math.sin(omega);
  const c2 = Math.cos(2 * omega);
  const s2 = Math.sin(2 * omega);
  const nr = section.b0 + section.b1 * c1 + section.b2 * c2;
  const ni = -(section.b1 * s1 + section.b2 * s2);
  const dr = 1 + section.a1 * c1 + section.a2 * c2;
  const di = -(section.a1 * s1 + section.a2 * s2);
  return Math.sqrt((nr * nr + ni * ni) / (dr * dr + di * di));
}

/**
 * Runs a signal through a cascade of sections (transposed direct form II, double precision).
 * @returns a new array; the input is not changed.
 */
export function filterCascade(samples: ArrayLike<number>, sections: readonly SosSection[]): Float64Array {
  if (sections.length === 0) throw new CalculationInputError('at least one section is needed', '/sections');
  const out = Float64Array.from(samples);
  for (const { b0, b1, b2, a1, a2 } of sections) {
    let z1 = 0;
    let z2 = 0;
    for (let i = 0; i < out.length; i++) {
      const x = out[i];
      const y = b0 * x + z1;
      z1 = b1 * x - a1 * y + z2;
      z2 = b2 * x - a2 * y;
      out[i] = y;
    }
  }
  return out;
}
