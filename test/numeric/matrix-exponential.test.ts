/**
 * The matrix exponential against closed forms (derivations, any linear
 * systems text): rotation generators, Jordan blocks, triangular 2×2 matrices
 * and a diagonal matrix that needs many squarings.
 */
import { describe, expect, it } from 'vitest';
import { matrixExponential } from '../../src/numeric/matrix-exponential.js';

const close = (a: number[][], b: number[][], tol: number) => {
  const scale = Math.max(...b.flat().map(Math.abs));
  a.forEach((row, i) => row.forEach((x, j) => expect(Math.abs(x - b[i][j]), `entry ${i},${j}`).toBeLessThanOrEqual(tol * scale)));
};

describe('matrixExponential', () => {
  it('exp([[0, w], [−w, 0]]) is the rotation by w, for norms that take every Padé degree and scaling', () => {
    for (const w of [1e-3, 0.1, 0.5, 2, 5, 40, 300]) {
      const e = matrixExponential([[0, w], [-w, 0]]);
      close(e, [[Math.cos(w), Math.sin(w)], [-Math.sin(w), Math.cos(w)]], 1e-13 * Math.max(1, w));
    }
  });

  it('exp of a Jordan block λI + N is e^λ·(I + N + N²/2)', () => {
    for (const l of [-0.3, 1.2, -20]) {
      const e = matrixExponential([[l, 1, 0], [0, l, 1], [0, 0, l]]);
      const x = Math.exp(l);
      close(e, [[x, x, x / 2], [0, x, x], [0, 0, x]], 1e-13);
    }
  });

  it('exp of an upper triangular [[a, c], [0, b]] has corner c·(e^a − e^b)/(a − b)', () => {
    const a = -50;
    const b = -60;
    const c = 7;
    const e = matrixExponential([[a, c], [0, b]]);
    expect(e[0][0]).toBeCloseTo(Math.exp(a), 30);
    expect(Math.abs(e[0][1] - (c * (Math.exp(a) - Math.exp(b))) / (a - b)) / ((c * Math.exp(a)) / 10)).toBeLessThan(1e-10);
    expect(Math.abs(e[1][1] - Math.exp(b)) / Math.exp(b)).toBeLessThan(1e-10);
  });

  it('keeps the relative accuracy of each entry of a diagonal matrix with spread entries', () => {
    const e = matrixExponential([[-1e-4, 0], [0, -30]]);
    expect(Math.abs(e[0][0] - Math.exp(-1e-4)) / Math.exp(-1e-4)).toBeLessThan(1e-14);
    expect(Math.abs(e[1][1] - Math.exp(-30)) / Math.exp(-30)).toBeLessThan(1e-9);
    expect(e[0][1]).toBe(0);
  });
});
