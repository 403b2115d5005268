import { describe, expect, it } from 'vitest';
import { estimateLoopTimeScales, padeDelayApproximant } from '../../../src/analysis/time-response/loop-time-scales.js';
import { assembleLoopEquations } from '../../../src/analysis/time-response/loop-equations.js';
import { evaluatePolynomialComplex } from '../../../src/analysis/time-response/polynomial.js';
import { realiseTransferFunction } from '../../../src/analysis/time-response/state-space-realisation.js';

describe('padeDelayApproximant', () => {
  it('is (1 − sT/2)/(1 + sT/2) at first order (common practice)', () => {
    expect(padeDelayApproximant(0.4, 1)).toEqual({ numerator: [-0.2, 1], denominator: [0.2, 1] });
  });
  it('is all-pass and follows e^{−jωT} closely for ωT ≤ 1 at order 6', () => {
    const T = 2;
    const p = padeDelayApproximant(T, 6);
    for (const w of [0.05, 0.2, 0.5]) {
      const [nr, ni] = evaluatePolynomialComplex(p.numerator, 0, w);
      const [dr, di] = evaluatePolynomialComplex(p.denominator, 0, w);
      expect(Math.hypot(nr, ni) / Math.hypot(dr, di)).toBeCloseTo(1, 14);
      const phase = Math.atan2(ni, nr) - Math.atan2(di, dr);
      const err = Math.atan2(Math.sin(phase + w * T), Math.cos(phase + w * T));
      expect(Math.abs(err)).toBeLessThan(1e-9);
    }
  });
});

describe('estimateLoopTimeScales', () => {
  it('uses the exact closed-loop roots without delay', () => {
    // K/(τs + 1) under kp: one root at −(1 + K kp)/τ (derivation).
    const loop = assembleLoopEquations(realiseTransferFunction([2], [0.5, 1]), realiseTransferFunction([1.5], [1]));
    const roots = [{ re: -8, im: 0 }];
    const s = estimateLoopTimeScales(loop, { numerator: [2], denominator: [0.5, 1] }, { numerator: [1.5], denominator: [1] }, 0, roots);
    expect(s.slowestDecay).toBe(8);
    expect(s.fastestRate).toBe(8);
  });
  it('estimates the dominant root of a delayed integrator loop k e^{−sT}/s', () => {
    // Derivation: s + k e^{−sT} = 0 with s = −x/T real gives x e^{−x} = kT; for kT = 0.2 the dominant
    // root is the smaller solution x = −W₀(−0.2) ≈ 0.259 (Lambert W), checked through the equation itself.
    const k = 0.2;
    const loop = assembleLoopEquations(realiseTransferFunction([1], [1, 0]), realiseTransferFunction([k], [1]));
    const s = estimateLoopTimeScales(loop, { numerator: [1], denominator: [1, 0] }, { numerator: [k], denominator: [1] }, 1, null);
    const x = s.slowestDecay!;
    expect(x).toBeLessThan(1);
    expect(Math.abs(x * Math.exp(-x) - k)).toBeLessThan(1e-9);
  });
});
