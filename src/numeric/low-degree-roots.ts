/**
 * Roots of a real polynomial of degree at most two (after removing exact
 * roots at the origin) in closed form, and of any higher degree by
 * polynomialRoots (Aberth–Ehrlich). PID controllers and second-order plants
 * give one or two such polynomials per request; the closed form is exact to
 * rounding where the iteration needs a dozen passes.
 *
 * Quadratic a·s² + b·s + c: real roots by the cancellation-free form
 * q = −(b + sign(b)·√(b² − 4ac))/2, s₁ = q/a, s₂ = c/q (Press et al.,
 * Numerical Recipes, 3rd ed., §5.6); complex roots −b/(2a) ± j√(4ac − b²)/(2|a|),
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
    const [a, b, c] = trimmed;
    const discriminant = b * b - 4 * a * c;
    if (discriminant >= 0) {
      const q = -0.5 * (b + (b >= 0 ? 1 : -1) * Math.sqrt(discriminant));
      // q = 0 only when b = c = 0, which the origin split has already removed.
      roots.push({ re: q / a, im: 0 }, { re: c / q, im: 0 });
    } else {
      const re = -b / (2 * a);
      const im = Math.sqrt(-discriminant) / (2 * Math.abs(a));
      roots.push({ re, im }, { re, im: -im });
    }
  }
  return roots;
}
