/**
 * Small dense real matrices (row-major arrays of rows) for the state-space
 * work of the time-response module. Sizes here are a handful to a few dozen,
 * so clarity wins over blocking or BLAS-style tricks.
 */
export type Matrix = number[][];

export function zeroMatrix(rows: number, cols: number): Matrix {
  return Array.from({ length: rows }, () => new Array<number>(cols).fill(0));
}

export function identityMatrix(n: number): Matrix {
  const m = zeroMatrix(n, n);
  for (let i = 0; i < n; i++) m[i][i] = 1;
  return m;
}

export function copyMatrix(a: Matrix): Matrix {
  return a.map((row) => row.slice());
}

export function multiplyMatrices(a: Matrix, b: Matrix): Matrix {
  const rows = a.length;
  const inner = b.length;
  const cols = inner === 0 ? 0 : b[0].length;
  const out = zeroMatrix(rows, cols);
  for (let i = 0; i < rows; i++) {
    const ai = a[i];
    const oi = out[i];
    for (let k = 0; k < inner; k++) {
      const aik = ai[k];
      if (aik === 0) continue;
      const bk = b[k];
      for (let j = 0; j < cols; j++) oi[j] += aik * bk[j];
    }
  }
  return out;
}

export function multiplyMatrixVector(a: Matrix, x: ArrayLike<number>): number[] {
  const out = new Array<number>(a.length).fill(0);
  for (let i = 0; i < a.length; i++) {
    const ai = a[i];
    let s = 0;
    for (let j = 0; j < ai.length; j++) s += ai[j] * x[j];
    out[i] = s;
  }
  return out;
}

/** Row vector times matrix: (vᵀ A)ᵀ. */
export function multiplyVectorMatrix(v: ArrayLike<number>, a: Matrix): number[] {
  const cols = a.length === 0 ? 0 : a[0].length;
  const out = new Array<number>(cols).fill(0);
  for (let i = 0; i < a.length; i++) {
    const vi = v[i];
    if (vi === 0) continue;
    const ai = a[i];
    for (let j = 0; j < cols; j++) out[j] += vi * ai[j];
  }
  return out;
}

export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/** Linear combination αA + βB of equally sized matrices. */
export function combineMatrices(alpha: number, a: Matrix, beta: number, b: Matrix): Matrix {
  return a.map((row, i) => row.map((v, j) => alpha * v + beta * b[i][j]));
}

/** Induced 1-norm: the largest absolute column sum. */
export function matrixNorm1(a: Matrix): number {
  if (a.length === 0) return 0;
  let best = 0;
  for (let j = 0; j < a[0].length; j++) {
    let s = 0;
    for (let i = 0; i < a.length; i++) s += Math.abs(a[i][j]);
    if (s > best) best = s;
  }
  return best;
}

/**
 * Solves A X = B by Gaussian elimination with partial (row) pivoting
 * (Golub & Van Loan, Matrix Computations, 4th ed., §3.4). Throws on an
 * exactly singular pivot; callers only pass matrices that are well
 * conditioned by construction (e.g. the Padé denominator of the matrix
 * exponential after scaling).
 */
export function solveLinearSystem(a: Matrix, b: Matrix): Matrix {
  const n = a.length;
  const m = copyMatrix(a);
  const x = copyMatrix(b);
  for (let k = 0; k < n; k++) {
    let pivot = k;
    let best = Math.abs(m[k][k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(m[i][k]);
      if (v > best) {
        best = v;
        pivot = i;
      }
    }
    if (best === 0) throw new Error('solveLinearSystem: singular matrix');
    if (pivot !== k) {
      [m[k], m[pivot]] = [m[pivot], m[k]];
      [x[k], x[pivot]] = [x[pivot], x[k]];
    }
    const mk = m[k];
    const xk = x[k];
    for (let i = k + 1; i < n; i++) {
      const factor = m[i][k] / mk[k];
      if (factor === 0) continue;
      const mi = m[i];
      for (let j = k; j < n; j++) mi[j] -= factor * mk[j];
      const xi = x[i];
      for (let j = 0; j < xi.length; j++) xi[j] -= factor * xk[j];
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    const xk = x[k];
    for (let j = 0; j < xk.length; j++) {
      let s = xk[j];
      for (let i = k + 1; i < n; i++) s -= m[k][i] * x[i][j];
      xk[j] = s / m[k][k];
    }
  }
  return x;
}
