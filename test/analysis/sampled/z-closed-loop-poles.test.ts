/**
 * Closed-loop poles in z: for L = k/(z − a) the single root a − k
 * (derivation), a sample delay z^(−d) raising the degree by d, and no roots
 * above the degree cap (Nyquist alone then).
 */
import { describe, expect, it } from 'vitest';
import { MAX_CHARACTERISTIC_DEGREE, zClosedLoopPoles } from '../../../src/analysis/sampled/z-closed-loop-poles.js';

const loop = (k: number, a: number, delaySamples: number) => ({ samplePeriod: 0.1, numerator: [k], denominator: [1, -a], delaySamples, zeros: [], poles: [{ re: a, im: 0 }] });

describe('zClosedLoopPoles', () => {
  it('k/(z − a): the pole a − k, unstable once |a − k| ≥ 1', () => {
    const r = zClosedLoopPoles(loop(0.5, 0.8, 0))!;
    expect(r.poles).toHaveLength(1);
    expect(r.poles[0].re).toBeCloseTo(0.3, 15);
    expect(r.unstable).toBe(0);
    expect(zClosedLoopPoles(loop(1.9, 0.8, 0))!.unstable).toBe(1);
  });

  it('a delay of d samples adds d roots: z^(d+1) − a z^d + k', () => {
    const r = zClosedLoopPoles(loop(0.1, 0.8, 3))!;
    expect(r.poles).toHaveLength(4);
    for (const p of r.poles) {
      // p⁴ − 0.8p³ + 0.1 = 0
      const p2 = { re: p.re * p.re - p.im * p.im, im: 2 * p.re * p.im };
      const p3 = { re: p2.re * p.re - p2.im * p.im, im: p2.re * p.im + p2.im * p.re };
      const p4 = { re: p2.re * p2.re - p2.im * p2.im, im: 2 * p2.re * p2.im };
      expect(Math.hypot(p4.re - 0.8 * p3.re + 0.1, p4.im - 0.8 * p3.im)).toBeLessThan(1e-14);
    }
    expect(r.largestMagnitude).toBe(Math.hypot(r.poles[0].re, r.poles[0].im));
  });

  it('gives no roots above the degree cap', () => {
    expect(zClosedLoopPoles(loop(0.1, 0.8, MAX_CHARACTERISTIC_DEGREE))).toBeNull();
    expect(zClosedLoopPoles(loop(0.1, 0.8, MAX_CHARACTERISTIC_DEGREE - 1))).not.toBeNull();
  });
});
