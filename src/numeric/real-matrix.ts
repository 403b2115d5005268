/**
 * Small dense real matrices as arrays of rows, for the few places that need
 * linear algebra once per model (matrix exponentials, realisations), not in
 * hot loops.
 */
export type RealMatrix = number[][];

export const identity = (n: number): RealMatrix =>
  Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));

export function matrixProduct(a: RealMatrix, b: RealMatrix): RealMatrix {
  const n = a.length;
  const m = b[0]?.length ?? 0;
  const k = b.length;
  const out: RealMatrix = Array.from({ length: n }, () => new Array<number>(m).fill(0));
  for (let i = 0; i < n; i++) {
    const row = out[i];
    for (let l = 0; l < k; l++) {
      const x = a[i][l];
      if (x === 0) continue;
      const bl = b[l];
      for (let j = 0; j < m; j++) row[j] += x * bl[j];
    }
  }
  return out;
}

/** α·A + β·B. */
export const linearCombination = (alpha: number, a: RealMatrix, beta: number, b: RealMatrix): RealMatrix =>
  a.map((row, i) => row.map((x, j) => alpha * x + beta * b[i][j]));

/** Largest absolute column sum (the matrix 1-norm). */
export function norm1(a: RealMatrix): number {
  let best = 0;
  for (let j = 0; j < (a[0]?.length ?? 0); j++) {
    let s = 0;
    for (let i = 0; i < a.length; i++) s += Math.abs(a[i][j]);
    best = Math.max(best, s);
  }
  return best;
}

/**
 * X with A·X = B by Gaussian elimination with partial pivoting (Golub & Van
 * Loan, Matrix Computations, 4th ed., §3.4). Throws on an exactly singular A.
 */
export function solveMatrix(aIn: RealMatrix, bIn: RealMatrix): RealMatrix {
  const n = aIn.length;
  const a = aIn.map((r) => r.slice());
  const b = bIn.map((r) => r.slice());
  const m = b[0]?.length ?? 0;
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(a[i][k]) > Math.abs(a[p][k])) p = i;
    if (a[p][k] === 0) throw new Error('solveMatrix: singular matrix');
    if (p !== k) {
      [a[p], a[k]] = [a[k], a[p]];
      [b[p], b[k]] = [b[k], b[p]];
    }
    const pivot = a[k][k];
    for (let i = k + 1; i < n; i++) {
      const f = a[i][k] / pivot;
      if (f === 0) continue;
      for (let j = k; j < n; j++) a[i][j] -= f * a[k][j];
      for (let j = 0; j < m; j++) b[i][j] -= f * b[k][j];
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    for (let j = 0; j < m; j++) {
      let s = b[k][j];
      for (let l = k + 1; l < n; l++) s -= a[k][l] * b[l][j];
      b[k][j] = s / a[k][k];
    }
  }
  return b;
}
