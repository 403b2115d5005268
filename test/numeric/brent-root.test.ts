import { describe, expect, it } from 'vitest';
import { brentRoot } from '../../src/numeric/brent-root.js';

describe('brentRoot', () => {
  it('finds √2 as the root of x² − 2 to the last digits (closed form)', () => {
    expect(brentRoot((x) => x * x - 2, 1, 2)).toBeCloseTo(Math.SQRT2, 14);
  });
  it('finds the Dottie number, the root of cos x − x (0.7390851332151607, Abramowitz & Stegun-type constant, from memory)', () => {
    const x = brentRoot((t) => Math.cos(t) - t, 0, 1);
    expect(Math.abs(Math.cos(x) - x)).toBeLessThan(4e-16);
    expect(x).toBeCloseTo(0.7390851332151607, 14);
  });
  it('refuses an interval without a sign change', () => {
    expect(() => brentRoot((x) => x * x + 1, -1, 1)).toThrow(RangeError);
  });
  it('needs few evaluations on a smooth function', () => {
    let calls = 0;
    brentRoot((x) => { calls++; return Math.exp(x) - 5; }, 0, 10);
    expect(calls).toBeLessThan(20);
  });
});
