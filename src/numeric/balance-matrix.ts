/**
 * Diagonal similarity D⁻¹·A·D that makes the rows and columns of A of
 * comparable size, with D made of powers of two so the scaling itself is
 * exact (B. N. Parlett, C. Reinsch, "Balancing a matrix for calculation of
 * eigenvalues and eigenvectors", Numer. Math. 13, 1969). Companion matrices
 * of polynomials with widely spread roots are badly scaled; balancing them
 * first makes their exponential accurate.
 *
 * @example balanceMatrix([[0, 1e6], [1e-6, 0]]) // → a ≈ [[0, 1], [1, 0]], scale ≈ [1, 2^-20]
 */
import type { RealMatrix } from './real-matrix.js';

const RADIX = 2;

export function balanceMatrix(aIn: RealMatrix): { a: RealMatrix; scale: number[] } {
  const a = aIn.map((r) => r.slice());
  const n = a.length;
  const scale = new Array<number>(n).fill(1);
  let converged = false;
  for (let sweep = 0; !converged && sweep < 100; sweep++) {
    converged = true;
    for (let i = 0; i < n; i++) {
      let c = 0;
      let r = 0;
      for (let j = 0; j < n; j++) {
        if (j === i) continue;
        c += Math.abs(a[j][i]);
        r += Math.abs(a[i][j]);
      }
      if (c === 0 || r === 0) continue;
      const total = c + r;
      let f = 1;
      let g = r / RADIX;
      while (c < g) {
        f *= RADIX;
        c *= RADIX * RADIX;
      }
      g = r * RADIX;
      while (c > g) {
        f /= RADIX;
        c /= RADIX * RADIX;
      }
      if ((c + r) / f < 0.95 * total) {
        converged = false;
        scale[i] *= f;
        for (let j = 0; j < n; j++) a[i][j] /= f;
        for (let j = 0; j < n; j++) a[j][i] *= f;
      }
    }
  }
  return { a, scale };
}
