import { describe, expect, it } from 'vitest';
import { multiplyMatrices, identityMatrix, solveLinearSystem } from '../../../src/analysis/time-response/dense-matrix.js';
import { eigenvaluesOf, polynomialRootsOf, type ComplexNumber } from '../../../src/analysis/time-response/eigenvalues.js';

const byParts = (a: ComplexNumber, b: ComplexNumber): number => a.re - b.re || a.im - b.im;

describe('polynomialRootsOf', () => {
  it('finds the roots of (s + 1)(s + 2)(s + 3) = s³ + 6s² + 11s + 6', () => {
    const roots = polynomialRootsOf([1, 6, 11, 6]).sort(byParts);
    [-3, -2, -1].forEach((r, i) => {
      expect(roots[i].re).toBeCloseTo(r, 13);
      expect(roots[i].im).toBe(0);
    });
  });

  it('finds the complex pair of s² + 2ζωs + ω² at −ζω ± jω√(1 − ζ²)', () => {
    const zeta = 0.3;
    const w = 5;
    const roots = polynomialRootsOf([1, 2 * zeta * w, w * w]).sort(byParts);
    expect(roots[0].re).toBeCloseTo(-zeta * w, 13);
    expect(roots[1].im).toBeCloseTo(w * Math.sqrt(1 - zeta * zeta), 13);
    expect(roots[0].im).toBeCloseTo(-roots[1].im, 15);
  });

  it('finds the roots of Π_{k=1..10}(s + k) to 1e−6 (a classically ill-conditioned case)', () => {
    let p = [1];
    for (let k = 1; k <= 10; k++) p = p.map((c, i) => c + k * (p[i - 1] ?? 0)).concat([k * p[p.length - 1]]);
    const roots = polynomialRootsOf(p).sort(byParts);
    roots.forEach((r, i) => expect(Math.abs(r.re + (10 - i))).toBeLessThan(1e-6));
  });
});

describe('eigenvaluesOf', () => {
  it('recovers the spectrum of S·D·S⁻¹ for a dense S and a D with a complex pair', () => {
    // D: −1, 2, and the rotation-like block [[−0.5, 3], [−3, −0.5]] with eigenvalues −0.5 ± 3j.
    const d = [
      [-1, 0, 0, 0],
      [0, 2, 0, 0],
      [0, 0, -0.5, 3],
      [0, 0, -3, -0.5],
    ];
    const s = [
      [1, 2, 0.5, -1],
      [0.3, 1, 2, 0],
      [-1, 0.2, 1, 0.7],
      [0.5, -0.4, 0.1, 1],
    ];
    const a = multiplyMatrices(multiplyMatrices(s, d), solveLinearSystem(s, identityMatrix(4)));
    const got = eigenvaluesOf(a).sort(byParts);
    const want: ComplexNumber[] = [
      { re: -1, im: 0 },
      { re: -0.5, im: -3 },
      { re: -0.5, im: 3 },
      { re: 2, im: 0 },
    ];
    want.forEach((w, i) => {
      expect(got[i].re).toBeCloseTo(w.re, 11);
      expect(got[i].im).toBeCloseTo(w.im, 11);
    });
  });

  it('handles the empty matrix and a 1×1 matrix', () => {
    expect(eigenvaluesOf([])).toEqual([]);
    expect(eigenvaluesOf([[-4]])).toEqual([{ re: -4, im: 0 }]);
  });
});
