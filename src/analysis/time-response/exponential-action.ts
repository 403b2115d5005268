import { matrixNorm1, multiplyMatrixVector, type Matrix } from './dense-matrix.js';
import { matrixExponential } from './matrix-exponential.js';

/** Above this 1-norm of tA the full exponential is cheaper than Taylor substeps. */
const MAX_TAYLOR_NORM = 8;
const MAX_TERMS = 60;

/**
 * e^{tA} v without forming e^{tA}: s = ⌈‖tA‖₁⌉ substeps of a truncated Taylor
 * series, each summed until the next term is below round-off of the partial
 * sum (the truncated-Taylor scheme of A. H. Al-Mohy, N. J. Higham, "Computing
 * the action of the matrix exponential, with an application to exponential
 * integrators", SIAM J. Sci. Comput. 33(2), 2011, with the simple choice of
 * one unit of norm per substep instead of their optimised degree/scaling
 * table). Large norms go through the full scaling-and-squaring exponential.
 *
 * Example: exponentialAction([[0, 1], [-1, 0]], Math.PI / 2, [1, 0]) ≈ [0, −1].
 */
export function exponentialAction(a: Matrix, t: number, v: readonly number[]): number[] {
  const n = v.length;
  if (t === 0 || n === 0) return v.slice();
  const norm = Math.abs(t) * matrixNorm1(a);
  if (norm > MAX_TAYLOR_NORM) {
    return multiplyMatrixVector(matrixExponential(a.map((row) => row.map((x) => x * t))), v);
  }
  const substeps = Math.max(1, Math.ceil(norm));
  const h = t / substeps;
  let x = v.slice();
  const term = new Float64Array(n);
  const next = new Float64Array(n);
  for (let s = 0; s < substeps; s++) {
    for (let i = 0; i < n; i++) term[i] = x[i];
    const sum = x.slice();
    for (let k = 1; k <= MAX_TERMS; k++) {
      let termNorm = 0;
      let sumNorm = 0;
      for (let i = 0; i < n; i++) {
        const row = a[i];
        let acc = 0;
        for (let j = 0; j < n; j++) acc += row[j] * term[j];
        next[i] = (acc * h) / k;
      }
      for (let i = 0; i < n; i++) {
        term[i] = next[i];
        sum[i] += next[i];
        termNorm += Math.abs(next[i]);
        sumNorm += Math.abs(sum[i]);
      }
      if (termNorm <= 1e-17 * sumNorm || termNorm === 0) break;
    }
    x = sum;
  }
  return x;
}
