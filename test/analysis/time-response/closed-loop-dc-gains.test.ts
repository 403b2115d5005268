import { describe, expect, it } from 'vitest';
import { closedLoopDcGains, ratioAtOrigin } from '../../../src/analysis/time-response/closed-loop-dc-gains.js';

describe('closedLoopDcGains (final-value theorem, common practice)', () => {
  it('gives T(0) = K kp/(1 + K kp) for P control of a type-0 plant', () => {
    const g = closedLoopDcGains({ numerator: [2.5], denominator: [0.8, 1] }, { numerator: [1.6], denominator: [1] });
    expect(g.setpoint).toBeCloseTo(4 / 5, 15);
    // Load step at the plant input: P(0)/(1 + L(0)) = 2.5/5.
    expect(g.disturbance).toBeCloseTo(0.5, 15);
  });
  it('gives T(0) = 1 for an integrating loop and no load offset with integral action', () => {
    const g = closedLoopDcGains({ numerator: [2], denominator: [1, 1] }, { numerator: [2, 1], denominator: [2, 0] });
    expect(g.setpoint).toBe(1);
    expect(g.disturbance).toBe(0);
  });
  it('gives T(0) = 1 but a load offset 1/kp for P control of an integrating plant', () => {
    const g = closedLoopDcGains({ numerator: [1], denominator: [1, 0] }, { numerator: [4], denominator: [1] });
    expect(g.setpoint).toBe(1);
    expect(g.disturbance).toBeCloseTo(0.25, 15);
  });
  it('gives 0 when the plant has a zero at the origin', () => {
    expect(closedLoopDcGains({ numerator: [1, 0], denominator: [1, 1] }, { numerator: [3], denominator: [1] }).setpoint).toBe(0);
  });
});

describe('ratioAtOrigin', () => {
  it('cancels common powers of s', () => {
    expect(ratioAtOrigin([3, 6, 0], [1, 2, 0])).toBe(3);
    expect(ratioAtOrigin([1, 0], [1, 0, 0])).toBe(Infinity);
  });
});
