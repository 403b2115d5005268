import { describe, expect, it } from 'vitest';
import { polynomialRoots } from '../../src/numeric/polynomial-roots.js';
import { fromRoots } from '../../src/numeric/polynomial.js';

const sortRoots = (r: { re: number; im: number }[]) => [...r].sort((a, b) => a.re - b.re || a.im - b.im);

describe('polynomialRoots (Aberth–Ehrlich)', () => {
  it('finds the roots of s² + 3s + 2 = (s + 1)(s + 2) (closed form)', () => {
    const r = sortRoots(polynomialRoots([1, 3, 2]));
    expect(r[0].re).toBeCloseTo(-2, 14);
    expect(r[1].re).toBeCloseTo(-1, 14);
    expect(r.every((z) => z.im === 0)).toBe(true);
  });

  it('finds s² + 2ζωn s + ωn² roots −ζωn ± jωn√(1−ζ²) (closed form)', () => {
    const zeta = 0.05;
    const wn = 7;
    const r = sortRoots(polynomialRoots([1, 2 * zeta * wn, wn * wn]));
    const im = wn * Math.sqrt(1 - zeta * zeta);
    expect(r[0].re).toBeCloseTo(-zeta * wn, 12);
    expect(r[0].im).toBeCloseTo(-im, 12);
    expect(r[1].im).toBeCloseTo(im, 12);
  });

  it('splits off exact roots at the origin', () => {
    const r = polynomialRoots([1, 3, 2, 0, 0]);
    expect(r.filter((z) => z.re === 0 && z.im === 0)).toHaveLength(2);
  });

  it('recovers the roots 1..10 of the product polynomial to 1e-6 (Wilkinson-type test, degree 10)', () => {
    const exact = Array.from({ length: 10 }, (_, i) => ({ re: -(i + 1), im: 0 }));
    const r = sortRoots(polynomialRoots(fromRoots(exact)));
    r.forEach((z, i) => expect(Math.abs(z.re - -(10 - i))).toBeLessThan(1e-6));
  });

  it('finds the 12th roots of unity of s¹² − 1 (closed form e^{j2πk/12})', () => {
    const p = [1, ...new Array(11).fill(0), -1];
    const r = polynomialRoots(p);
    for (const z of r) expect(Math.hypot(z.re, z.im)).toBeCloseTo(1, 12);
    expect(r.filter((z) => z.re > 1e-9)).toHaveLength(5);
  });
});
