/**
 * Determinant of a complex square matrix by LU factorisation with partial
 * pivoting (Gaussian elimination; Golub & Van Loan, Matrix Computations,
 * 4th ed., §3.4). The matrix is given as separate real and imaginary parts in
 * row-major Float64Arrays and is overwritten.
 */
import type { Complex } from './complex.js';

export function complexDeterminant(re: Float64Array, im: Float64Array, n: number): Complex {
  let dr = 1;
  let di = 0;
  for (let k = 0; k < n; k++) {
    let pivot = k;
    let best = -1;
    for (let i = k; i < n; i++) {
      const m = Math.hypot(re[i * n + k], im[i * n + k]);
      if (m > best) {
        best = m;
        pivot = i;
      }
    }
    if (best === 0) return { re: 0, im: 0 };
    if (pivot !== k) {
      for (let j = 0; j < n; j++) {
        const a = k * n + j;
        const b = pivot * n + j;
        [re[a], re[b]] = [re[b], re[a]];
        [im[a], im[b]] = [im[b], im[a]];
      }
      dr = -dr;
      di = -di;
    }
    const pr = re[k * n + k];
    const pi = im[k * n + k];
    const t = dr * pr - di * pi;
    di = dr * pi + di * pr;
    dr = t;
    const pp = pr * pr + pi * pi;
    for (let i = k + 1; i < n; i++) {
      const ar = re[i * n + k];
      const ai = im[i * n + k];
      const fr = (ar * pr + ai * pi) / pp;
      const fi = (ai * pr - ar * pi) / pp;
      for (let j = k + 1; j < n; j++) {
        const br = re[k * n + j];
        const bi = im[k * n + j];
        re[i * n + j] -= fr * br - fi * bi;
        im[i * n + j] -= fr * bi + fi * br;
      }
    }
  }
  return { re: dr, im: di };
}
