import { describe, expect, it } from 'vitest';
import { MAX_STEPS, planSimulationGrid } from '../../../src/analysis/time-response/simulation-grid.js';

const scales = { fastestRate: 4, slowestDecay: 0.5, fastestGrowth: null, closedLoopRoots: [] };

describe('planSimulationGrid', () => {
  it('defaults the horizon to five times (T + 4/σ) and makes the delay a whole number of steps', () => {
    const g = planSimulationGrid(scales, 0.7, true, null);
    expect(g.delayed!.delaySteps * g.stepLength).toBeCloseTo(0.7, 15);
    expect(g.delayed!.longStepCount).toBe(0);
    expect(g.stepLength * scales.fastestRate).toBeLessThanOrEqual(0.5 + 1e-12);
    // Rounded up to whole steps.
    expect(g.duration).toBeGreaterThanOrEqual(5 * (0.7 + 4 / 0.5));
    expect(g.duration - 5 * (0.7 + 4 / 0.5)).toBeLessThan(g.stepLength);
  });
  it('keeps a requested duration', () => {
    const g = planSimulationGrid(scales, 0, true, 3);
    expect(g.duration).toBe(3);
    expect(g.stepLength * g.stepCount).toBeCloseTo(3, 14);
  });
  it('starts with steps of T and continues with steps of p·T for a very short delay', () => {
    const g = planSimulationGrid(scales, 1e-9, true, 100);
    expect(g.delayed!.delaySteps).toBe(1);
    expect(g.delayed!.alignedStepCount).toBe(20);
    // p·T close to the 0.5/|λ|max target, and the whole horizon covered.
    expect(g.delayed!.longStepFactor * 1e-9 * scales.fastestRate).toBeLessThanOrEqual(0.5);
    expect(g.delayed!.longStepFactor * 1e-9 * scales.fastestRate).toBeGreaterThan(0.49);
    expect(20e-9 + g.delayed!.longStepCount * g.delayed!.longStepFactor * 1e-9).toBeGreaterThanOrEqual(100 - 1e-9);
  });
  it('keeps the aligned start long enough for the jumps of a neutral loop to decay', () => {
    const g = planSimulationGrid(scales, 1e-9, true, 100, 0.5);
    // 0.5^k < 1e−13 from k = 44.
    expect(g.delayed!.alignedStepCount).toBe(44);
  });
  it('stretches the step, within the step budget, for a long horizon', () => {
    const g = planSimulationGrid(scales, 1, true, 0.6 * MAX_STEPS);
    expect(g.stepLength).toBe(1);
    expect(g.stepCount).toBeLessThanOrEqual(MAX_STEPS + 1);
    expect(g.notes.join(' ')).toMatch(/accuracy is reduced/);
  });
});
