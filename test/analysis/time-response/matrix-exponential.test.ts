import { describe, expect, it } from 'vitest';
import { identityMatrix, multiplyMatrices } from '../../../src/analysis/time-response/dense-matrix.js';
import { matrixExponential } from '../../../src/analysis/time-response/matrix-exponential.js';

describe('matrixExponential', () => {
  it('turns a skew-symmetric generator into a rotation (closed form), also after scaling', () => {
    for (const w of [1, 30]) {
      const e = matrixExponential([
        [0, w],
        [-w, 0],
      ]);
      expect(e[0][0]).toBeCloseTo(Math.cos(w), 13);
      expect(e[0][1]).toBeCloseTo(Math.sin(w), 13);
      expect(e[1][0]).toBeCloseTo(-Math.sin(w), 13);
    }
  });

  it('matches the closed form of a stiff triangular matrix', () => {
    // exp([[a, b], [0, c]]) = [[e^a, b(e^a − e^c)/(a − c)], [0, e^c]] (derivation).
    const a = -100;
    const c = -1;
    const e = matrixExponential([
      [a, 1],
      [0, c],
    ]);
    expect(e[0][1] / ((Math.exp(a) - Math.exp(c)) / (a - c)) - 1).toBeLessThan(1e-13);
    expect(Math.abs(e[1][1] / Math.exp(c) - 1)).toBeLessThan(1e-14);
    expect(Math.abs(e[0][0])).toBeLessThan(1e-40);
  });

  it('is the finite series for a nilpotent matrix', () => {
    // Shift matrix N with N⁴ = 0: e^{tN} has entries t^k/k! on the k-th superdiagonal.
    const t = 3;
    const n = [0, 1, 2, 3].map((i) => [0, 1, 2, 3].map((j) => (j === i + 1 ? t : 0)));
    const e = matrixExponential(n);
    expect(e[0][1]).toBeCloseTo(t, 13);
    expect(e[0][2]).toBeCloseTo(t ** 2 / 2, 13);
    expect(e[0][3]).toBeCloseTo(t ** 3 / 6, 13);
    expect(e[3][0]).toBe(0);
  });

  it('satisfies e^A e^{−A} = I for a dense matrix of moderate norm', () => {
    let seed = 7;
    const rand = (): number => ((seed = (seed * 16807) % 2147483647) / 2147483647) * 2 - 1;
    const a = Array.from({ length: 6 }, () => Array.from({ length: 6 }, () => 3 * rand()));
    const product = multiplyMatrices(matrixExponential(a), matrixExponential(a.map((r) => r.map((v) => -v))));
    const id = identityMatrix(6);
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) expect(Math.abs(product[i][j] - id[i][j])).toBeLessThan(1e-10);
  });
});
