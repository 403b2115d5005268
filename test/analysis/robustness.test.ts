/** Loops that are legal to send but hard to analyse: refused with a 4xx, never a crash or a hang. */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/index.js';

const err = (body: unknown) => {
  try {
    analyze(body);
  } catch (e) {
    return e as { statusCode: number; code: string };
  }
  return null;
};

describe('hard loops', () => {
  it('an expression that overflows on the imaginary axis is 422, not 500', () => {
    const e = err({ plant: { kind: 'expression', expression: 'exp(exp(exp(s)))' } });
    expect(e?.statusCode).toBe(422);
  });

  it('a very long delay over a wide band is refused up front when the sweep cannot be resolved', () => {
    const e = err({ plant: { kind: 'transfer-function', numerator: [1000], denominator: [1, 0], delay: 1e4 } });
    expect(e).toMatchObject({ statusCode: 422, code: 'analysis_too_costly' });
  });

  it('a long delay with a fast lag is analysed with the phase-crossover list cut, and says so', () => {
    // L = k·e^{−sT}/(s(τs + 1)), k = 0.02, T = 40 s, τ = 1 ms. Closed form (derivation):
    // ωc·√(1 + (τωc)²) = k, PM = 90° − (ωc·T + atan(τωc)) in degrees.
    const k = 0.02;
    const T = 40;
    const tau = 0.001;
    let wc = k;
    for (let i = 0; i < 50; i++) wc = k / Math.sqrt(1 + (tau * wc) ** 2);
    const pm = 90 - ((wc * T + Math.atan(tau * wc)) * 180) / Math.PI;
    const r = analyze({ plant: { kind: 'transfer-function', numerator: [k], denominator: [tau, 1, 0], delay: T }, detail: 'summary' });
    expect(r.margins.phase!.frequency).toBeCloseTo(wc, 12);
    expect(r.margins.phase!.degrees).toBeCloseTo(pm, 8);
    expect(r.stability.closedLoopStable).toBe(true);
    expect(r.warnings.map((w) => w.code)).toContain('phase_crossovers_cut');
  });

  it('a pure integrator needs no corner frequency to find its crossover (K/s: ωc = K, PM = 90°)', () => {
    const r = analyze({ plant: { kind: 'transfer-function', numerator: [3], denominator: [1, 0] }, detail: 'summary' });
    expect(r.margins.phase!.frequency).toBeCloseTo(3, 12);
    expect(r.margins.phase!.degrees).toBeCloseTo(90, 10);
    expect(r.margins.gain).toBeNull();
  });

  it('an undamped pole pair on the imaginary axis is indented: 1/(s² + 1) under PD control is stable (closed-loop roots)', () => {
    const r = analyze({
      plant: { kind: 'transfer-function', numerator: [1], denominator: [1, 0, 1] },
      controller: { kind: 'pid', form: 'parallel', kp: 2, kd: 1, derivativeFilter: { timeConstant: 0.01 } },
      detail: 'summary',
    });
    expect(r.stability.imaginaryAxisPoles).toEqual([{ frequency: 1, order: 1 }]);
    expect(r.stability.closedLoopPoles!.every((p) => p.re < 0)).toBe(true);
    expect(r.stability.nyquist.closedLoopUnstablePoles).toBe(0);
    expect(r.stability.closedLoopStable).toBe(true);
  });

  it('a subnormal coefficient (a pole near 1.7e−322 rad/s) is refused with 422 instead of a band starting at 0 (found by the route fuzzer)', () => {
    const e = err({
      plant: { kind: 'transfer-function', numerator: [0.92], denominator: [0.028, 0.43, -7.4e-323], delay: 0.02 },
      controller: { kind: 'pid', form: 'standard', gain: 3.5, integralTime: 0.39 },
      detail: 'summary',
    });
    expect(e?.statusCode).toBe(422);
    expect(e?.code).toBe('loop_not_finite');
  });

  it('a band wider than a double can hold (corners from 1e-293 to 1e290 rad/s) gets the loop_not_finite answer, not an internal array-length message', () => {
    for (const denominator of [
      [1e-300, 1e300],
      [1e300, 1, 1e-300],
    ]) {
      const e = err({ plant: { kind: 'transfer-function', numerator: [1], denominator }, controller: { kind: 'pid', form: 'standard', gain: 1, integralTime: 1 }, detail: 'summary' });
      expect(e?.statusCode).toBe(422);
      expect(e?.code).toBe('loop_not_finite');
    }
  });

  it('a closed-loop pole beyond the range of a double (1e−300·s + 1e300 + 1 has its root at −1e600) leaves the Nyquist verdict alone instead of counting as unstable', () => {
    const r = analyze({ plant: { kind: 'transfer-function', numerator: [1], denominator: [1e-300, 1e300] }, controller: { kind: 'pid', form: 'parallel', kp: 1 }, detail: 'summary' });
    // |L| ≤ 1e-300 everywhere, so 1 + L never nears 0: stable, with no encirclement of −1 (Nyquist criterion).
    expect(r.stability.closedLoopStable).toBe(true);
    expect(r.stability.method).toBe('nyquist');
    expect(r.stability.closedLoopPoles).toBeUndefined();
    expect(r.warnings.map((w) => w.code)).not.toContain('stability_methods_disagree');
  });

  it('large coefficients analyse like their scaled copy: 1e100·(s² + 2s + 2) equals s² + 2s + 2', () => {
    const scaled = analyze({ plant: { kind: 'transfer-function', numerator: [3e100], denominator: [1e100, 2e100, 2e100] }, detail: 'summary' });
    const plain = analyze({ plant: { kind: 'transfer-function', numerator: [3], denominator: [1, 2, 2] }, detail: 'summary' });
    expect(scaled.margins.phase!.frequency).toBeCloseTo(plain.margins.phase!.frequency, 12);
    expect(scaled.margins.phase!.degrees).toBeCloseTo(plain.margins.phase!.degrees, 10);
    expect(scaled.stability.closedLoopStable).toBe(true);
  });
});
