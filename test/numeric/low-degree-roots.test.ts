import { describe, expect, it } from 'vitest';
import { lowDegreeRoots } from '../../src/numeric/low-degree-roots.js';

const sortRoots = (r: { re: number; im: number }[]) => [...r].sort((a, b) => a.re - b.re || a.im - b.im);

describe('lowDegreeRoots (closed form up to degree two)', () => {
  it('s² + 3s + 2 = (s + 1)(s + 2): roots −2 and −1 (closed form)', () => {
    const r = sortRoots(lowDegreeRoots([1, 3, 2]));
    expect(r).toEqual([{ re: -2, im: 0 }, { re: -1, im: 0 }]);
  });

  it('s² + 2ζωn s + ωn²: −ζωn ± jωn√(1−ζ²), an exact conjugate pair (common practice)', () => {
    const zeta = 0.05;
    const wn = 7;
    const r = sortRoots(lowDegreeRoots([1, 2 * zeta * wn, wn * wn]));
    expect(r[0].re).toBeCloseTo(-zeta * wn, 13);
    expect(r[1].im).toBeCloseTo(wn * Math.sqrt(1 - zeta * zeta), 13);
    expect(r[0].re).toBe(r[1].re);
    expect(r[0].im).toBe(-r[1].im);
  });

  it('keeps the small root of a badly scaled quadratic: s² + 1e8 s + 1 has roots ≈ −1e8 and −1e−8 (Numerical Recipes §5.6)', () => {
    const r = sortRoots(lowDegreeRoots([1, 1e8, 1]));
    // The product of the roots is c/a = 1 and their sum −b/a = −1e8 (Vieta).
    expect(r[1].re).toBeCloseTo(-1e-8, 22);
    expect(Math.abs(r[0].re * r[1].re - 1)).toBeLessThan(1e-15);
  });

  it('splits exact roots at the origin first: 209 s² + 95 s has roots 0 and −95/209', () => {
    const r = sortRoots(lowDegreeRoots([209, 95, 0]));
    expect(r).toEqual([{ re: -95 / 209, im: 0 }, { re: 0, im: 0 }]);
  });

  it('takes leading zeros and constants: [0, 2, −4] has the root 2, [5] none', () => {
    expect(lowDegreeRoots([0, 2, -4])).toEqual([{ re: 2, im: 0 }]);
    expect(lowDegreeRoots([5])).toEqual([]);
  });

  it('hands degree three and above to the Aberth iteration: (s + 1)(s + 2)(s + 3)', () => {
    const r = sortRoots(lowDegreeRoots([1, 6, 11, 6]));
    r.forEach((z, i) => expect(z.re).toBeCloseTo(-3 + i, 10));
  });

  it('does not overflow on large coefficients: 1e200·(s² + s + 1) has roots −1/2 ± j√3/2 (b² of the raw coefficients would be ∞)', () => {
    const r = sortRoots(lowDegreeRoots([1e200, 1e200, 1e200]));
    expect(r[0].re).toBeCloseTo(-0.5, 14);
    expect(r[0].im).toBeCloseTo(-Math.sqrt(3) / 2, 14);
    expect(r[1].im).toBeCloseTo(Math.sqrt(3) / 2, 14);
  });

  it('hands a closed form that under- or overflows to the iteration: every root it returns is finite', () => {
    for (const p of [[1e-300, 1e300, 1], [1, 1e300, 1e-300], [1e308, -1e308, 1e308]]) {
      for (const z of lowDegreeRoots(p)) expect(Number.isFinite(z.re) && Number.isFinite(z.im), JSON.stringify(p)).toBe(true);
    }
  });
});
