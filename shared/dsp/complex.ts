/** A complex number. The core's one complex type: responses, poles, zeros and analogue prototypes use it. */
export interface Complex {
  re: number;
  im: number;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });

export const add = (x: Complex, y: Complex): Complex => ({ re: x.re + y.re, im: x.im + y.im });

export const subtract = (x: Complex, y: Complex): Complex => ({ re: x.re - y.re, im: x.im - y.im });

export const multiply = (x: Complex, y: Complex): Complex => ({
  re: x.re * y.re - x.im * y.im,
  im: x.re * y.im + x.im * y.re,
});

export const scale = (x: Complex, k: number): Complex => ({ re: x.re * k, im: x.im * k });

export function divide(x: Complex, y: Complex): Complex {
  const d = y.re * y.re + y.im * y.im;
  return { re: (x.re * y.re + x.im * y.im) / d, im: (x.im * y.re - x.re * y.im) / d };
}

/** |x|. */
export const abs = (x: Complex): number => Math.hypot(x.re, x.im);

/** arg x in radians, (−π, π]. */
export const arg = (x: Complex): number => Math.atan2(x.im, x.re);

/** The principal square root (non-negative real part; the sign of the imaginary part follows x's). */
export function sqrt(x: Complex): Complex {
  const r = Math.hypot(x.re, x.im);
  const re = Math.sqrt((r + x.re) / 2);
  const im = Math.sqrt(Math.max(0, (r - x.re) / 2));
  return { re, im: x.im < 0 ? -im : im };
}
