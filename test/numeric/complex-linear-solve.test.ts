/**
 * Complex linear solve with determinant, against a system built from a known
 * solution (A·x computed directly) and the closed-form determinant of a 2×2
 * and of a triangular matrix (product of the diagonal).
 */
import { describe, expect, it } from 'vitest';
import { complexSolveWithDeterminant } from '../../src/numeric/complex-linear-solve.js';

describe('complexSolveWithDeterminant', () => {
  it('recovers x from A·x and gives det = ad − bc for a 2×2', () => {
    const a = [[{ re: 0.1, im: 2 }, { re: 3, im: -1 }], [{ re: -2, im: 0.5 }, { re: 1, im: 1 }]];
    const x = [{ re: 1.5, im: -0.25 }, { re: -0.75, im: 2 }];
    const b = a.map((row) => row.reduce((s, c, j) => ({ re: s.re + c.re * x[j].re - c.im * x[j].im, im: s.im + c.re * x[j].im + c.im * x[j].re }), { re: 0, im: 0 }));
    const re = Float64Array.from(a.flat(), (c) => c.re);
    const im = Float64Array.from(a.flat(), (c) => c.im);
    const sol = complexSolveWithDeterminant(re, im, 2, b.map((c) => c.re), b.map((c) => c.im));
    sol.re.forEach((v, i) => expect(v).toBeCloseTo(x[i].re, 13));
    sol.im.forEach((v, i) => expect(v).toBeCloseTo(x[i].im, 13));
    const ad = { re: a[0][0].re * a[1][1].re - a[0][0].im * a[1][1].im, im: a[0][0].re * a[1][1].im + a[0][0].im * a[1][1].re };
    const bc = { re: a[0][1].re * a[1][0].re - a[0][1].im * a[1][0].im, im: a[0][1].re * a[1][0].im + a[0][1].im * a[1][0].re };
    expect(sol.det.re).toBeCloseTo(ad.re - bc.re, 13);
    expect(sol.det.im).toBeCloseTo(ad.im - bc.im, 13);
  });

  it('det of a triangular matrix is the product of its diagonal; a singular matrix gives det 0', () => {
    const sol = complexSolveWithDeterminant(Float64Array.from([2, 5, 0, 3]), Float64Array.from([0, 1, 0, 0]), 2, [1, 1], [0, 0]);
    expect(sol.det).toEqual({ re: 6, im: 0 });
    const singular = complexSolveWithDeterminant(Float64Array.from([1, 2, 2, 4]), new Float64Array(4), 2, [1, 1], [0, 0]);
    expect(singular.det.re).toBe(0);
  });
});
