/**
 * All roots of a real polynomial by the Aberth–Ehrlich simultaneous iteration
 * (O. Aberth, "Iteration methods for finding all zeros of a polynomial
 * simultaneously", Math. Comp. 27 (1973); L. W. Ehrlich, CACM 10 (1967)),
 * started on a circle whose radius comes from the coefficients (the
 * geometric-mean estimate of Bini's MPSolve, D. A. Bini, Numer. Algorithms 13
 * (1996)), with exact roots at the origin split off first.
 *
 * Roots come back as `{re, im}`, conjugate pairs made exactly conjugate and
 * near-real roots snapped to the real axis.
 *
 * @example polynomialRoots([1, 3, 2]) // → [{re: -2, im: 0}, {re: -1, im: 0}] (in some order)
 */
import type { Complex } from './complex.js';
import { trimLeading, zeroRootMultiplicity } from './polynomial.js';

const MAX_ITERATIONS = 500;

export function polynomialRoots(coefficients: readonly number[]): Complex[] {
  const trimmed = trimLeading(coefficients);
  const atOrigin = zeroRootMultiplicity(trimmed);
  const p = trimmed.slice(0, trimmed.length - atOrigin);
  const n = p.length - 1;
  const roots: Complex[] = [];
  for (let k = 0; k < atOrigin; k++) roots.push({ re: 0, im: 0 });
  if (n <= 0) return roots;
  if (n === 1) {
    roots.push({ re: -p[1] / p[0], im: 0 });
    return roots;
  }
  // Normalise to a monic polynomial.
  const a = p.map((c) => c / p[0]);
  // Plain arrays: a Float64Array of more than eight doubles is allocated outside V8's heap, at about a microsecond each.
  const zr = new Array<number>(n).fill(0);
  const zi = new Array<number>(n).fill(0);
  // Initial radius: geometric mean of the roots' moduli, |a_n|^(1/n).
  const radius = Math.pow(Math.abs(a[n]), 1 / n) || 1;
  for (let k = 0; k < n; k++) {
    const theta = (2 * Math.PI * k) / n + 0.4;
    zr[k] = radius * Math.cos(theta);
    zi[k] = radius * Math.sin(theta);
  }
  const converged = new Uint8Array(n);
  for (let iter = 0; iter < MAX_ITERATIONS; iter++) {
    let allDone = true;
    for (let k = 0; k < n; k++) {
      if (converged[k]) continue;
      // p(z) and p'(z) by Horner, plus a rounding-error bound for p(z).
      const xr = zr[k];
      const xi = zi[k];
      let pr = 1;
      let pi = 0;
      let dr = 0;
      let di = 0;
      let bound = 1;
      const mod = Math.sqrt(xr * xr + xi * xi);
      for (let i = 1; i <= n; i++) {
        const ndr = dr * xr - di * xi + pr;
        di = dr * xi + di * xr + pi;
        dr = ndr;
        const npr = pr * xr - pi * xi + a[i];
        pi = pr * xi + pi * xr;
        pr = npr;
        bound = bound * mod + Math.abs(a[i]);
      }
      const pm = Math.sqrt(pr * pr + pi * pi);
      if (pm <= 4 * Number.EPSILON * bound) {
        converged[k] = 1; // |p(z)| is at rounding level: z is a root to working precision
        continue;
      }
      // Newton quotient w = p/p'.
      const dd = dr * dr + di * di;
      if (dd === 0) {
        zr[k] += radius * 1e-3;
        allDone = false;
        continue;
      }
      const wr = (pr * dr + pi * di) / dd;
      const wi = (pi * dr - pr * di) / dd;
      // Aberth correction: w / (1 − w·Σ 1/(z_k − z_j)).
      let sr = 0;
      let si = 0;
      for (let j = 0; j < n; j++) {
        if (j === k) continue;
        const ur = xr - zr[j];
        const ui = xi - zi[j];
        const uu = ur * ur + ui * ui;
        if (uu === 0) continue;
        sr += ur / uu;
        si -= ui / uu;
      }
      const qr = 1 - (wr * sr - wi * si);
      const qi = -(wr * si + wi * sr);
      const qq = qr * qr + qi * qi;
      const cr = qq === 0 ? wr : (wr * qr + wi * qi) / qq;
      const ci = qq === 0 ? wi : (wi * qr - wr * qi) / qq;
      zr[k] = xr - cr;
      zi[k] = xi - ci;
      const step = Math.sqrt(cr * cr + ci * ci);
      if (step <= 1e-15 * Math.max(mod, 1e-300)) converged[k] = 1;
      else allDone = false;
    }
    if (allDone) break;
  }
  for (let k = 0; k < n; k++) roots.push({ re: zr[k], im: zi[k] });
  return cleanConjugates(roots);
}

/**
 * Real coefficients give real roots or conjugate pairs. Snap roots whose
 * imaginary part is at rounding level to the real axis, and make paired roots
 * exact conjugates (average of the pair), so that counts of right-half-plane
 * roots and re-built polynomials do not suffer from rounding asymmetry.
 */
function cleanConjugates(roots: Complex[]): Complex[] {
  const out: Complex[] = [];
  const used = new Uint8Array(roots.length);
  for (let i = 0; i < roots.length; i++) {
    if (used[i]) continue;
    const r = roots[i];
    const size = Math.max(Math.abs(r.re), Math.abs(r.im), 1e-300);
    if (Math.abs(r.im) <= 1e-10 * size) {
      out.push({ re: r.re, im: 0 });
      used[i] = 1;
      continue;
    }
    let best = -1;
    let bestDistance = Infinity;
    for (let j = i + 1; j < roots.length; j++) {
      if (used[j]) continue;
      const d = Math.hypot(roots[j].re - r.re, roots[j].im + r.im);
      if (d < bestDistance) {
        bestDistance = d;
        best = j;
      }
    }
    used[i] = 1;
    if (best >= 0 && bestDistance <= 1e-6 * size) {
      used[best] = 1;
      const re = (r.re + roots[best].re) / 2;
      const im = Math.abs(r.im - roots[best].im) / 2;
      out.push({ re, im }, { re, im: -im });
    } else {
      out.push(r);
    }
  }
  return out;
}
