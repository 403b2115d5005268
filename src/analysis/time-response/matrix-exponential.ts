import { NonFiniteMatrixError } from './non-finite-matrix-error.js';
import {
  combineMatrices,
  identityMatrix,
  matrixNorm1,
  multiplyMatrices,
  solveLinearSystem,
  type Matrix,
} from './dense-matrix.js';

/**
 * Coefficients of the [13/13] Padé approximant of exp(x):
 * c_j = (26 − j)! 13! / (26! j! (13 − j)!), computed rather than typed in.
 */
const PADE_DEGREE = 13;
const PADE_COEFFICIENTS: number[] = (() => {
  const c = [1];
  for (let j = 1; j <= PADE_DEGREE; j++) {
    c.push((c[j - 1] * (PADE_DEGREE - j + 1)) / (j * (2 * PADE_DEGREE - j + 1)));
  }
  return c;
})();

/**
 * Largest 1-norm for which the [13/13] Padé approximant is accurate to unit
 * round-off in double precision (θ₁₃ in Higham 2005, Table 2.3).
 */
const THETA_13 = 5.371920351148152;

/**
 * Matrix exponential e^A by scaling and squaring with the [13/13] Padé
 * approximant: N. J. Higham, "The scaling and squaring method for the matrix
 * exponential revisited", SIAM J. Matrix Anal. Appl. 26(4), 2005, 1179–1193
 * (Algorithm 2.3, degree-13 branch only; the lower-degree branches there only
 * save work).
 *
 * Example: matrixExponential([[0, 1], [-1, 0]]) ≈ [[cos 1, sin 1], [−sin 1, cos 1]].
 */
export function matrixExponential(a: Matrix): Matrix {
  const n = a.length;
  if (n === 0) return [];
  const norm = matrixNorm1(a);
  if (!Number.isFinite(norm)) throw new NonFiniteMatrixError('matrixExponential');
  const squarings = norm > THETA_13 ? Math.max(0, Math.ceil(Math.log2(norm / THETA_13))) : 0;
  const scale = 2 ** -squarings;
  const s = a.map((row) => row.map((v) => v * scale));
  const b = PADE_COEFFICIENTS;
  const id = identityMatrix(n);
  const s2 = multiplyMatrices(s, s);
  const s4 = multiplyMatrices(s2, s2);
  const s6 = multiplyMatrices(s4, s2);
  // Odd part U = S·(S6(b13 S6 + b11 S4 + b9 S2) + b7 S6 + b5 S4 + b3 S2 + b1 I),
  // even part V = S6(b12 S6 + b10 S4 + b8 S2) + b6 S6 + b4 S4 + b2 S2 + b0 I.
  const u1 = sumScaled(n, [
    [b[13], s6],
    [b[11], s4],
    [b[9], s2],
  ]);
  const u2 = sumScaled(n, [
    [b[7], s6],
    [b[5], s4],
    [b[3], s2],
    [b[1], id],
  ]);
  const u = multiplyMatrices(s, combineMatrices(1, multiplyMatrices(s6, u1), 1, u2));
  const v1 = sumScaled(n, [
    [b[12], s6],
    [b[10], s4],
    [b[8], s2],
  ]);
  const v2 = sumScaled(n, [
    [b[6], s6],
    [b[4], s4],
    [b[2], s2],
    [b[0], id],
  ]);
  const v = combineMatrices(1, multiplyMatrices(s6, v1), 1, v2);
  let r = solveLinearSystem(combineMatrices(1, v, -1, u), combineMatrices(1, v, 1, u));
  for (let k = 0; k < squarings; k++) r = multiplyMatrices(r, r);
  return r;
}

function sumScaled(n: number, terms: Array<[number, Matrix]>): Matrix {
  const out: Matrix = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (const [c, m] of terms) {
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i][j] += c * m[i][j];
  }
  return out;
}
