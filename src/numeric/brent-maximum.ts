/**
 * Maximum of a unimodal function on [a, b] by Brent's method: golden-section
 * search combined with successive parabolic interpolation (R. P. Brent,
 * Algorithms for Minimization without Derivatives, 1973, ch. 5, procedure
 * "localmin", applied to −f).
 *
 * A maximum is flat: the abscissa is located only to about the square root
 * of the precision of f, while the value f(x*) is found to full precision.
 *
 * @example brentMaximum((x) => -(x - 1) * (x - 1), 0, 3) // → { x: ≈1, value: ≈0 }
 */
export interface Maximum {
  x: number;
  value: number;
}

const GOLDEN = 0.5 * (3 - Math.sqrt(5));

export function brentMaximum(
  f: (x: number) => number,
  lower: number,
  upper: number,
  relativeTolerance = 1e-10,
  maxIterations = 200,
): Maximum {
  const g = (x: number) => -f(x);
  let a = lower;
  let b = upper;
  let x = a + GOLDEN * (b - a);
  let w = x;
  let v = x;
  let fx = g(x);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let i = 0; i < maxIterations; i++) {
    const m = 0.5 * (a + b);
    const tol = relativeTolerance * Math.abs(x) + 1e-300;
    const t2 = 2 * tol;
    if (Math.abs(x - m) <= t2 - 0.5 * (b - a)) break;
    let useGolden = true;
    if (Math.abs(e) > tol) {
      const r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      const r2 = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r2) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < t2 || b - u < t2) d = x < m ? tol : -tol;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = (x < m ? b : a) - x;
      d = GOLDEN * e;
    }
    const u = Math.abs(d) >= tol ? x + d : x + (d > 0 ? tol : -tol);
    const fu = g(u);
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w; fv = fw;
      w = x; fw = fx;
      x = u; fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w; fv = fw;
        w = u; fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u; fv = fu;
      }
    }
  }
  return { x, value: -fx };
}
