import { describe, expect, it } from 'vitest';
import { matrixNorm1, multiplyMatrices, solveLinearSystem } from '../../../src/analysis/time-response/dense-matrix.js';

describe('dense matrix helpers', () => {
  it('solve a system that needs row pivoting', () => {
    // [[0, 2], [1, 1]] x = [4, 3] → x = [1, 2].
    const x = solveLinearSystem(
      [
        [0, 2],
        [1, 1],
      ],
      [[4], [3]],
    );
    expect(x[0][0]).toBeCloseTo(1, 15);
    expect(x[1][0]).toBeCloseTo(2, 15);
  });
  it('multiply and take the largest column sum', () => {
    expect(multiplyMatrices([[1, 2]], [[3], [4]])).toEqual([[11]]);
    expect(
      matrixNorm1([
        [1, -5],
        [2, 1],
      ]),
    ).toBe(6);
  });
  it('refuse a singular matrix', () => {
    expect(() => solveLinearSystem([[0]], [[1]])).toThrow();
  });
});
