/**
 * The matrix exponential e^A by scaling and squaring with Padé approximants
 * of degree 3, 5, 7, 9 or 13, chosen from the 1-norm (N. J. Higham, "The
 * scaling and squaring method for the matrix exponential revisited", SIAM J.
 * Matrix Anal. Appl. 26(4), 2005, 1179–1193, Algorithm 2.3). Accurate to
 * about unit round-off times the conditioning of the exponential.
 *
 * @example matrixExponential([[0, 1], [-1, 0]]) // ≈ [[cos 1, sin 1], [−sin 1, cos 1]]
 */
import { identity, linearCombination, matrixProduct, norm1, solveMatrix, type RealMatrix } from './real-matrix.js';

/** Padé [m/m] coefficients of exp: b_j = (2m − j)!·m! / ((2m)!·j!·(m − j)!), scaled so b_m = 1 as in Higham's tables. */
function padeCoefficients(m: number): number[] {
  const c = [1];
  for (let j = 1; j <= m; j++) c.push((c[j - 1] * (m - j + 1)) / (j * (2 * m - j + 1)));
  const last = c[m];
  return c.map((x) => x / last);
}

/** θ_m of Higham 2005, Table 2.3: the largest ‖A‖₁ for which degree m is accurate to unit round-off. */
const DEGREES: { m: number; theta: number }[] = [
  { m: 3, theta: 1.495585217958292e-2 },
  { m: 5, theta: 2.539398330063230e-1 },
  { m: 7, theta: 9.504178996162932e-1 },
  { m: 9, theta: 2.097847961257068 },
  { m: 13, theta: 5.371920351148152 },
];
const COEFFICIENTS = new Map(DEGREES.map((d) => [d.m, padeCoefficients(d.m)]));

/** U (odd part) and V (even part) of the Padé approximant r_m(A) = (V − U)⁻¹(V + U). */
function padeParts(a: RealMatrix, m: number): { u: RealMatrix; v: RealMatrix } {
  const n = a.length;
  const b = COEFFICIENTS.get(m)!;
  const id = identity(n);
  const a2 = matrixProduct(a, a);
  if (m < 13) {
    // Powers A², A⁴, ... up to A^(m−1).
    const powers: RealMatrix[] = [id, a2];
    for (let k = 4; k <= m - 1; k += 2) powers.push(matrixProduct(powers[powers.length - 1], a2));
    let odd = id.map((r) => r.map(() => 0));
    let even = odd;
    powers.forEach((p, i) => {
      odd = linearCombination(1, odd, b[2 * i + 1], p);
      even = linearCombination(1, even, b[2 * i], p);
    });
    return { u: matrixProduct(a, odd), v: even };
  }
  const a4 = matrixProduct(a2, a2);
  const a6 = matrixProduct(a4, a2);
  const sum = (terms: [number, RealMatrix][]) =>
    terms.reduce((acc, [c, x]) => linearCombination(1, acc, c, x), id.map((r) => r.map(() => 0)));
  const u = matrixProduct(
    a,
    linearCombination(1, matrixProduct(a6, sum([[b[13], a6], [b[11], a4], [b[9], a2]])), 1, sum([[b[7], a6], [b[5], a4], [b[3], a2], [b[1], id]])),
  );
  const v = linearCombination(1, matrixProduct(a6, sum([[b[12], a6], [b[10], a4], [b[8], a2]])), 1, sum([[b[6], a6], [b[4], a4], [b[2], a2], [b[0], id]]));
  return { u, v };
}

export function matrixExponential(a: RealMatrix): RealMatrix {
  const n = a.length;
  if (n === 0) return [];
  const norm = norm1(a);
  for (const { m, theta } of DEGREES) {
    if (m < 13 && norm <= theta) {
      const { u, v } = padeParts(a, m);
      return solveMatrix(linearCombination(1, v, -1, u), linearCombination(1, v, 1, u));
    }
  }
  const s = norm > DEGREES[4].theta ? Math.ceil(Math.log2(norm / DEGREES[4].theta)) : 0;
  const scaled = s > 0 ? a.map((r) => r.map((x) => x / 2 ** s)) : a;
  const { u, v } = padeParts(scaled, 13);
  let e = solveMatrix(linearCombination(1, v, -1, u), linearCombination(1, v, 1, u));
  for (let k = 0; k < s; k++) e = matrixProduct(e, e);
  return e;
}
