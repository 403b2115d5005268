/**
 * Roots of a real polynomial of degree at most two (after removing exact
 * roots at the origin) in closed form, and of any higher degree by
 * polynomialRoots (Aberth–Ehrlich). PID controllers and second-order plants
 * give one or two such polynomials per request; the closed form is exact to
 * rounding where the iteration needs a dozen passes.
 *
 * Quadratic a·s² + b·s + c, divided by a: real roots by the cancellation-free form
 * q = −(b + sign(b)·√(b² − 4c))/2, s₁ = q, s₂ = c/q (Press et al.,
 * Numerical Recipes, 3rd ed., §5.6); complex roots −b/2 ± j√(4c − b²)/2,
 * an exactly conjugate pair, as polynomialRoots returns them.
 *
 * @example lowDegreeRoots([1, 3, 2]) // → [{re: -2, im: 0}, {re: -1, im: 0}]
 */
import type { Complex } from './complex.js';
import { polynomialRoots } from './polynomial-roots.js';
import { trimLeading, zeroRootMultiplicity } from './polynomial.js';

export function lowDegreeRoots(coefficients: readonly number[]): Complex[] {
  const trimmed = trimLeading(coefficients);
  const atOrigin = zeroRootMultiplicity(trimmed);
  const n = trimmed.length - 1 - atOrigin;
  if (n > 2) return polynomialRoots(coefficients);
  const roots: Complex[] = [];
  for (let k = 0; k < atOrigin; k++) roots.push({ re: 0, im: 0 });
  if (n === 1) roots.push({ re: -trimmed[1] / trimmed[0], im: 0 });
  if (n === 2) {
    // Monic form s² + b·s + c first, as polynomialRoots normalises: b² and 4ac of the raw
    // coefficients can overflow (1e200·1e200) where their quotients are ordinary numbers.
    const b = trimmed[1] / trimmed[0];
    const c = trimmed[2] / trimmed[0];
    // √(b² − 4c) as |b|·√(1 − 4c/b²) when b² alone would overflow.
    const large = Math.abs(b) > 1e150;
    const discriminant = large ? 1 - (4 * c) / b / b : b * b - 4 * c;
    const scale = large ? Math.abs(b) : 1;
    if (discriminant >= 0) {
      const q = -0.5 * (b + (b >= 0 ? 1 : -1) * scale * Math.sqrt(discriminant));
      // q = 0 only when b = c = 0, which the origin split has already removed.
      roots.push({ re: q, im: 0 }, { re: c / q, im: 0 });
    } else {
      const re = -b / 2;
      const im = (scale * Math.sqrt(-discriminant)) / 2;
      roots.push({ re, im }, { re, im: -im });
    }
  }
  // Overflow or underflow in the closed form (b² beyond the double range, c/q subnormal over
  // zero): the iteration, with its own safeguards, decides.
  if (roots.some((r) => !Number.isFinite(r.re) || !Number.isFinite(r.im))) return polynomialRoots(coefficients);
  return roots;
}
