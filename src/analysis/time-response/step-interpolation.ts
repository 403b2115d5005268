/**
 * Polynomial representation of a signal on one simulation step, in the
 * normalised step time σ ∈ [0, 1]. The signal is sampled at the q
 * Chebyshev–Lobatto points σ_j = (1 − cos(πj/(q−1)))/2, which include both
 * ends of the step (so a jump at a step boundary is kept as a left and a
 * right value), and replaced by its interpolating polynomial of degree q − 1
 * (L. N. Trefethen, Approximation Theory and Approximation Practice, 2013,
 * ch. 2–4: interpolation error of order (h/2)^q·|w^{(q)}|/(q!·2^{q−1})).
 * The interpolant is held in monomial form (what the derivative chain of the
 * exact propagation needs); the Vandermonde matrix of 8 such nodes on [0, 1]
 * has condition ≈ 9e4, which sets a round-off floor of about 1e−12 relative.
 */
export interface StepInterpolation {
  nodeCount: number;
  nodes: number[];
  /** monomialFromValues[i][l]: coefficient of σ^i in the Lagrange basis polynomial of node l. */
  monomialFromValues: number[][];
}

export function createStepInterpolation(nodeCount: number): StepInterpolation {
  const q = nodeCount;
  const nodes = Array.from({ length: q }, (_, j) => (j === 0 ? 0 : j === q - 1 ? 1 : (1 - Math.cos((Math.PI * j) / (q - 1))) / 2));
  const monomialFromValues = Array.from({ length: q }, () => new Array<number>(q).fill(0));
  for (let l = 0; l < q; l++) {
    // Expand Π_{k≠l} (σ − σ_k)/(σ_l − σ_k) in ascending powers.
    let poly = [1];
    for (let k = 0; k < q; k++) {
      if (k === l) continue;
      const scale = 1 / (nodes[l] - nodes[k]);
      const next = new Array<number>(poly.length + 1).fill(0);
      for (let i = 0; i < poly.length; i++) {
        next[i + 1] += poly[i] * scale;
        next[i] -= poly[i] * nodes[k] * scale;
      }
      poly = next;
    }
    for (let i = 0; i < q; i++) monomialFromValues[i][l] = poly[i];
  }
  return { nodeCount: q, nodes, monomialFromValues };
}

/** Monomial coefficients (ascending powers of σ) of the interpolant through the node values. */
export function monomialCoefficients(interp: StepInterpolation, values: ArrayLike<number>, offset = 0): number[] {
  const q = interp.nodeCount;
  const out = new Array<number>(q).fill(0);
  for (let i = 0; i < q; i++) {
    const row = interp.monomialFromValues[i];
    let s = 0;
    for (let l = 0; l < q; l++) s += row[l] * values[offset + l];
    out[i] = s;
  }
  return out;
}

/** Value and σ-derivative of an ascending-power polynomial at σ. */
export function evaluateWithDerivative(coefficients: readonly number[], sigma: number): [number, number] {
  let value = 0;
  let slope = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) {
    slope = slope * sigma + value;
    value = value * sigma + coefficients[i];
  }
  return [value, slope];
}
