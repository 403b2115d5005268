/**
 * The balanced controllable canonical realisation reproduces N(s)/D(s):
 * C(sI − A)⁻¹B + D evaluated directly (complex solve) against the rational
 * function at a few points, for a strictly proper and a biproper plant with
 * widely spread poles (where balancing matters).
 */
import { describe, expect, it } from 'vitest';
import { companionRealisation } from '../../../src/model/discrete/companion-realisation.js';
import { complexSolveWithDeterminant } from '../../../src/numeric/complex-linear-solve.js';
import { evaluateAt, multiply } from '../../../src/numeric/polynomial.js';

function realised(num: number[], den: number[], s: { re: number; im: number }) {
  const r = companionRealisation(num, den);
  const n = r.a.length;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    re[i * n + j] = (i === j ? s.re : 0) - r.a[i][j];
    im[i * n + j] = i === j ? s.im : 0;
  }
  const x = complexSolveWithDeterminant(re, im, n, r.b, new Array(n).fill(0));
  let vr = r.d;
  let vi = 0;
  for (let i = 0; i < n; i++) {
    vr += r.c[i] * x.re[i];
    vi += r.c[i] * x.im[i];
  }
  return { re: vr, im: vi };
}

describe('companionRealisation', () => {
  const spread = multiply(multiply([1, 0.01], [1, 100]), [1, 1000]);
  for (const [name, num] of [['strictly proper', [5, 1]], ['biproper', [2, 3, 4, 5]]] as const) {
    it(`${name}: C(sI − A)⁻¹B + D = N/D`, () => {
      for (const s of [{ re: 0, im: 0.003 }, { re: 0, im: 2 }, { re: -1, im: 300 }, { re: 0, im: 5e4 }]) {
        const v = realised([...num], spread, s);
        const n = evaluateAt(num, s);
        const d = evaluateAt(spread, s);
        const dd = d.re * d.re + d.im * d.im;
        const er = (n.re * d.re + n.im * d.im) / dd;
        const ei = (n.im * d.re - n.re * d.im) / dd;
        expect(Math.hypot(v.re - er, v.im - ei) / Math.hypot(er, ei)).toBeLessThan(1e-11);
      }
    });
  }
});
