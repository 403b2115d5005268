/**
 * Closed-loop poles of a rational loop without delay: the roots of the
 * characteristic polynomial D_L(s) + N_L(s) (for L = N_L/D_L), by the
 * Aberth–Ehrlich iteration. Multiplying out factors loses accuracy for high
 * degrees, so these roots only cross-check the Nyquist verdict (DESIGN.md,
 * "ill-conditioned polynomials"); a disagreement is reported, not hidden.
 * None (null) when a root is not a finite double.
 */
import type { Complex } from '../numeric/complex.js';
import { addPolynomials } from '../numeric/polynomial.js';
import { polynomialRoots } from '../numeric/polynomial-roots.js';
import type { FrequencyModel } from '../model/frequency-model.js';

export interface ClosedLoopPoles {
  poles: Complex[];
  unstable: number;
}

/** A root counts as unstable when Re ≥ −this·|root| (the imaginary axis counts as unstable). */
const STABILITY_TOLERANCE = 1e-10;

export function closedLoopPoles(loop: FrequencyModel): ClosedLoopPoles | null {
  if (!loop.rational || loop.delay !== 0) return null;
  const characteristic = addPolynomials(loop.rational.denominator, loop.rational.numerator);
  const poles = polynomialRoots(characteristic).sort((a, b) => b.re - a.re || b.im - a.im);
  // A root beyond the range of a double (1e−300·s + 1e300 has its root at −1e600) cannot be
  // placed, so there is nothing to cross-check: the Nyquist verdict stands alone.
  if (poles.some((p) => !Number.isFinite(p.re) || !Number.isFinite(p.im))) return null;
  const unstable = poles.filter((p) => p.re >= -STABILITY_TOLERANCE * Math.max(Math.hypot(p.re, p.im), 1e-300)).length;
  return { poles, unstable };
}
