/**
 * Root of a continuous scalar function on a bracket [a, b] with f(a)·f(b) ≤ 0,
 * by Brent's method: inverse quadratic interpolation and secant steps,
 * safeguarded by bisection (R. P. Brent, Algorithms for Minimization without
 * Derivatives, Prentice-Hall 1973, ch. 4, procedure "zero").
 *
 * Stops when the bracket is narrower than `relativeTolerance`·|x| plus a few
 * ulps; the default (a few ulps) is well inside the 1e-12 relative-change
 * target of the margin refinement, and costs only a step or two more.
 *
 * @example brentRoot((x) => x * x - 2, 1, 2) // → 1.4142135623730951
 */
export function brentRoot(
  f: (x: number) => number,
  lower: number,
  upper: number,
  relativeTolerance = 4 * Number.EPSILON,
  maxIterations = 200,
): number {
  let a = lower;
  let b = upper;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Number.isNaN(fa) || Number.isNaN(fb) || fa * fb > 0) {
    throw new RangeError('brentRoot: the interval does not bracket a sign change');
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < maxIterations; i++) {
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * relativeTolerance * Math.abs(b);
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) < tol || Math.abs(fa) <= Math.abs(fb)) {
      d = m;
      e = m;
    } else {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
  }
  return b;
}
