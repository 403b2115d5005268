import { eigenvaluesOf, polynomialRootsOf, type ComplexNumber } from './eigenvalues.js';
import { delayFreeStateMatrix, type LoopEquations } from './loop-equations.js';
import { evaluatePolynomialComplex, isZeroPolynomial, multiplyPolynomials, trimLeadingZeros } from './polynomial.js';

export interface RationalPart {
  numerator: number[];
  denominator: number[];
}

export interface StabilityAssessment {
  stable: boolean;
  /** closed-loop characteristic roots counted in the right half-plane (null when not counted) */
  unstableRootCount: number | null;
  method: string;
  /** why the loop is not stable, null when it is */
  reason: string | null;
  /** closed-loop eigenvalues of the delay-free loop (only when there is no delay) */
  delayFreeRoots: ComplexNumber[] | null;
}

/**
 * Closed-loop stability of the unity-feedback loop L(s) = C(s) P(s) e^{−sT}.
 *
 * Without delay: eigenvalues of the closed-loop state matrix (all real parts
 * below −1e−10·max|λ| is stable; a root closer to the imaginary axis is
 * reported as marginal, i.e. not stable).
 *
 * With delay: the Nyquist criterion Z = N + P (H. Nyquist, Bell Syst. Tech.
 * J. 11, 1932; K. J. Åström, R. M. Murray, Feedback Systems, 2nd ed., ch. 10)
 * applied to 1 + L on the line Re s = ε (ε a 1e−9 fraction of the loop's
 * frequency scale), so imaginary-axis open-loop poles such as integrators lie
 * left of the contour and need no indentation. The winding is accumulated
 * from 0 up to a frequency beyond which a monotone bound on |C P| (from the
 * magnitudes of its poles and zeros) stays below 1, so 1 + L cannot encircle
 * the origin there; between samples the phase step of 1 + L is kept below
 * π/4 by bisection. If |C(∞) P(∞)| ≥ 1 the delayed loop is of neutral type
 * with infinitely many roots at or right of the imaginary axis: not stable.
 */
export function assessClosedLoopStability(
  loop: LoopEquations,
  plant: RationalPart,
  controller: RationalPart,
  delay: number,
): StabilityAssessment {
  if (delay === 0) return delayFreeStability(loop);
  const highFrequencyGain = Math.abs(loop.controllerFeedthrough * loop.plantFeedthrough);
  const method = 'Nyquist winding of 1 + L along Re s = ε';
  if (highFrequencyGain >= 1) {
    return {
      stable: false,
      unstableRootCount: null,
      method,
      reason: `|C(∞)·P(∞)| = ${highFrequencyGain} ≥ 1 with a delay: the loop is of neutral type and has infinitely many closed-loop roots on or right of the imaginary axis`,
      delayFreeRoots: null,
    };
  }
  const num = trimLeadingZeros(multiplyPolynomials(controller.numerator, plant.numerator));
  const den = trimLeadingZeros(multiplyPolynomials(controller.denominator, plant.denominator));
  const poles = eigenvaluesOf(loop.f);
  const zeros = isZeroPolynomial(num) ? [] : polynomialRootsOf(num);
  const magnitudes = [...poles, ...zeros].map((z) => Math.hypot(z.re, z.im));
  const scale = Math.max(1 / delay, ...magnitudes);
  const epsilon = 1e-9 * scale;
  const openLoopUnstable = poles.filter((p) => p.re > epsilon).length;
  if (isZeroPolynomial(num)) {
    return verdict(openLoopUnstable, method, delayFreeReason(openLoopUnstable));
  }
  const onePlusLoop = (omega: number): [number, number] => {
    const [nr, ni] = evaluatePolynomialComplex(num, epsilon, omega);
    const [dr, di] = evaluatePolynomialComplex(den, epsilon, omega);
    const dd = dr * dr + di * di;
    const rr = (nr * dr + ni * di) / dd;
    const ri = (ni * dr - nr * di) / dd;
    const decay = Math.exp(-epsilon * delay);
    const c = Math.cos(omega * delay) * decay;
    const s = -Math.sin(omega * delay) * decay;
    return [1 + rr * c - ri * s, rr * s + ri * c];
  };
  const omegaEnd = frequencyBeyondWhichGainBelowOne(num[0] / den[0], zeros, poles, epsilon);
  const grid = initialGrid(epsilon, omegaEnd, delay, [...poles, ...zeros]);
  const start = onePlusLoop(0);
  const theta0 = start[0] < 0 ? Math.PI : 0;
  let theta = theta0;
  let previous = start;
  let previousOmega = 0;
  for (let i = 1; i < grid.length; i++) {
    const omega = grid[i];
    const current = onePlusLoop(omega);
    theta += phaseIncrement(onePlusLoop, previousOmega, previous, omega, current, 0);
    previous = current;
    previousOmega = omega;
  }
  const principal = Math.atan2(previous[1], previous[0]);
  const turns = Math.round((theta - principal) / (2 * Math.PI));
  const z = openLoopUnstable - 2 * turns + Math.round(theta0 / Math.PI);
  return verdict(z, method, z === 0 ? null : `${z} closed-loop root(s) in the right half-plane (Nyquist: Z = N + P with P = ${openLoopUnstable})`);
}

function verdict(z: number, method: string, reason: string | null): StabilityAssessment {
  return { stable: z === 0, unstableRootCount: z, method, reason: z === 0 ? null : reason, delayFreeRoots: null };
}

function delayFreeReason(count: number): string | null {
  return count === 0 ? null : `${count} open-loop unstable pole(s) and no feedback (C·P = 0)`;
}

function delayFreeStability(loop: LoopEquations): StabilityAssessment {
  const method = 'eigenvalues of the closed-loop state matrix';
  const a = delayFreeStateMatrix(loop);
  if (a === null) {
    return {
      stable: false,
      unstableRootCount: null,
      method,
      reason: '1 + C(∞)·P(∞) = 0: the loop is not well posed (algebraic loop without a solution)',
      delayFreeRoots: null,
    };
  }
  const roots = eigenvaluesOf(a);
  const scale = Math.max(1, ...roots.map((r) => Math.hypot(r.re, r.im)));
  const tolerance = 1e-10 * scale;
  const unstable = roots.filter((r) => r.re > tolerance).length;
  const marginal = roots.filter((r) => Math.abs(r.re) <= tolerance).length;
  let reason: string | null = null;
  if (unstable > 0) reason = `${unstable} closed-loop root(s) in the right half-plane`;
  else if (marginal > 0) reason = `${marginal} closed-loop root(s) on the imaginary axis (marginally stable)`;
  return { stable: reason === null, unstableRootCount: unstable + marginal, method, reason, delayFreeRoots: roots };
}

/**
 * Smallest doubling of a start frequency at which the bound
 * |b0/a0|·Π(ω + |z|)/Π(ω − |p|) on |C P| along |s| = ω (valid for ω > max|p|,
 * and decreasing in ω) is below 1.
 */
function frequencyBeyondWhichGainBelowOne(
  leadRatio: number,
  zeros: ComplexNumber[],
  poles: ComplexNumber[],
  epsilon: number,
): number {
  const zm = zeros.map((z) => Math.hypot(z.re, z.im) * (1 + 1e-9) + epsilon);
  const pm = poles.map((p) => Math.hypot(p.re, p.im) * (1 + 1e-9) + epsilon);
  const bound = (w: number): number => {
    let logB = Math.log(Math.abs(leadRatio));
    for (const z of zm) logB += Math.log(w + z);
    for (const p of pm) {
      if (w <= p) return Infinity;
      logB -= Math.log(w - p);
    }
    return Math.exp(logB);
  };
  let w = Math.max(2 * Math.max(0, ...zm, ...pm), 1e-300);
  for (let i = 0; i < 4000 && bound(w) >= 0.999; i++) w *= 2;
  return w;
}

const MAX_GRID_POINTS = 2_000_000;

function initialGrid(epsilon: number, omegaEnd: number, delay: number, features: ComplexNumber[]): number[] {
  const low = epsilon * 1e-2;
  const perDecade = 30;
  const decades = Math.max(1, Math.log10(omegaEnd / low));
  const points = new Set<number>([0, omegaEnd]);
  const count = Math.ceil(decades * perDecade);
  for (let i = 0; i <= count; i++) points.add(low * 10 ** ((i * decades) / count));
  for (const f of features) {
    const w = Math.abs(f.im);
    if (w > 0 && w < omegaEnd) for (const factor of [0.999, 1, 1.001]) points.add(w * factor);
  }
  const sorted = [...points].filter((w) => w <= omegaEnd).sort((a, b) => a - b);
  // The delay turns the phase by ωT: keep at most 0.5 rad of it between samples.
  const maxGap = Math.max(0.5 / delay, omegaEnd / MAX_GRID_POINTS);
  const out: number[] = [sorted[0]];
  for (let i = 1; i < sorted.length; i++) {
    const a = out[out.length - 1];
    const b = sorted[i];
    const pieces = Math.ceil((b - a) / maxGap);
    for (let p = 1; p < pieces; p++) out.push(a + ((b - a) * p) / pieces);
    out.push(b);
  }
  return out;
}

function phaseIncrement(
  fn: (w: number) => [number, number],
  wa: number,
  fa: [number, number],
  wb: number,
  fb: [number, number],
  depth: number,
): number {
  const re = fb[0] * fa[0] + fb[1] * fa[1];
  const im = fb[1] * fa[0] - fb[0] * fa[1];
  const step = Math.atan2(im, re);
  if (Math.abs(step) <= Math.PI / 4 || depth >= 60 || wb - wa <= 1e-15 * wb) return step;
  const wm = wa > 0 && wb / wa > 4 ? Math.sqrt(wa * wb) : 0.5 * (wa + wb);
  const fm = fn(wm);
  return phaseIncrement(fn, wa, fa, wm, fm, depth + 1) + phaseIncrement(fn, wm, fm, wb, fb, depth + 1);
}
