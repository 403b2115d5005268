import { describe, expect, it } from 'vitest';
import { simulateDelayedLoop } from '../../../src/analysis/time-response/delayed-trajectory.js';
import { assembleLoopEquations } from '../../../src/analysis/time-response/loop-equations.js';
import { evaluateAtTime } from '../../../src/analysis/time-response/sampled-trajectory.js';
import { realiseTransferFunction } from '../../../src/analysis/time-response/state-space-realisation.js';
import { createStepInterpolation } from '../../../src/analysis/time-response/step-interpolation.js';

// P = K e^{−sT}/(τs + 1) under kp, r = 1: closed form on [0, 3T) by the method of steps
// (derivation in simulate-closed-loop.test.ts).
const K = 2;
const tau = 1.5;
const T = 0.7;
const kp = 0.8;
const a = K * kp;
function exact(t: number): number {
  if (t < T) return 0;
  if (t < 2 * T) return a * (1 - Math.exp(-(t - T) / tau));
  const s = t - 2 * T;
  const y0 = a * (1 - Math.exp(-T / tau));
  return a * (1 - a) + (y0 - a * (1 - a)) * Math.exp(-s / tau) + a * a * (s / tau) * Math.exp(-s / tau);
}
/** ∫₀ᵗ y on [0, 2T): a(σ − τ(1 − e^{−σ/τ})), σ = t − T (derivation). */
const integralOnSecondInterval = (t: number): number => a * (t - T - tau * (1 - Math.exp(-(t - T) / tau)));
const loop = assembleLoopEquations(realiseTransferFunction([K], [tau, 1]), realiseTransferFunction([kp], [1]));

const aligned = (delaySteps: number, steps: number) => ({ delaySteps, alignedStepCount: steps, longStepFactor: 0, longStepCount: 0 });

function worstError(delaySteps: number, nodes: number): number {
  const run = simulateDelayedLoop(loop, T, aligned(delaySteps, 3 * delaySteps), 1, 0, createStepInterpolation(nodes));
  let worst = 0;
  for (let i = 0; i <= 300; i++) {
    const t = ((3 * T) / 300) * i * 0.9999;
    worst = Math.max(worst, Math.abs(evaluateAtTime(run, t).output - exact(t)));
  }
  return worst;
}

describe('simulateDelayedLoop', () => {
  it('is accurate to 1e−11 even with one step per delay at 8 nodes', () => {
    expect(worstError(1, 8)).toBeLessThan(1e-11);
  });
  it('converges at order q in the step (q = 4 nodes: halving h gains about 2⁴)', () => {
    const coarse = worstError(4, 4);
    const fine = worstError(8, 4);
    expect(coarse / fine).toBeGreaterThan(10);
    expect(coarse / fine).toBeLessThan(40);
  });
  it('carries ∫y as a state and the controller output through the delay', () => {
    const run = simulateDelayedLoop(loop, T, aligned(5, 15), 1, 0, createStepInterpolation(8));
    const t = 1.9 * T;
    const p = evaluateAtTime(run, t);
    expect(Math.abs(p.outputIntegral - integralOnSecondInterval(t))).toBeLessThan(1e-12);
    expect(Math.abs(p.control - kp * (1 - exact(t)))).toBeLessThan(1e-12);
    // dy/dt = (K w − y)/τ with w = kp on [T, 2T).
    expect(Math.abs(p.outputRate - (K * kp - exact(t)) / tau)).toBeLessThan(1e-11);
  });
  it('gives the same response with long steps p·T after 20 aligned delay intervals (implicit in-step delay)', () => {
    // Short delay T = 0.05 on the same lag: 20 steps of T (the breakpoint non-smoothness has
    // died out), then steps of 4T, against steps of T throughout (the explicit aligned scheme).
    const shortDelay = 0.05;
    const interp = createStepInterpolation(8);
    const long = simulateDelayedLoop(loop, shortDelay, { delaySteps: 1, alignedStepCount: 20, longStepFactor: 4, longStepCount: 30 }, 1, 0, interp);
    const reference = simulateDelayedLoop(loop, shortDelay, aligned(1, 140), 1, 0, interp);
    let worst = 0;
    for (let t = 1.01; t < 7; t += 0.137) worst = Math.max(worst, Math.abs(evaluateAtTime(long, t).output - evaluateAtTime(reference, t).output));
    expect(worst).toBeLessThan(1e-11);
  });

  it('delays a load step at the plant input by T (setpoint 0): y = K(1 − e^{−(t−T)/τ}) until 2T', () => {
    const run = simulateDelayedLoop(loop, T, aligned(5, 15), 0, 1, createStepInterpolation(8));
    expect(evaluateAtTime(run, 0.99 * T).output).toBe(0);
    const t = 1.5 * T;
    expect(Math.abs(evaluateAtTime(run, t).output - K * (1 - Math.exp(-(t - T) / tau)))).toBeLessThan(1e-12);
  });
});
