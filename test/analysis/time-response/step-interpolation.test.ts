import { describe, expect, it } from 'vitest';
import {
  createStepInterpolation,
  evaluateWithDerivative,
  monomialCoefficients,
} from '../../../src/analysis/time-response/step-interpolation.js';

describe('createStepInterpolation', () => {
  const interp = createStepInterpolation(8);
  it('places Chebyshev–Lobatto nodes with both step ends included', () => {
    expect(interp.nodes[0]).toBe(0);
    expect(interp.nodes[7]).toBe(1);
    // σ_j = (1 − cos(πj/7))/2 (Trefethen, ATAP ch. 2).
    expect(interp.nodes[3]).toBeCloseTo((1 - Math.cos((3 * Math.PI) / 7)) / 2, 15);
  });
  it('reproduces every polynomial of degree ≤ 7 and its derivative', () => {
    // To round-off amplified by the monomial Vandermonde matrix on these nodes (condition ≈ 9e4).
    for (let k = 0; k <= 7; k++) {
      const values = interp.nodes.map((s) => s ** k);
      const coefficients = monomialCoefficients(interp, values);
      for (const s of [0.13, 0.5, 0.91]) {
        const [v, d] = evaluateWithDerivative(coefficients, s);
        expect(Math.abs(v - s ** k)).toBeLessThan(5e-12);
        expect(Math.abs(d - (k === 0 ? 0 : k * s ** (k - 1)))).toBeLessThan(1e-10);
      }
    }
  });
  it('interpolates e^{λσ} with the error the node count predicts', () => {
    // (|λ|/2)^8/(8!·2^7) ≈ 3e−12 for |λ| = 0.5 (Trefethen, ATAP ch. 4 bound, up to a modest factor).
    const lambda = -0.5;
    const coefficients = monomialCoefficients(interp, interp.nodes.map((s) => Math.exp(lambda * s)));
    let worst = 0;
    for (let i = 0; i <= 100; i++) {
      const s = i / 100;
      worst = Math.max(worst, Math.abs(evaluateWithDerivative(coefficients, s)[0] - Math.exp(lambda * s)));
    }
    expect(worst).toBeLessThan(2e-11);
  });
});
