import { seededRandom } from '../analysis/test-signals';
import { irfft, nextPowerOfTwo, rfft } from './fft';

/**
 * The discrete Fourier transform by its definition, X[k] = Σ x[n]·e^(−j2πkn/N) (Oppenheim & Schafer,
 * Discrete-Time Signal Processing, eq. 8.11), O(N²): the reference the fast transform must equal.
 */
function naiveDft(x: ArrayLike<number>, size: number): { re: Float64Array; im: Float64Array } {
  const bins = size / 2 + 1;
  const re = new Float64Array(bins);
  const im = new Float64Array(bins);
  for (let k = 0; k < bins; k++) {
    for (let n = 0; n < Math.min(x.length, size); n++) {
      // (k·n) mod N keeps the angle small, so the reference itself stays accurate at large N.
      const angle = (-2 * Math.PI * ((k * n) % size)) / size;
      re[k] += x[n] * Math.cos(angle);
      im[k] += x[n] * Math.sin(angle);
    }
  }
  return { re, im };
}

const noise = (length: number, seed: number) => {
  const random = seededRandom(seed);
  return Float64Array.from({ length }, () => 2 * random() - 1);
};

describe('rfft', () => {
  it.each([4, 8, 16, 64, 256, 1024])(
    'equals the DFT by definition at N = %d (within 1e-12 of Σ|x|)',
    (size) => {
      const x = noise(size, size);
      const fast = rfft(x, size);
      const slow = naiveDft(x, size);
      const scale = x.reduce((sum, v) => sum + Math.abs(v), 0);
      for (let k = 0; k < size / 2 + 1; k++) {
        expect(Math.abs(fast.re[k] - slow.re[k])).toBeLessThan(1e-12 * scale);
        expect(Math.abs(fast.im[k] - slow.im[k])).toBeLessThan(1e-12 * scale);
      }
    },
  );

  it('zero-pads a shorter signal and cuts a longer one to N, as numpy.fft.rfft(x, n) does', () => {
    const x = noise(300, 3);
    for (const size of [512, 128]) {
      const fast = rfft(x, size);
      const slow = naiveDft(x, size);
      for (let k = 0; k < size / 2 + 1; k++) {
        expect(fast.re[k]).toBeCloseTo(slow.re[k], 10);
        expect(fast.im[k]).toBeCloseTo(slow.im[k], 10);
      }
    }
  });

  it('gives a cosine of k0 cycles exactly N/2 at bin k0 and nothing elsewhere', () => {
    const size = 256;
    const k0 = 17;
    const x = Float64Array.from({ length: size }, (_, n) => Math.cos((2 * Math.PI * k0 * n) / size));
    const { re, im } = rfft(x, size);
    for (let k = 0; k < re.length; k++) {
      expect(re[k]).toBeCloseTo(k === k0 ? size / 2 : 0, 9);
      expect(im[k]).toBeCloseTo(0, 9);
    }
  });

  it('is undone by irfft (within 1e-12)', () => {
    for (const size of [4, 32, 2048]) {
      const x = noise(size, 99 + size);
      const back = irfft(rfft(x, size));
      for (let n = 0; n < size; n++) expect(Math.abs(back[n] - x[n])).toBeLessThan(1e-12);
    }
  });

  it('refuses a size that is not a power of two, naming it', () => {
    expect(() => rfft([1, 2, 3], 12)).toThrow(expect.objectContaining({ field: '/fftSize' }));
    expect(nextPowerOfTwo(1000)).toBe(1024);
    expect(nextPowerOfTwo(1)).toBe(4);
  });
});
