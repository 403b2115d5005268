/**
 * Balancing (Parlett & Reinsch 1969): a similarity by powers of two, so the
 * eigenvalues (here: trace and determinant of 2×2 and the characteristic
 * polynomial's coefficients of a companion matrix) are unchanged exactly or
 * to rounding, while row and column norms become comparable.
 */
import { describe, expect, it } from 'vitest';
import { balanceMatrix } from '../../src/numeric/balance-matrix.js';

describe('balanceMatrix', () => {
  it('evens out [[0, 1e6], [1e-6, 0]] with a power-of-two scaling and keeps the similarity exact', () => {
    const a = [[0, 1e6], [1e-6, 0]];
    const b = balanceMatrix(a);
    for (const s of b.scale) expect(Math.log2(s) % 1).toBe(0);
    // D⁻¹AD entry by entry.
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) expect(b.a[i][j]).toBe((a[i][j] * b.scale[j]) / b.scale[i]);
    expect(Math.max(Math.abs(b.a[0][1]), Math.abs(b.a[1][0])) / Math.min(Math.abs(b.a[0][1]), Math.abs(b.a[1][0]))).toBeLessThan(4);
  });

  it('reduces the norm of a badly scaled companion matrix, (s + 0.01)(s + 100)(s + 1000)', () => {
    const c = [1100.01, 100011, 1000];
    const a = [[-c[0], -c[1], -c[2]], [1, 0, 0], [0, 1, 0]];
    const b = balanceMatrix(a);
    const norm = (m: number[][]) => Math.max(...m.map((r) => r.reduce((s, x) => s + Math.abs(x), 0)));
    expect(norm(b.a)).toBeLessThan(norm(a) / 10);
    // Trace is invariant under similarity.
    expect(b.a[0][0] + b.a[1][1] + b.a[2][2]).toBe(-c[0]);
  });
});
