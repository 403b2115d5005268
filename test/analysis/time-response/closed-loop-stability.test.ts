import { describe, expect, it } from 'vitest';
import { assessClosedLoopStability } from '../../../src/analysis/time-response/closed-loop-stability.js';
import { assembleLoopEquations } from '../../../src/analysis/time-response/loop-equations.js';
import { realiseTransferFunction } from '../../../src/analysis/time-response/state-space-realisation.js';

function assess(plantNum: number[], plantDen: number[], delay: number, ctrlNum: number[], ctrlDen: number[]) {
  const plant = { numerator: plantNum, denominator: plantDen };
  const controller = { numerator: ctrlNum, denominator: ctrlDen };
  const loop = assembleLoopEquations(realiseTransferFunction(plantNum, plantDen), realiseTransferFunction(ctrlNum, ctrlDen));
  return assessClosedLoopStability(loop, plant, controller, delay);
}

/** Test-side bisection for the crossing frequencies below. */
function bisect(fn: (x: number) => number, lo: number, hi: number): number {
  const flo = fn(lo) > 0;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (fn(mid) > 0 === flo) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

describe('assessClosedLoopStability with delay (Nyquist count)', () => {
  it('puts the limit of k·e^{−sT}/s at kT = π/2', () => {
    // PM = π/2 − kT (REFERENCES.md, loop k·e^{−sT}/s, derivation).
    const T = 0.4;
    const limit = Math.PI / 2 / T;
    expect(assess([1], [1, 0], T, [0.99 * limit], [1]).stable).toBe(true);
    const beyond = assess([1], [1, 0], T, [1.01 * limit], [1]);
    expect(beyond.stable).toBe(false);
    expect(beyond.unstableRootCount).toBe(2);
  });

  it('puts the limit of K e^{−sT}/(τs + 1) under P control at the critical gain', () => {
    // Derivation: phase crossover ωT + atan(ωτ) = π, critical gain √(1 + (ωτ)²)/K.
    const K = 1.7;
    const tau = 2;
    const T = 0.5;
    const w = bisect((x) => x * T + Math.atan(x * tau) - Math.PI, 1e-6, Math.PI / T);
    const kc = Math.sqrt(1 + (w * tau) ** 2) / K;
    expect(assess([K], [tau, 1], T, [0.99 * kc], [1]).stable).toBe(true);
    expect(assess([K], [tau, 1], T, [1.01 * kc], [1]).unstableRootCount).toBe(2);
  });

  it('counts the open-loop unstable pole of e^{−sT}/(s − a) correctly (P = 1)', () => {
    // Derivation: s − a + k e^{−sT} = 0 has a root at 0 when k = a, and a pair ±jω when
    // k cos ωT = a, k sin ωT = ω, i.e. tan ωT = ω/a with ωT ∈ (0, π/2) (needs aT < 1), k = √(a² + ω²).
    // Stable exactly for a < k < √(a² + ω²).
    const a = 1;
    const T = 0.5;
    const w = bisect((x) => Math.tan(x * T) - x / a, 1e-3, Math.PI / (2 * T) - 1e-9);
    const kMax = Math.hypot(a, w);
    expect(assess([1], [1, -a], T, [0.95 * a], [1]).unstableRootCount).toBe(1);
    expect(assess([1], [1, -a], T, [1.05 * a], [1]).stable).toBe(true);
    expect(assess([1], [1, -a], T, [0.99 * kMax], [1]).stable).toBe(true);
    expect(assess([1], [1, -a], T, [1.01 * kMax], [1]).unstableRootCount).toBe(2);
  });

  it('agrees with the delay-free eigenvalues when the delay is negligible, integrators included', () => {
    // Cross-check of two different methods on loops whose roots are far from the imaginary axis.
    const loops: Array<[number[], number[], number[], number[]]> = [
      [[1], [1, 0], [2, 1], [1, 0]], // PI on an integrator: type 2, stable
      [[1], [1, 3, 3, 1], [8, 0.5], [1, 0]], // PI on a triple lag with too much gain: unstable
      [[1], [1, 3, 3, 1], [1, 0.3], [1, 0]], // moderate PI: stable
      [[1, -2], [1, 2, 1], [0.3], [1]], // right-half-plane zero, low gain: stable
      [[2], [1, -1], [3, 1], [1, 0]], // unstable plant stabilised by PI
    ];
    for (const [pn, pd, cn, cd] of loops) {
      const reference = assess(pn, pd, 0, cn, cd);
      const delayed = assess(pn, pd, 1e-7, cn, cd);
      expect(delayed.stable).toBe(reference.stable);
      expect(delayed.unstableRootCount).toBe(reference.unstableRootCount);
    }
  });

  it('decides an undamped plant resonance under delayed feedback by the sign of the gain', () => {
    // s² + 1 + k e^{−sT} = 0 (plant 1/(s² + 1), open-loop poles on the imaginary axis): first-order
    // perturbation gives s ≈ jω + k sin(ωT)/(2ω), ω² ≈ 1 + k cos ωT (derivation), so k = 0.1,
    // T = 0.1 puts a pair at Re s ≈ +0.005 and k = −0.1 at −0.005.
    const destabilised = assess([1], [1, 0, 1], 0.1, [0.1], [1]);
    expect(destabilised.unstableRootCount).toBe(2);
    expect(assess([1], [1, 0, 1], 0.1, [-0.1], [1]).stable).toBe(true);
  });

  it('calls a loop with |C(∞)P(∞)| ≥ 1 and a delay neutral', () => {
    const r = assess([2, 1], [1, 1], 0.1, [0.5], [1]);
    expect(r.stable).toBe(false);
    expect(r.unstableRootCount).toBeNull();
  });
});

describe('assessClosedLoopStability without delay (eigenvalues)', () => {
  it('finds the closed-loop root of 1/(s − 1) under gain k at 1 − k', () => {
    expect(assess([1], [1, -1], 0, [0.5], [1]).unstableRootCount).toBe(1);
    const stable = assess([1], [1, -1], 0, [3], [1]);
    expect(stable.stable).toBe(true);
    expect(stable.delayFreeRoots![0].re).toBeCloseTo(-2, 14);
  });
  it('reports a closed-loop pair on the imaginary axis as marginal', () => {
    // 1/s² under P control: s² + k = 0, roots ±j√k (derivation).
    const r = assess([1], [1, 0, 0], 0, [4], [1]);
    expect(r.stable).toBe(false);
    expect(r.reason).toMatch(/marginal/);
  });
});
