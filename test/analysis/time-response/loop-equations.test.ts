import { describe, expect, it } from 'vitest';
import { eigenvaluesOf } from '../../../src/analysis/time-response/eigenvalues.js';
import { assembleLoopEquations, delayFreeStateMatrix } from '../../../src/analysis/time-response/loop-equations.js';
import { realiseTransferFunction } from '../../../src/analysis/time-response/state-space-realisation.js';

describe('assembleLoopEquations', () => {
  it('gives the closed-loop characteristic roots of Dc·Dp + Nc·Np without delay', () => {
    // PI (2s + 1)/s on 1/(s + 1): s² + 3s + 1 = 0, roots (−3 ± √5)/2 (derivation).
    const loop = assembleLoopEquations(realiseTransferFunction([1], [1, 1]), realiseTransferFunction([2, 1], [1, 0]));
    const roots = eigenvaluesOf(delayFreeStateMatrix(loop)!)
      .map((r) => r.re)
      .sort((x, y) => x - y);
    expect(roots[0]).toBeCloseTo((-3 - Math.sqrt(5)) / 2, 13);
    expect(roots[1]).toBeCloseTo((-3 + Math.sqrt(5)) / 2, 13);
  });
  it('reports a loop with 1 + C(∞)P(∞) = 0 as not well posed', () => {
    const loop = assembleLoopEquations(realiseTransferFunction([1, 0], [1, 1]), realiseTransferFunction([-1], [1]));
    expect(delayFreeStateMatrix(loop)).toBeNull();
  });
});
