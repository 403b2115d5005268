import type { Matrix } from './dense-matrix.js';
import { balancingScales } from './eigenvalues.js';

/** Single-input single-output state space x' = A x + B u, y = C x + D u. */
export interface SisoStateSpace {
  a: Matrix;
  b: number[];
  c: number[];
  d: number;
}

/**
 * State-space realisation of a proper rational transfer function N(s)/D(s)
 * (coefficients in descending powers, D with non-zero leading coefficient,
 * deg N ≤ deg D) in controllable canonical form (T. Kailath, Linear Systems,
 * 1980, §2.1), followed by a diagonal power-of-two similarity from
 * Parlett–Reinsch balancing of A, which keeps the states of a companion
 * matrix with widely spread coefficients on comparable scales without
 * changing the transfer function.
 *
 * Example: realiseTransferFunction([1], [1, 1]) → A = [[−1]], B = [1], C = [1], D = 0.
 */
export function realiseTransferFunction(numerator: readonly number[], denominator: readonly number[]): SisoStateSpace {
  const n = denominator.length - 1;
  const lead = denominator[0];
  const den = denominator.map((c) => c / lead);
  const num = new Array<number>(n + 1 - numerator.length).fill(0).concat(numerator.map((c) => c / lead));
  const d = num[0];
  // Strictly proper remainder N/lead − d·D/lead, coefficients of s^{n−1} … s^0.
  const remainder = num.slice(1).map((c, i) => c - d * den[i + 1]);
  const a: Matrix = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n - 1; i++) a[i][i + 1] = 1;
  for (let j = 0; j < n; j++) if (n > 0) a[n - 1][j] = -den[n - j];
  const b = new Array<number>(n).fill(0);
  if (n > 0) b[n - 1] = 1;
  const c = new Array<number>(n).fill(0);
  for (let j = 0; j < n; j++) c[j] = remainder[n - 1 - j];
  // Balance: with x = S z, A' = S⁻¹ A S, B' = S⁻¹ B, C' = C S.
  const scales = balancingScales(a);
  const ab = a.map((row, i) => row.map((v, j) => (v * scales[j]) / scales[i]));
  const bb = b.map((v, i) => v / scales[i]);
  const cb = c.map((v, j) => v * scales[j]);
  return { a: ab, b: bb, c: cb, d };
}
