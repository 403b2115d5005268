/**
 * A sign change of some function of L(jω) between neighbouring grid points
 * i and i + 1, refined on the model by Brent's method in ln ω (R. P. Brent,
 * Algorithms for Minimization without Derivatives, 1973, ch. 4; numeric/
 * brent-root.ts) to a few ulps.
 *
 * The bracket's ends are the grid's own samples and the value of L at the
 * root is the one Brent computed there, so a refinement costs only its
 * interior evaluations (about three fewer per crossing than evaluating the
 * ends and the root again).
 */
import type { FrequencyModel } from '../model/frequency-model.js';
import { brentRoot } from '../numeric/brent-root.js';
import type { Crossing } from './crossings.js';
import type { LoopGrid } from './loop-grid.js';

/**
 * The points Brent evaluated inside the bracket, kept so that the root's value of L is not computed
 * again: storage kept between calls (per thread; a refinement runs to completion and keeps none of
 * it), so that a refinement allocates no arrays that grow point by point.
 */
const MAX_RECORDED = 256;
const tried = { logOmega: new Float64Array(MAX_RECORDED), re: new Float64Array(MAX_RECORDED), im: new Float64Array(MAX_RECORDED) };

export function refineCrossing(
  loop: FrequencyModel,
  grid: Pick<LoopGrid, 'omega' | 're' | 'im'>,
  i: number,
  f: (re: number, im: number) => number,
): Crossing {
  const x0 = Math.log(grid.omega[i]);
  const x1 = Math.log(grid.omega[i + 1]);
  const v = { re: 0, im: 0 };
  let count = 0;
  const g = (x: number) => {
    if (x === x0) return f(grid.re[i], grid.im[i]);
    if (x === x1) return f(grid.re[i + 1], grid.im[i + 1]);
    loop.evaluate(Math.exp(x), v);
    if (count < MAX_RECORDED) {
      tried.logOmega[count] = x;
      tried.re[count] = v.re;
      tried.im[count] = v.im;
      count++;
    }
    return f(v.re, v.im);
  };
  const x = brentRoot(g, x0, x1);
  if (x === x0) return { frequency: Math.exp(x), re: grid.re[i], im: grid.im[i] };
  if (x === x1) return { frequency: Math.exp(x), re: grid.re[i + 1], im: grid.im[i + 1] };
  const frequency = Math.exp(x);
  for (let k = count - 1; k >= 0; k--) if (tried.logOmega[k] === x) return { frequency, re: tried.re[k], im: tried.im[k] };
  loop.evaluate(frequency, v);
  return { frequency, re: v.re, im: v.im };
}
