import { expectWithin } from '../filters/test-helpers';
import * as cx from './complex';

describe('complex arithmetic', () => {
  it('multiplies and divides as (a + jb)(c + jd) = (ac − bd) + j(ad + bc)', () => {
    const x = cx.complex(3, -2);
    const y = cx.complex(-1, 4);
    expect(cx.multiply(x, y)).toEqual({ re: 5, im: 14 });
    const back = cx.divide(cx.multiply(x, y), y);
    expectWithin(back.re, 3, 1e-15, 're');
    expectWithin(back.im, -2, 1e-15, 'im');
    expect(cx.add(x, y)).toEqual({ re: 2, im: 2 });
    expect(cx.subtract(x, y)).toEqual({ re: 4, im: -6 });
    expect(cx.scale(x, 2)).toEqual({ re: 6, im: -4 });
    expect(cx.abs(cx.complex(3, 4))).toBe(5);
    expect(cx.arg(cx.complex(0, 1))).toBe(Math.PI / 2);
  });

  it('takes the principal square root: √(−4) = 2j, √(3 − 4j) = 2 − j', () => {
    expect(cx.sqrt(cx.complex(-4))).toEqual({ re: 0, im: 2 });
    const r = cx.sqrt(cx.complex(3, -4));
    expectWithin(r.re, 2, 1e-15, 're');
    expectWithin(r.im, -1, 1e-15, 'im');
  });
});
