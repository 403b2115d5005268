/**
 * Closed-loop poles of a sampled loop L(z) = N(z)/(D(z)·z^d): the roots of
 * the characteristic polynomial D(z)·z^d + N(z) by the Aberth–Ehrlich
 * iteration; the loop is stable when all of them lie strictly inside the
 * unit circle (Åström & Wittenmark, Computer-Controlled Systems, §3.2).
 * Like their continuous counterpart they cross-check the Nyquist count; a
 * long delay (a high power of z) makes the polynomial too large to trust,
 * and then no roots are given.
 */
import type { Complex } from '../../numeric/complex.js';
import { addPolynomials } from '../../numeric/polynomial.js';
import { polynomialRoots } from '../../numeric/polynomial-roots.js';
import type { DiscreteTransferFunction } from '../../model/discrete/discrete-model.js';

export interface ZClosedLoopPoles {
  poles: Complex[];
  unstable: number;
  largestMagnitude: number;
}

/** Above this degree the characteristic polynomial's roots are not computed. */
export const MAX_CHARACTERISTIC_DEGREE = 120;
/** A root counts as unstable when |z| ≥ 1 − this (the unit circle counts as unstable). */
const STABILITY_TOLERANCE = 1e-10;

export function zClosedLoopPoles(loop: DiscreteTransferFunction): ZClosedLoopPoles | null {
  const shifted = [...loop.denominator, ...new Array<number>(loop.delaySamples).fill(0)];
  const characteristic = addPolynomials(shifted, loop.numerator);
  if (characteristic.length - 1 > MAX_CHARACTERISTIC_DEGREE) return null;
  const poles = polynomialRoots(characteristic).sort((a, b) => Math.hypot(b.re, b.im) - Math.hypot(a.re, a.im) || b.im - a.im);
  const magnitudes = poles.map((p) => Math.hypot(p.re, p.im));
  return {
    poles,
    unstable: magnitudes.filter((m) => m >= 1 - STABILITY_TOLERANCE).length,
    largestMagnitude: magnitudes.length ? magnitudes[0] : 0,
  };
}
