import { describe, expect, it } from 'vitest';
import { measureRegulationResponse, measureStepResponse } from '../../../src/analysis/time-response/response-metrics.js';
import { uniformStepStarts, type SampledTrajectory } from '../../../src/analysis/time-response/sampled-trajectory.js';
import { createStepInterpolation } from '../../../src/analysis/time-response/step-interpolation.js';

interface ClosedForm {
  /** y at t; `left` asks for the left-hand limit (end of a step) */
  y: (t: number, left: boolean) => number;
  rate: (t: number) => number;
  integral: (t: number) => number;
}

/** Wraps closed-form signals in the trajectory interface the metrics read. */
function closedFormTrajectory(f: ClosedForm, stepLength: number, stepCount: number): SampledTrajectory {
  const nodes = createStepInterpolation(8).nodes;
  const nodeOutput = new Float64Array(stepCount * nodes.length);
  for (let k = 0; k < stepCount; k++) {
    nodes.forEach((s, j) => (nodeOutput[k * nodes.length + j] = f.y((k + s) * stepLength, j === nodes.length - 1)));
  }
  return {
    stepStarts: uniformStepStarts(stepLength, stepCount),
    stepCount,
    nodes,
    nodeOutput,
    evaluate: (k, s) => {
      const t = (k + s) * stepLength;
      return { output: f.y(t, s === 1), control: 0, outputRate: f.rate(t), outputIntegral: f.integral(t) };
    },
  };
}

describe('measureStepResponse', () => {
  it('measures a first-order response with a negative final value: ln 9 rise, ln 50 settling', () => {
    // y = −2(1 − e^{−t}): 10–90 % between ln(10/9) and ln 10, 2 % band reached at ln 50 (derivation).
    const f: ClosedForm = { y: (t) => -2 * (1 - Math.exp(-t)), rate: (t) => -2 * Math.exp(-t), integral: () => 0 };
    const m = measureStepResponse(closedFormTrajectory(f, 0.1, 100), -2, 10);
    expect(m.riseTime).toBeCloseTo(Math.log(9), 13);
    expect(m.settlingTime).toBeCloseTo(Math.log(50), 13);
    expect(m.overshootPercent).toBe(0);
    expect(m.peakTime).toBeNull();
  });

  it('leaves rise and settling time undefined when the horizon is too short', () => {
    const f: ClosedForm = { y: (t) => 1 - Math.exp(-t), rate: (t) => Math.exp(-t), integral: () => 0 };
    const m = measureStepResponse(closedFormTrajectory(f, 0.1, 20), 1, 2);
    expect(m.riseTime).toBeNull();
    expect(m.settlingTime).toBeNull();
    expect(m.notes.length).toBe(2);
  });

  it('has no figures relative to a zero final value', () => {
    const f: ClosedForm = { y: (t) => t * Math.exp(-t), rate: (t) => (1 - t) * Math.exp(-t), integral: () => 0 };
    const m = measureStepResponse(closedFormTrajectory(f, 0.1, 100), 0, 10);
    expect([m.overshootPercent, m.peakTime, m.riseTime, m.settlingTime]).toEqual([null, null, null, null]);
  });

  it('places crossings that happen in a jump at the jump instant', () => {
    // y = 0 before t = 1, then 0.99 + 0.01(1 − e^{−(t−1)}): both 10 % and 90 % are crossed at t = 1.
    const f: ClosedForm = {
      y: (t, left) => (t < 1 || (left && Math.abs(t - 1) < 1e-12) ? 0 : 0.99 + 0.01 * (1 - Math.exp(-(t - 1)))),
      rate: (t) => (t < 1 ? 0 : 0.01 * Math.exp(-(t - 1))),
      integral: () => 0,
    };
    const m = measureStepResponse(closedFormTrajectory(f, 0.25, 40), 1, 10);
    expect(m.riseTime).toBe(0);
    expect(m.settlingTime).toBeCloseTo(1, 12);
  });
});

describe('measureRegulationResponse', () => {
  it('integrates |y| across sign changes: y = e^{−at} sin ωt', () => {
    // Antiderivative F(t) = −e^{−at}(a sin ωt + ω cos ωt)/(a² + ω²) (derivation); zeros at iπ/ω.
    const a = 0.3;
    const w = 2;
    const F = (t: number): number => (-Math.exp(-a * t) * (a * Math.sin(w * t) + w * Math.cos(w * t))) / (a * a + w * w);
    const f: ClosedForm = {
      y: (t) => Math.exp(-a * t) * Math.sin(w * t),
      rate: (t) => Math.exp(-a * t) * (w * Math.cos(w * t) - a * Math.sin(w * t)),
      integral: (t) => F(t) - F(0),
    };
    const horizon = 20;
    const m = measureRegulationResponse(closedFormTrajectory(f, 0.05, 400), horizon);
    let iae = 0;
    let last = 0;
    for (let i = 1; (i * Math.PI) / w < horizon; i++) {
      iae += Math.abs(F((i * Math.PI) / w) - F(last));
      last = (i * Math.PI) / w;
    }
    iae += Math.abs(F(horizon) - F(last));
    expect(m.iae).toBeCloseTo(iae, 12);
    expect(m.ie).toBeCloseTo(-(F(horizon) - F(0)), 14);
    // First maximum where tan ωt = ω/a.
    const tPeak = Math.atan(w / a) / w;
    expect(m.peakDeviationTime).toBeCloseTo(tPeak, 12);
    expect(m.peakDeviation).toBeCloseTo(Math.exp(-a * tPeak) * Math.sin(w * tPeak), 14);
  });
});
