import { eigenvaluesOf, polynomialRootsOf, type ComplexNumber } from './eigenvalues.js';
import type { LoopEquations } from './loop-equations.js';
import type { RationalPart } from './closed-loop-stability.js';
import { addPolynomials, multiplyPolynomials, trimLeadingZeros } from './polynomial.js';

/** Degree of the Padé approximant used only to estimate time scales of a delayed loop. */
const PADE_ORDER = 6;

/**
 * Coefficients (descending powers of s) of the [k/k] Padé approximant
 * P(s)/Q(s) of e^{−sT}: Q(s) = Σ c_j (sT)^j, P(s) = Σ c_j (−sT)^j,
 * c_j = (2k − j)! k! / ((2k)! j! (k − j)!) (G. A. Baker, P. Graves-Morris,
 * Padé Approximants, 2nd ed., 1996, the exponential's table).
 */
export function padeDelayApproximant(delay: number, order: number): RationalPart {
  const c = [1];
  for (let j = 1; j <= order; j++) c.push((c[j - 1] * (order - j + 1)) / (j * (2 * order - j + 1)));
  const denominator: number[] = [];
  const numerator: number[] = [];
  for (let j = order; j >= 0; j--) {
    const v = c[j] * delay ** j;
    denominator.push(v);
    numerator.push(j % 2 === 0 ? v : -v);
  }
  return { numerator, denominator };
}

export interface LoopTimeScales {
  /** largest |λ| among the modes the simulation must resolve (rad/s) */
  fastestRate: number;
  /** smallest decay rate −Re λ of the stable closed-loop roots (1/s), null if none */
  slowestDecay: number | null;
  /** largest growth rate Re λ > 0 among the estimated closed-loop roots (1/s), null if none */
  fastestGrowth: number | null;
  /** the closed-loop roots used (exact without delay, Padé estimate with delay) */
  closedLoopRoots: ComplexNumber[];
}

/**
 * Time scales of the closed loop for choosing the step and the horizon.
 * Without delay: the exact closed-loop eigenvalues. With delay: roots of
 * Dc·Dp·Q + Nc·Np·P with the [6/6] Padé approximant P/Q of e^{−sT} — an
 * estimate of the dominant closed-loop roots only (it decides how long to
 * simulate, never the stability verdict); roots beyond |s| = 6/T, where the
 * approximant no longer follows the delay, are ignored. The fastest rate
 * includes the open-loop plant and controller modes, which shape the delayed
 * input within a step, and the estimated roots with |λ| ≤ 3/T.
 */
export function estimateLoopTimeScales(
  loop: LoopEquations,
  plant: RationalPart,
  controller: RationalPart,
  delay: number,
  delayFreeRoots: ComplexNumber[] | null,
): LoopTimeScales {
  const openLoop = eigenvaluesOf(loop.f);
  let roots: ComplexNumber[];
  let relevant: ComplexNumber[];
  let resolved: ComplexNumber[];
  if (delay === 0) {
    roots = delayFreeRoots ?? [];
    relevant = roots;
    resolved = roots;
  } else {
    const pade = padeDelayApproximant(delay, PADE_ORDER);
    const characteristic = addPolynomials(
      multiplyPolynomials(multiplyPolynomials(controller.denominator, plant.denominator), pade.denominator),
      multiplyPolynomials(multiplyPolynomials(controller.numerator, plant.numerator), pade.numerator),
    );
    const trimmed = trimLeadingZeros(characteristic);
    roots = trimmed.length > 1 ? polynomialRootsOf(trimmed) : [];
    // Beyond |s| ≈ k/T the Padé approximant no longer follows the delay.
    relevant = roots.filter((r) => Math.hypot(r.re, r.im) <= PADE_ORDER / delay);
    // Roots with |λ|T ≥ π belong to the chain that shapes the jumps and kinks at multiples of
    // T, which the grid (aligned with T) represents exactly: they do not set the step.
    resolved = roots.filter((r) => Math.hypot(r.re, r.im) <= 3 / delay);
  }
  const magnitude = (r: ComplexNumber): number => Math.hypot(r.re, r.im);
  const fastestRate = Math.max(0, ...openLoop.map(magnitude), ...resolved.map(magnitude));
  const decays = relevant.filter((r) => r.re < 0).map((r) => -r.re);
  const growths = relevant.filter((r) => r.re > 0).map((r) => r.re);
  return {
    fastestRate,
    slowestDecay: decays.length > 0 ? Math.min(...decays) : null,
    fastestGrowth: growths.length > 0 ? Math.max(...growths) : null,
    closedLoopRoots: roots,
  };
}
