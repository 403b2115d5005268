/**
 * Solution x of (A_re + j·A_im)·x = b together with det(A), by LU
 * factorisation with partial pivoting (Gaussian elimination; Golub & Van
 * Loan, Matrix Computations, 4th ed., §3.4). Matrices are row-major
 * Float64Arrays and are overwritten; the right-hand side is real or complex.
 * A singular matrix gives det = 0 and x = NaN.
 */
import type { Complex } from './complex.js';

export interface ComplexSolution {
  re: Float64Array;
  im: Float64Array;
  det: Complex;
}

export function complexSolveWithDeterminant(
  are: Float64Array,
  aim: Float64Array,
  n: number,
  bre: ArrayLike<number>,
  bim: ArrayLike<number>,
): ComplexSolution {
  const xr = Float64Array.from(bre);
  const xi = Float64Array.from(bim);
  let dr = 1;
  let di = 0;
  for (let k = 0; k < n; k++) {
    let pivot = k;
    let best = -1;
    for (let i = k; i < n; i++) {
      const m = Math.hypot(are[i * n + k], aim[i * n + k]);
      if (m > best) {
        best = m;
        pivot = i;
      }
    }
    if (best === 0) return { re: xr.fill(NaN), im: xi.fill(NaN), det: { re: 0, im: 0 } };
    if (pivot !== k) {
      for (let j = 0; j < n; j++) {
        const a = k * n + j;
        const b = pivot * n + j;
        [are[a], are[b]] = [are[b], are[a]];
        [aim[a], aim[b]] = [aim[b], aim[a]];
      }
      [xr[k], xr[pivot]] = [xr[pivot], xr[k]];
      [xi[k], xi[pivot]] = [xi[pivot], xi[k]];
      dr = -dr;
      di = -di;
    }
    const pr = are[k * n + k];
    const pi = aim[k * n + k];
    const t = dr * pr - di * pi;
    di = dr * pi + di * pr;
    dr = t;
    const pp = pr * pr + pi * pi;
    for (let i = k + 1; i < n; i++) {
      const ar = are[i * n + k];
      const ai = aim[i * n + k];
      const fr = (ar * pr + ai * pi) / pp;
      const fi = (ai * pr - ar * pi) / pp;
      for (let j = k + 1; j < n; j++) {
        const br = are[k * n + j];
        const bi = aim[k * n + j];
        are[i * n + j] -= fr * br - fi * bi;
        aim[i * n + j] -= fr * bi + fi * br;
      }
      const yr = xr[k];
      const yi = xi[k];
      xr[i] -= fr * yr - fi * yi;
      xi[i] -= fr * yi + fi * yr;
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    let sr = xr[k];
    let si = xi[k];
    for (let j = k + 1; j < n; j++) {
      const ar = are[k * n + j];
      const ai = aim[k * n + j];
      sr -= ar * xr[j] - ai * xi[j];
      si -= ar * xi[j] + ai * xr[j];
    }
    const pr = are[k * n + k];
    const pi = aim[k * n + k];
    const pp = pr * pr + pi * pi;
    xr[k] = (sr * pr + si * pi) / pp;
    xi[k] = (si * pr - sr * pi) / pp;
  }
  return { re: xr, im: xi, det: { re: dr, im: di } };
}
