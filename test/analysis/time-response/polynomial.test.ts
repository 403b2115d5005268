import { describe, expect, it } from 'vitest';
import {
  addPolynomials,
  evaluatePolynomialComplex,
  multiplyPolynomials,
  rootsAtOriginCount,
  trimLeadingZeros,
} from '../../../src/analysis/time-response/polynomial.js';

describe('polynomial helpers', () => {
  it('multiply and add in descending powers', () => {
    expect(multiplyPolynomials([1, 1], [1, 2])).toEqual([1, 3, 2]);
    expect(addPolynomials([1, 3, 2], [5])).toEqual([1, 3, 7]);
  });
  it('evaluate at a complex point: s² + 1 vanishes at j', () => {
    expect(evaluatePolynomialComplex([1, 0, 1], 0, 1)).toEqual([0, 0]);
    expect(evaluatePolynomialComplex([1, 2], 1, 3)).toEqual([3, 3]);
  });
  it('trim leading zeros and count roots at the origin', () => {
    expect(trimLeadingZeros([0, 0, 2, 0])).toEqual([2, 0]);
    expect(trimLeadingZeros([0, 0])).toEqual([0]);
    expect(rootsAtOriginCount([1, 2, 0, 0])).toBe(2);
  });
});
