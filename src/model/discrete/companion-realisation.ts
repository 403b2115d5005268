/**
 * A state-space realisation (A, B, C, D) of a proper N(s)/D(s) in
 * controllable canonical form (companion matrix of D; Åström & Wittenmark,
 * Computer-Controlled Systems, 3rd ed., §2.5, or any linear-systems text),
 * balanced by a diagonal similarity (Parlett & Reinsch 1969) because
 * companion matrices of polynomials with spread roots are badly scaled.
 * The transfer function C(sI − A)⁻¹B + D is unchanged by the similarity.
 */
import { balanceMatrix } from '../../numeric/balance-matrix.js';
import type { RealMatrix } from '../../numeric/real-matrix.js';
import { trimLeading } from '../../numeric/polynomial.js';
import { ModelError } from '../model-error.js';

export interface StateSpaceRealisation {
  a: RealMatrix;
  b: number[];
  c: number[];
  d: number;
}

export function companionRealisation(numeratorIn: readonly number[], denominatorIn: readonly number[]): StateSpaceRealisation {
  const den = trimLeading(denominatorIn);
  const num = trimLeading(numeratorIn);
  const n = den.length - 1;
  if (num.length - 1 > n) {
    throw new ModelError('improper_plant', 'The plant has more zeros than poles; a sample-and-hold equivalent does not exist.', ['plant']);
  }
  const lead = den[0];
  const a1 = den.map((x) => x / lead); // monic
  const b1 = new Array<number>(n + 1 - num.length).fill(0).concat(num.map((x) => x / lead));
  const d = b1[0];
  // C row: coefficients of N − d·D in descending powers s^(n−1) ... s^0.
  const c = Array.from({ length: n }, (_, i) => b1[i + 1] - d * a1[i + 1]);
  const a: RealMatrix = Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => (i === 0 ? -a1[j + 1] : i === j + 1 ? 1 : 0)),
  );
  const b = Array.from({ length: n }, (_, i) => (i === 0 ? 1 : 0));
  const balanced = balanceMatrix(a);
  return {
    a: balanced.a,
    b: b.map((x, i) => x / balanced.scale[i]),
    c: c.map((x, i) => x * balanced.scale[i]),
    d,
  };
}
