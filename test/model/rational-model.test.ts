import { describe, expect, it } from 'vitest';
import { integerPower, rationalModel } from '../../src/model/rational-model.js';

describe('integerPower', () => {
  it('agrees with Math.pow to within |k| rounding errors, including negative bases and k = 0', () => {
    for (const x of [-3.7, -1.5, 1.0001, 2, 17.25, 1e3, 6.02e23]) {
      for (let k = -12; k <= 12; k++) {
        const expected = Math.pow(x, k);
        const got = integerPower(x, k);
        expect(Math.abs(got - expected)).toBeLessThanOrEqual(Math.max(1, Math.abs(k)) * 2.3e-16 * Math.abs(expected));
      }
    }
    expect(integerPower(5, 0)).toBe(1);
  });

  it('falls back to Math.pow where the product leaves the range of a double', () => {
    // 1e200^2 overflows, but 1e200^-2 = 1e-400 underflows to 0 either way; 1e155^-2 = 1e-310 is subnormal.
    expect(integerPower(1e155, -2)).toBe(Math.pow(1e155, -2));
    expect(integerPower(1e155, -2)).toBeGreaterThan(0);
    expect(integerPower(1e200, 2)).toBe(Infinity);
  });
});

describe('rationalModel evaluation above ω = 1', () => {
  it('matches the closed form of e^{−jωT}/(jω + 1)² (relative degree 2, so the power (jω)^−2 is applied)', () => {
    const model = rationalModel([1], [1, 2, 1], 0.5);
    for (const w of [0.3, 3, 100, 1e5]) {
      // 1/(1 + jω)² = (1 − jω)²/(1 + ω²)² = (1 − ω² − 2jω)/(1 + ω²)²; times cos ωT − j sin ωT.
      const d = (1 + w * w) ** 2;
      const ar = (1 - w * w) / d;
      const ai = (-2 * w) / d;
      const c = Math.cos(w * 0.5);
      const s = -Math.sin(w * 0.5);
      const v = model.evaluate(w, { re: 0, im: 0 });
      const scale = Math.hypot(ar, ai);
      expect(Math.abs(v.re - (ar * c - ai * s))).toBeLessThan(1e-14 * scale);
      expect(Math.abs(v.im - (ar * s + ai * c))).toBeLessThan(1e-14 * scale);
    }
  });
});
