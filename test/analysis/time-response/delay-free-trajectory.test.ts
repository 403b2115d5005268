import { describe, expect, it } from 'vitest';
import { simulateDelayFreeLoop } from '../../../src/analysis/time-response/delay-free-trajectory.js';
import { assembleLoopEquations } from '../../../src/analysis/time-response/loop-equations.js';
import { evaluateAtTime } from '../../../src/analysis/time-response/sampled-trajectory.js';
import { realiseTransferFunction } from '../../../src/analysis/time-response/state-space-realisation.js';
import { createStepInterpolation } from '../../../src/analysis/time-response/step-interpolation.js';

describe('simulateDelayFreeLoop', () => {
  // K/(τs + 1) under kp: y = a(1 − e^{−t/τcl}), a = K kp/(1 + K kp), τcl = τ/(1 + K kp),
  // ∫y = a(t − τcl(1 − e^{−t/τcl})) (derivation).
  const K = 3;
  const tau = 2;
  const kp = 0.5;
  const a = (K * kp) / (1 + K * kp);
  const tcl = tau / (1 + K * kp);
  const loop = assembleLoopEquations(realiseTransferFunction([K], [tau, 1]), realiseTransferFunction([kp], [1]));
  const nodes = createStepInterpolation(8).nodes;

  it('is exact at any instant, not only on the grid', () => {
    const run = simulateDelayFreeLoop(loop, 1, 0, 0.37, 30, nodes);
    for (const t of [0, 0.05, 1.234, 7.7, 11]) {
      const p = evaluateAtTime(run, t);
      expect(Math.abs(p.output - a * (1 - Math.exp(-t / tcl)))).toBeLessThan(1e-14);
      expect(Math.abs(p.outputRate - (a / tcl) * Math.exp(-t / tcl))).toBeLessThan(1e-13);
      expect(Math.abs(p.outputIntegral - a * (t - tcl * (1 - Math.exp(-t / tcl))))).toBeLessThan(1e-13);
      expect(Math.abs(p.control - kp * (1 - p.output))).toBeLessThan(1e-15);
    }
  });

  it('solves the algebraic loop of a biproper plant and controller', () => {
    // P = (s + 2)/(s + 1), C = 0.5: T = 0.5(s + 2)/(1.5 s + 2), y(0⁺) = 1/3, y(∞) = 1/2 (derivation).
    const biproper = assembleLoopEquations(realiseTransferFunction([1, 2], [1, 1]), realiseTransferFunction([0.5], [1]));
    const run = simulateDelayFreeLoop(biproper, 1, 0, 0.5, 40, nodes);
    expect(evaluateAtTime(run, 0).output).toBeCloseTo(1 / 3, 15);
    // y = 1/2 − (1/6) e^{−4t/3}.
    const t = 0.8;
    expect(Math.abs(evaluateAtTime(run, t).output - (0.5 - Math.exp((-4 * t) / 3) / 6))).toBeLessThan(1e-14);
  });
});
