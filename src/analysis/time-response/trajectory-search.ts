import { sampleTime, timeInStep, type SampledTrajectory, type TrajectoryPoint } from './sampled-trajectory.js';

export interface LocatedInstant {
  time: number;
  point: TrajectoryPoint;
}

/** Number of node samples whose time does not exceed the horizon. */
export function samplesWithinHorizon(trajectory: SampledTrajectory, horizon: number): number {
  const q = trajectory.nodes.length;
  const total = trajectory.stepCount * q;
  const slack = 1e-12 * horizon;
  let count = total;
  while (count > 0 && sampleTime(trajectory, count - 1) > horizon + slack) count--;
  return count;
}

function locationOf(trajectory: SampledTrajectory, index: number): { step: number; sigma: number } {
  const q = trajectory.nodes.length;
  const step = Math.floor(index / q);
  return { step, sigma: trajectory.nodes[index - step * q] };
}

export function pointAtSample(trajectory: SampledTrajectory, index: number): TrajectoryPoint {
  const { step, sigma } = locationOf(trajectory, index);
  return trajectory.evaluate(step, sigma);
}

/**
 * Where fn changes sign between the consecutive samples `index` and
 * `index + 1`: bisection on the exact in-step evaluation (plain bisection,
 * robust at kinks; 55 halvings take a step of any length to round-off).
 * Two samples at the same instant (the end of one step and the start of the
 * next) bracket a jump: the crossing is that instant, with the right value.
 */
export function locateSignChange(
  trajectory: SampledTrajectory,
  index: number,
  fn: (p: TrajectoryPoint) => number,
): LocatedInstant {
  const a = locationOf(trajectory, index);
  const b = locationOf(trajectory, index + 1);
  if (a.step !== b.step) {
    return { time: trajectory.stepStarts[b.step], point: trajectory.evaluate(b.step, 0) };
  }
  let lo = a.sigma;
  let hi = b.sigma;
  const fLo = fn(trajectory.evaluate(a.step, lo));
  const loSign = fLo > 0;
  for (let i = 0; i < 55 && hi - lo > 1e-16; i++) {
    const mid = 0.5 * (lo + hi);
    const fm = fn(trajectory.evaluate(a.step, mid));
    if (fm > 0 === loSign && fm !== 0) lo = mid;
    else hi = mid;
  }
  const sigma = 0.5 * (lo + hi);
  return { time: timeInStep(trajectory, a.step, sigma), point: trajectory.evaluate(a.step, sigma) };
}

/**
 * Largest value of sign·y near the sample with the largest sign·y: the
 * sample itself, or a stationary point (sign·dy/dt changes from + to −)
 * inside one of its two neighbouring sample intervals, located by bisection
 * on the exact derivative.
 */
export function refineMaximum(
  trajectory: SampledTrajectory,
  index: number,
  count: number,
  sign: number,
): LocatedInstant {
  let best: LocatedInstant = { time: sampleTime(trajectory, index), point: pointAtSample(trajectory, index) };
  const rate = (p: TrajectoryPoint): number => sign * p.outputRate;
  for (const left of [index - 1, index]) {
    if (left < 0 || left + 1 >= count) continue;
    const a = locationOf(trajectory, left);
    const b = locationOf(trajectory, left + 1);
    if (a.step !== b.step) continue;
    const ra = rate(trajectory.evaluate(a.step, a.sigma));
    const rb = rate(trajectory.evaluate(b.step, b.sigma));
    if (!(ra > 0 && rb < 0)) continue;
    const found = locateSignChange(trajectory, left, rate);
    if (sign * found.point.output > sign * best.point.output) best = found;
  }
  return best;
}
