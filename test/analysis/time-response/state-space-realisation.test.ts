import { describe, expect, it } from 'vitest';
import { identityMatrix, solveLinearSystem } from '../../../src/analysis/time-response/dense-matrix.js';
import { realiseTransferFunction } from '../../../src/analysis/time-response/state-space-realisation.js';

/** C (sI − A)⁻¹ B + D at a real s (test-side evaluation of the realisation). */
function realisationAt(num: number[], den: number[], s: number): number {
  const { a, b, c, d } = realiseTransferFunction(num, den);
  if (a.length === 0) return d;
  const m = identityMatrix(a.length).map((row, i) => row.map((v, j) => s * v - a[i][j]));
  const x = solveLinearSystem(m, b.map((v) => [v]));
  return c.reduce((acc, ci, i) => acc + ci * x[i][0], d);
}
const polyAt = (p: number[], s: number): number => p.reduce((acc, c) => acc * s + c, 0);

describe('realiseTransferFunction', () => {
  const cases: Array<[string, number[], number[]]> = [
    ['first-order lag', [3.2], [0.35, 1]],
    ['pasteuriser second-order lag', [0.8], [3000, 145, 1]],
    ['PID with derivative filter (biproper)', [4.2, 2.1, 0.05], [2.5, 1, 0]],
    ['static gain', [2], [4]],
    ['lead-lag with a right-half-plane zero', [-0.5, 1], [2, 1]],
  ];
  for (const [name, num, den] of cases) {
    it(`reproduces N(s)/D(s) for a ${name}`, () => {
      for (const s of [0.3, 1.7, 12]) {
        const want = polyAt(num, s) / polyAt(den, s);
        expect(Math.abs(realisationAt(num, den, s) - want)).toBeLessThan(1e-12 * Math.max(1, Math.abs(want)));
      }
    });
  }
  it('keeps the feedthrough of a biproper function: D = lim_{s→∞} N/D', () => {
    expect(realiseTransferFunction([4.2, 2.1, 0.05], [2.5, 1, 0]).d).toBeCloseTo(4.2 / 2.5, 15);
  });
});
