import { NonFiniteMatrixError } from './non-finite-matrix-error.js';
import { copyMatrix, type Matrix } from './dense-matrix.js';

export interface ComplexNumber {
  re: number;
  im: number;
}

/**
 * Eigenvalues of a real square matrix by the classical three-stage route:
 * balancing by powers of two (B. N. Parlett, C. Reinsch, "Balancing a matrix
 * for calculation of eigenvalues and eigenvectors", Numer. Math. 13, 1969),
 * Householder reduction to upper Hessenberg form, and the Francis
 * double-shift QR iteration with Wilkinson's exceptional shifts
 * (J. H. Wilkinson, C. Reinsch, Handbook for Automatic Computation II, 1971,
 * procedure hqr; Golub & Van Loan, Matrix Computations, 4th ed., Alg. 7.5.2).
 * Complex eigenvalues come out in conjugate pairs.
 *
 * Example: eigenvaluesOf([[0, 1], [-2, -3]]) → −1 and −2 (in some order).
 */
export function eigenvaluesOf(matrix: Matrix): ComplexNumber[] {
  const n = matrix.length;
  if (n === 0) return [];
  for (const row of matrix) {
    for (const v of row) if (!Number.isFinite(v)) throw new NonFiniteMatrixError('eigenvaluesOf');
  }
  const a = copyMatrix(matrix);
  balanceInPlace(a);
  reduceToHessenbergInPlace(a);
  return hessenbergQrEigenvalues(a);
}

/**
 * Roots of a real polynomial (coefficients in descending powers, leading
 * coefficient non-zero) as the eigenvalues of its companion matrix
 * (A. Edelman, H. Murakami, "Polynomial roots from companion matrix
 * eigenvalues", Math. Comp. 64, 1995).
 */
export function polynomialRootsOf(coefficients: readonly number[]): ComplexNumber[] {
  const degree = coefficients.length - 1;
  if (degree < 1) return [];
  const lead = coefficients[0];
  if (lead === 0) throw new Error('polynomialRootsOf: leading coefficient is zero');
  const c: Matrix = Array.from({ length: degree }, () => new Array<number>(degree).fill(0));
  for (let j = 0; j < degree; j++) c[0][j] = -coefficients[j + 1] / lead;
  for (let i = 1; i < degree; i++) c[i][i - 1] = 1;
  return eigenvaluesOf(c);
}

/** Diagonal similarity D⁻¹AD with D a power of two per row (Parlett–Reinsch). */
export function balancingScales(matrix: Matrix): number[] {
  const a = copyMatrix(matrix);
  return balanceInPlace(a);
}

function balanceInPlace(a: Matrix): number[] {
  const n = a.length;
  const scales = new Array<number>(n).fill(1);
  const radix = 2;
  const radixSquared = radix * radix;
  let converged = false;
  let sweeps = 0;
  while (!converged && sweeps < 100) {
    converged = true;
    sweeps++;
    for (let i = 0; i < n; i++) {
      let c = 0;
      let r = 0;
      for (let j = 0; j < n; j++) {
        if (j === i) continue;
        c += Math.abs(a[j][i]);
        r += Math.abs(a[i][j]);
      }
      if (c === 0 || r === 0) continue;
      let g = r / radix;
      let f = 1;
      const s = c + r;
      while (c < g) {
        f *= radix;
        c *= radixSquared;
      }
      g = r * radix;
      while (c > g) {
        f /= radix;
        c /= radixSquared;
      }
      if ((c + r) / f < 0.95 * s) {
        converged = false;
        const inv = 1 / f;
        for (let j = 0; j < n; j++) a[i][j] *= inv;
        for (let j = 0; j < n; j++) a[j][i] *= f;
        scales[i] *= f;
      }
    }
  }
  return scales;
}

function reduceToHessenbergInPlace(a: Matrix): void {
  const n = a.length;
  for (let k = 0; k < n - 2; k++) {
    let alpha = 0;
    for (let i = k + 1; i < n; i++) alpha += a[i][k] * a[i][k];
    alpha = Math.sqrt(alpha);
    if (alpha === 0) continue;
    if (a[k + 1][k] > 0) alpha = -alpha;
    const v = new Array<number>(n).fill(0);
    v[k + 1] = a[k + 1][k] - alpha;
    for (let i = k + 2; i < n; i++) v[i] = a[i][k];
    let vv = 0;
    for (let i = k + 1; i < n; i++) vv += v[i] * v[i];
    if (vv === 0) continue;
    // A ← (I − 2vvᵀ/vᵀv) A (I − 2vvᵀ/vᵀv)
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let i = k + 1; i < n; i++) s += v[i] * a[i][j];
      const f = (2 * s) / vv;
      for (let i = k + 1; i < n; i++) a[i][j] -= f * v[i];
    }
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = k + 1; j < n; j++) s += a[i][j] * v[j];
      const f = (2 * s) / vv;
      for (let j = k + 1; j < n; j++) a[i][j] -= f * v[j];
    }
    for (let i = k + 2; i < n; i++) a[i][k] = 0;
  }
}

function signOf(magnitude: number, sign: number): number {
  return sign >= 0 ? Math.abs(magnitude) : -Math.abs(magnitude);
}

function hessenbergQrEigenvalues(a: Matrix): ComplexNumber[] {
  const n = a.length;
  const wr = new Array<number>(n).fill(0);
  const wi = new Array<number>(n).fill(0);
  const eps = Number.EPSILON;
  let anorm = 0;
  for (let i = 0; i < n; i++) for (let j = Math.max(i - 1, 0); j < n; j++) anorm += Math.abs(a[i][j]);
  let nn = n - 1;
  let t = 0;
  let p = 0;
  let q = 0;
  let r = 0;
  let x = 0;
  let y = 0;
  let z = 0;
  let w = 0;
  let s = 0;
  while (nn >= 0) {
    let its = 0;
    let l: number;
    do {
      // Look for a single small subdiagonal element to split the matrix.
      for (l = nn; l >= 1; l--) {
        s = Math.abs(a[l - 1][l - 1]) + Math.abs(a[l][l]);
        if (s === 0) s = anorm;
        if (Math.abs(a[l][l - 1]) <= eps * s) {
          a[l][l - 1] = 0;
          break;
        }
      }
      x = a[nn][nn];
      if (l === nn) {
        wr[nn] = x + t;
        wi[nn] = 0;
        nn--;
      } else {
        y = a[nn - 1][nn - 1];
        w = a[nn][nn - 1] * a[nn - 1][nn];
        if (l === nn - 1) {
          p = 0.5 * (y - x);
          q = p * p + w;
          z = Math.sqrt(Math.abs(q));
          x += t;
          if (q >= 0) {
            z = p + signOf(z, p);
            wr[nn - 1] = wr[nn] = x + z;
            if (z !== 0) wr[nn] = x - w / z;
            wi[nn - 1] = wi[nn] = 0;
          } else {
            wr[nn - 1] = wr[nn] = x + p;
            wi[nn - 1] = -z;
            wi[nn] = z;
          }
          nn -= 2;
        } else {
          if (its === 60) throw new Error('eigenvaluesOf: QR iteration did not converge');
          if (its === 10 || its === 20 || its === 40) {
            // Exceptional shift (Wilkinson) to break cycles.
            t += x;
            for (let i = 0; i <= nn; i++) a[i][i] -= x;
            s = Math.abs(a[nn][nn - 1]) + Math.abs(a[nn - 1][nn - 2]);
            y = x = 0.75 * s;
            w = -0.4375 * s * s;
          }
          ++its;
          let m: number;
          for (m = nn - 2; m >= l; m--) {
            z = a[m][m];
            r = x - z;
            s = y - z;
            p = (r * s - w) / a[m + 1][m] + a[m][m + 1];
            q = a[m + 1][m + 1] - z - r - s;
            r = a[m + 2][m + 1];
            s = Math.abs(p) + Math.abs(q) + Math.abs(r);
            p /= s;
            q /= s;
            r /= s;
            if (m === l) break;
            const u = Math.abs(a[m][m - 1]) * (Math.abs(q) + Math.abs(r));
            const v = Math.abs(p) * (Math.abs(a[m - 1][m - 1]) + Math.abs(z) + Math.abs(a[m + 1][m + 1]));
            if (u <= eps * v) break;
          }
          for (let i = m + 2; i <= nn; i++) {
            a[i][i - 2] = 0;
            if (i !== m + 2) a[i][i - 3] = 0;
          }
          for (let k = m; k <= nn - 1; k++) {
            if (k !== m) {
              p = a[k][k - 1];
              q = a[k + 1][k - 1];
              r = 0;
              if (k !== nn - 1) r = a[k + 2][k - 1];
              x = Math.abs(p) + Math.abs(q) + Math.abs(r);
              if (x !== 0) {
                p /= x;
                q /= x;
                r /= x;
              }
            }
            s = signOf(Math.sqrt(p * p + q * q + r * r), p);
            if (s !== 0) {
              if (k === m) {
                if (l !== m) a[k][k - 1] = -a[k][k - 1];
              } else {
                a[k][k - 1] = -s * x;
              }
              p += s;
              x = p / s;
              y = q / s;
              z = r / s;
              q /= p;
              r /= p;
              for (let j = k; j <= nn; j++) {
                p = a[k][j] + q * a[k + 1][j];
                if (k !== nn - 1) {
                  p += r * a[k + 2][j];
                  a[k + 2][j] -= p * z;
                }
                a[k + 1][j] -= p * y;
                a[k][j] -= p * x;
              }
              const mmin = nn < k + 3 ? nn : k + 3;
              for (let i = l; i <= mmin; i++) {
                p = x * a[i][k] + y * a[i][k + 1];
                if (k !== nn - 1) {
                  p += z * a[i][k + 2];
                  a[i][k + 2] -= p * r;
                }
                a[i][k + 1] -= p * q;
                a[i][k] -= p;
              }
            }
          }
        }
      }
    } while (l < nn - 1);
  }
  return wr.map((re, i) => ({ re, im: wi[i] }));
}
