import * as cx from '../dsp/complex';
import type { Complex } from '../dsp/complex';
import { sosfreqz } from '../dsp/response';
import type { Sos } from '../dsp/sos';
import { requireInRange } from '../errors';
import { bandEdgesHz } from './iec-bands';

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
export function designBandPass(centreHz: number, bandsPerOctave: number, sampleRateHz: number): Sos[] {
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
    const half = cx.scale(p, bandwidth / 2);
    const root = cx.sqrt(cx.subtract(cx.multiply(half, half), cx.complex(w0squared)));
    const roots = [cx.add(half, root), cx.subtract(half, root)];
    // A real prototype pole gives one conjugate pair; keep one member of it.
    if (p.im === 0) analoguePoles.push(roots[0].im >= 0 ? roots[0] : roots[1]);
    else analoguePoles.push(...roots);
  }

  // The analogue centre √(w1·w2) seen through the bilinear transform: f = fs/π · atan(w0/(2fs)).
  const digitalCentreHz = (Math.atan(Math.sqrt(w0squared) / fs2) * sampleRateHz) / Math.PI;
  return analoguePoles.map((s) => {
    // Bilinear transform z = (2fs + s) / (2fs − s).
    const z = cx.divide(cx.add(cx.complex(fs2), s), cx.subtract(cx.complex(fs2), s));
    const a1 = -2 * z.re;
    const a2 = z.re * z.re + z.im * z.im;
    // Zeros at z = 1 (s = 0) and z = −1 (s = ∞): numerator 1 − z⁻².
    const h = sosfreqz([{ b0: 1, b1: 0, b2: -1, a1, a2 }], [digitalCentreHz], sampleRateHz);
    const gain = 1 / Math.hypot(h.re[0], h.im[0]);
    return { b0: gain, b1: 0, b2: -gain, a1, a2 };
  });
}
