/**
 * complexExpm1 and complexLog1p against their definitions e^x − 1 and
 * ln(1 + x) (with Math.exp/Math.log where no cancellation occurs), and
 * against the Taylor series near 0, where the naive forms lose their digits.
 */
import { describe, expect, it } from 'vitest';
import { complexExpm1, complexLog1p } from '../../src/numeric/complex-exponential.js';

describe('complexExpm1 / complexLog1p', () => {
  it('equal e^x − 1 and ln(1 + x) away from 0', () => {
    for (const [re, im] of [[0.7, -2.1], [-3, 0.4], [1.5, 3]]) {
      const e = complexExpm1({ re, im });
      expect(e.re).toBeCloseTo(Math.exp(re) * Math.cos(im) - 1, 14);
      expect(e.im).toBeCloseTo(Math.exp(re) * Math.sin(im), 14);
      const l = complexLog1p({ re, im });
      expect(l.re).toBeCloseTo(Math.log(Math.hypot(1 + re, im)), 14);
      expect(l.im).toBeCloseTo(Math.atan2(im, 1 + re), 14);
    }
  });

  it('keep full relative accuracy near 0 (Taylor: e^x − 1 ≈ x + x²/2, ln(1 + x) ≈ x − x²/2)', () => {
    const x = { re: -3e-9, im: 4e-9 };
    const x2 = { re: x.re * x.re - x.im * x.im, im: 2 * x.re * x.im };
    const e = complexExpm1(x);
    expect(Math.abs(e.re - (x.re + x2.re / 2)) / Math.abs(x.re)).toBeLessThan(1e-15);
    expect(Math.abs(e.im - (x.im + x2.im / 2)) / Math.abs(x.im)).toBeLessThan(1e-15);
    const l = complexLog1p(x);
    expect(Math.abs(l.re - (x.re - x2.re / 2)) / Math.abs(x.re)).toBeLessThan(1e-15);
    expect(Math.abs(l.im - (x.im - x2.im / 2)) / Math.abs(x.im)).toBeLessThan(1e-15);
    // ln(1 + (e^x − 1)) = x
    const back = complexLog1p(e);
    expect(Math.abs(back.re - x.re) / Math.abs(x.re)).toBeLessThan(1e-14);
  });
});
