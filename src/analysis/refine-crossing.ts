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

export function refineCrossing(
  loop: FrequencyModel,
  grid: Pick<LoopGrid, 'omega' | 're' | 'im'>,
  i: number,
  f: (re: number, im: number) => number,
): Crossing {
  const xs: number[] = [Math.log(grid.omega[i]), Math.log(grid.omega[i + 1])];
  const res: number[] = [grid.re[i], grid.re[i + 1]];
  const ims: number[] = [grid.im[i], grid.im[i + 1]];
  const v = { re: 0, im: 0 };
  const g = (x: number) => {
    for (let k = 0; k < xs.length; k++) if (xs[k] === x) return f(res[k], ims[k]);
    loop.evaluate(Math.exp(x), v);
    xs.push(x);
    res.push(v.re);
    ims.push(v.im);
    return f(v.re, v.im);
  };
  const x = brentRoot(g, xs[0], xs[1]);
  const k = xs.indexOf(x);
  if (k >= 0) return { frequency: Math.exp(x), re: res[k], im: ims[k] };
  const frequency = Math.exp(x);
  loop.evaluate(frequency, v);
  return { frequency, re: v.re, im: v.im };
}
