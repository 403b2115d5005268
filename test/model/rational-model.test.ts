import { describe, expect, it } from 'vitest';
import { rationalModel } from '../../src/model/rational-model.js';

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
