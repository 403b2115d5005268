import { describe, expect, it } from 'vitest';
import { eigenvaluesOf } from '../../../src/analysis/time-response/eigenvalues.js';
import { matrixExponential } from '../../../src/analysis/time-response/matrix-exponential.js';
import { NonFiniteMatrixError } from '../../../src/analysis/time-response/non-finite-matrix-error.js';

// The contract layer refuses an overflowing realisation by this error's type (time-response-answer.ts).
describe('NonFiniteMatrixError', () => {
  it('is what the matrix exponential throws for an entry of ±∞', () => {
    expect(() => matrixExponential([[1, Infinity], [0, 1]])).toThrow(NonFiniteMatrixError);
  });

  it('is what the eigenvalue routine throws for a NaN entry', () => {
    expect(() => eigenvaluesOf([[NaN, 0], [0, 1]])).toThrow(NonFiniteMatrixError);
  });

  it('finite matrices pass: exp of the zero matrix is the identity', () => {
    expect(matrixExponential([[0, 0], [0, 0]])).toEqual([[1, 0], [0, 1]]);
  });
});
