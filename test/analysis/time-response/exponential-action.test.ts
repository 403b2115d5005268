import { describe, expect, it } from 'vitest';
import { multiplyMatrixVector } from '../../../src/analysis/time-response/dense-matrix.js';
import { exponentialAction } from '../../../src/analysis/time-response/exponential-action.js';
import { matrixExponential } from '../../../src/analysis/time-response/matrix-exponential.js';

describe('exponentialAction', () => {
  it('rotates a vector by a quarter turn (closed form)', () => {
    const x = exponentialAction(
      [
        [0, 1],
        [-1, 0],
      ],
      Math.PI / 2,
      [1, 0],
    );
    expect(x[0]).toBeCloseTo(0, 14);
    expect(x[1]).toBeCloseTo(-1, 14);
  });
  it('agrees with the full exponential on a non-normal matrix, with and without substeps', () => {
    // Chain-like matrix as in the delayed step propagation.
    const a = [
      [-0.7, 0.4, 0.2, 0],
      [0, -0.1, 1, 0],
      [0, 0, 0, 1],
      [0, 0, 0, 0],
    ];
    const v = [0.3, -1, 2, 0.5];
    for (const t of [0.4, 3, 40]) {
      const want = multiplyMatrixVector(matrixExponential(a.map((r) => r.map((x) => x * t))), v);
      exponentialAction(a, t, v).forEach((x, i) => expect(Math.abs(x - want[i])).toBeLessThan(1e-12 * Math.max(1, Math.abs(want[i]))));
    }
  });
});
