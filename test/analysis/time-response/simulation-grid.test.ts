import { describe, expect, it } from 'vitest';
import { MAX_STEPS, planSimulationGrid } from '../../../src/analysis/time-response/simulation-grid.js';
import { TimeResponseInputError } from '../../../src/analysis/time-response/time-response-input-error.js';

const scales = { fastestRate: 4, slowestDecay: 0.5, fastestGrowth: null, closedLoopRoots: [] };

describe('planSimulationGrid', () => {
  it('defaults the horizon to five times (T + 4/σ) and makes the delay a whole number of steps', () => {
    const g = planSimulationGrid(scales, 0.7, true, null);
    expect(g.delaySteps * g.stepLength).toBeCloseTo(0.7, 15);
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
  it('refuses a delay that cannot be a whole number of the allowed steps', () => {
    expect(() => planSimulationGrid(scales, 1e-9, true, 100)).toThrow(TimeResponseInputError);
  });
  it('stretches the step, within the step budget, for a long horizon', () => {
    const g = planSimulationGrid(scales, 1, true, 0.6 * MAX_STEPS);
    expect(g.stepLength).toBe(1);
    expect(g.stepCount).toBeLessThanOrEqual(MAX_STEPS + 1);
    expect(g.notes.join(' ')).toMatch(/accuracy is reduced/);
  });
});
