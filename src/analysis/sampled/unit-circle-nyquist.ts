/**
 * Closed-loop stability of a sampled loop by the Nyquist criterion on the
 * unit circle (Åström & Wittenmark, Computer-Controlled Systems, 3rd ed.,
 * §3.3; Franklin, Powell & Workman, Digital Control of Dynamic Systems,
 * §7.5): Z = N + P, where Z counts closed-loop poles outside the unit circle,
 * P the open-loop poles outside it, and N the clockwise encirclements of the
 * origin by 1 + L(e^{jθ}) as θ runs once round the circle, going round poles
 * on the circle on small arcs outside it (so they count as inside).
 *
 * By conjugate symmetry the change of arg(1 + L) over the whole circle is
 *   2·(change for θ from 0+ to π)  −  m·π  −  m₋₁·π,
 * m the poles at z = 1 (integrators) and m₋₁ those at z = −1 (the arcs
 * there); other poles on the circle are inside the grid's unwrapped argument,
 * as for poles on the imaginary axis. Unlike the continuous contour nothing
 * has to be closed at infinity: at θ = π, 1 + L is real and the circle closes
 * on itself, so the sweep is complete by construction.
 */
import type { FrequencyModel } from '../../model/frequency-model.js';
import type { LoopGrid } from '../loop-grid.js';

export interface UnitCircleNyquist {
  clockwiseEncirclements: number;
  closedLoopUnstablePoles: number;
  /** min |1 + L| over the grid. */
  closestApproach: number;
  /** True when 1 + L came so close to 0 that a closed-loop pole sits on the unit circle. */
  marginal: boolean;
}

const MARGINAL_RETURN_DIFFERENCE = 1e-9;

/** Net order of poles at z = −1 (on the unit circle at the Nyquist frequency). */
export function polesAtNyquistFrequency(loop: FrequencyModel, nyquistFrequency: number): number {
  return loop.imaginaryAxisPoles
    .filter((p) => Math.abs(p.frequency - nyquistFrequency) <= 1e-9 * nyquistFrequency)
    .reduce((s, p) => s + p.order, 0);
}

/**
 * @param closeAtEnd for a loop that is not real at its last grid point (a hold response without aliasing,
 *   or data ending below π/Ts): add the shortest turn from there to the real axis.
 */
export function unitCircleNyquist(loop: FrequencyModel, grid: LoopGrid, nyquistFrequency: number, closeAtEnd = false): UnitCircleNyquist {
  const { returnArg, returnMagnitude, re, im } = grid;
  const last = grid.omega.length - 1;
  let closest = Infinity;
  for (let i = 0; i <= last; i++) closest = Math.min(closest, returnMagnitude[i]);
  let change = returnArg[last] - returnArg[0];
  // From θ = 0+ to the first grid point: without integrators 1 + L(1) is real.
  if (loop.integrators === 0 && Number.isFinite(loop.lowFrequencyGain)) {
    const d = Math.atan2(im[0], 1 + re[0]) - Math.atan2(0, 1 + loop.lowFrequencyGain);
    change += d - 2 * Math.PI * Math.round(d / (2 * Math.PI));
  }
  if (closeAtEnd) {
    const a = Math.atan2(im[last], 1 + re[last]);
    const target = 1 + re[last] >= 0 ? 0 : Math.PI * Math.sign(a || 1);
    change += target - a;
  }
  const atMinusOne = polesAtNyquistFrequency(loop, nyquistFrequency);
  const total = 2 * change - loop.integrators * Math.PI - atMinusOne * Math.PI;
  const clockwiseEncirclements = -Math.round(total / (2 * Math.PI)) || 0;
  return {
    clockwiseEncirclements,
    closedLoopUnstablePoles: clockwiseEncirclements + loop.unstablePoles,
    closestApproach: closest,
    marginal: closest < MARGINAL_RETURN_DIFFERENCE,
  };
}
