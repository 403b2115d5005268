/**
 * Closed-loop stability by the Nyquist criterion Z = N + P (H. Nyquist,
 * "Regeneration theory", Bell Syst. Tech. J. 11, 1932; Åström & Murray,
 * Feedback Systems, 2nd ed., §10.2), on the contour that runs up the
 * imaginary axis, goes round imaginary-axis poles on small semicircles to the
 * right, and closes in the right half-plane.
 *
 * N (clockwise encirclements of the origin by 1 + L) comes from the total
 * change of arg(1 + L) along the contour, which by conjugate symmetry is
 *   2·(change along ω from 0+ to ∞)  −  m·π  (the indentation at s = 0 for m integrators),
 * the indentations at ±jω0 being inside the grid's unwrapped argument. The
 * sweep stops where a proven bound keeps 1 + L in a disc that excludes the
 * origin; what remains there is less than a quarter turn each side, so
 * rounding the total to whole turns is exact.
 */
import type { FrequencyModel } from '../model/frequency-model.js';
import type { LoopGrid } from './loop-grid.js';

export interface NyquistResult {
  clockwiseEncirclements: number;
  closedLoopUnstablePoles: number;
  /** Closest approach of L to −1 on the swept grid, |1 + L|min. */
  closestApproach: number;
  /** Frequency where the sweep ended. */
  sweepTo: number;
  /** True when 1 + L came so close to 0 that a closed-loop pole sits on the imaginary axis (marginal). */
  marginal: boolean;
}

/** |1 + L| below this counts as passing through the critical point. */
const MARGINAL_RETURN_DIFFERENCE = 1e-9;

export function nyquistStability(loop: FrequencyModel, grid: LoopGrid, sweepTo: number): NyquistResult {
  const { omega, returnArg, returnMagnitude, re, im } = grid;
  let last = 0;
  let closest = Infinity;
  for (let i = 0; i < omega.length && omega[i] <= sweepTo * (1 + 1e-12); i++) {
    last = i;
    closest = Math.min(closest, returnMagnitude[i]);
  }
  let change = returnArg[last] - returnArg[0];
  // From ω = 0+ to the first grid point: for a loop without integrators 1 + L(0) is real;
  // with integrators the grid starts where the asymptote already holds.
  if (loop.integrators === 0 && Number.isFinite(loop.lowFrequencyGain)) {
    const f0 = 1 + loop.lowFrequencyGain;
    change += Math.atan2(im[0], 1 + re[0]) - Math.atan2(0, f0) - 2 * Math.PI * Math.round((Math.atan2(im[0], 1 + re[0]) - Math.atan2(0, f0)) / (2 * Math.PI));
  }
  // From the sweep end to ∞ without delay: 1 + L tends to 1 + L(∞), inside the disc.
  if (loop.delay === 0 && loop.relativeDegree !== null) {
    const fInf = 1 + (loop.relativeDegree > 0 ? 0 : loop.highFrequencyGain);
    const d = Math.atan2(0, fInf) - Math.atan2(im[last], 1 + re[last]);
    change += d - 2 * Math.PI * Math.round(d / (2 * Math.PI));
  }
  const total = 2 * change - loop.integrators * Math.PI;
  const counterClockwise = Math.round(total / (2 * Math.PI));
  const clockwiseEncirclements = -counterClockwise || 0; // no negative zero
  return {
    clockwiseEncirclements,
    closedLoopUnstablePoles: clockwiseEncirclements + loop.unstablePoles,
    closestApproach: closest,
    sweepTo: omega[last],
    marginal: closest < MARGINAL_RETURN_DIFFERENCE,
  };
}
