import { describe, expect, it } from 'vitest';
import { simulateDelayFreeLoop } from '../../../src/analysis/time-response/delay-free-trajectory.js';
import { assembleLoopEquations } from '../../../src/analysis/time-response/loop-equations.js';
import { realiseTransferFunction } from '../../../src/analysis/time-response/state-space-realisation.js';
import { createStepInterpolation } from '../../../src/analysis/time-response/step-interpolation.js';
import { locateSignChange, refineMaximum, samplesWithinHorizon } from '../../../src/analysis/time-response/trajectory-search.js';

describe('trajectory searches', () => {
  // 1/(s(s + 1)) under unit gain: ζ = 0.5, ωn = 1, first peak at π/√0.75 (Ogata §5-3).
  const loop = assembleLoopEquations(realiseTransferFunction([1], [1, 1, 0]), realiseTransferFunction([1], [1]));
  const run = simulateDelayFreeLoop(loop, 1, 0, 0.5, 40, createStepInterpolation(8).nodes);
  const count = samplesWithinHorizon(run, 20);

  it('counts the samples up to the horizon', () => {
    expect(count).toBe(40 * 8);
    expect(samplesWithinHorizon(run, 10)).toBe(20 * 8 + 1);
  });
  it('refines the peak from the largest sample', () => {
    let best = 0;
    for (let i = 1; i < count; i++) if (run.nodeOutput[i] > run.nodeOutput[best]) best = i;
    const peak = refineMaximum(run, best, count, 1);
    expect(peak.time).toBeCloseTo(Math.PI / Math.sqrt(0.75), 13);
  });
  it('locates a level crossing between two samples', () => {
    let i = 0;
    while (run.nodeOutput[i + 1] < 1) i++;
    // First return to 1: 1 − e^{−t/2}(cos ωd t + sin ωd t/√3) = 1 ⇔ tan ωd t = −√3, ωd t = 2π/3.
    const crossing = locateSignChange(run, i, (p) => p.output - 1);
    expect(crossing.time).toBeCloseTo((2 * Math.PI) / 3 / Math.sqrt(0.75), 13);
  });
});
