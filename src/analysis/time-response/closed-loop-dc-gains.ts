import {
  addPolynomials,
  isZeroPolynomial,
  lowestNonZeroCoefficient,
  multiplyPolynomials,
  rootsAtOriginCount,
} from './polynomial.js';
import type { RationalPart } from './closed-loop-stability.js';

/**
 * Zero-frequency gains of a stable unity-feedback loop (the delay has gain 1
 * at s = 0), from the final-value theorem (common practice):
 *   setpoint → output   T(0) = L(0)/(1 + L(0)) = Nc Np / (Dc Dp + Nc Np) at s = 0,
 *   load at plant input → output   P(0)/(1 + L(0)) = Np Dc / (Dc Dp + Nc Np) at s = 0.
 * Powers of s common to numerator and denominator are cancelled first, so an
 * integrating loop gives T(0) = 1 exactly and integral action gives a zero
 * load-disturbance offset exactly.
 */
export function closedLoopDcGains(plant: RationalPart, controller: RationalPart): { setpoint: number; disturbance: number } {
  const loopNum = multiplyPolynomials(controller.numerator, plant.numerator);
  const loopDen = multiplyPolynomials(controller.denominator, plant.denominator);
  const characteristic = addPolynomials(loopDen, loopNum);
  return {
    setpoint: ratioAtOrigin(loopNum, characteristic),
    disturbance: ratioAtOrigin(multiplyPolynomials(plant.numerator, controller.denominator), characteristic),
  };
}

/** lim_{s→0} A(s)/B(s) for a B that is not identically zero; ±Infinity if B has more roots at 0. */
export function ratioAtOrigin(a: readonly number[], b: readonly number[]): number {
  if (isZeroPolynomial(a)) return 0;
  const za = rootsAtOriginCount(a);
  const zb = rootsAtOriginCount(b);
  if (za > zb) return 0;
  const ratio = lowestNonZeroCoefficient(a) / lowestNonZeroCoefficient(b);
  if (za < zb) return ratio > 0 ? Infinity : -Infinity;
  return ratio;
}
