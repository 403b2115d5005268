/** The loop's signals at one instant (right-hand limits at a jump). */
export interface TrajectoryPoint {
  /** plant output y */
  output: number;
  /** controller output u (without the load disturbance) */
  control: number;
  /** dy/dt */
  outputRate: number;
  /** ∫₀ᵗ y dτ */
  outputIntegral: number;
}

/**
 * A simulated response on a grid of steps, each sampled at the same
 * normalised nodes σ_j ∈ [0, 1] (first node 0, last node 1), with an exact
 * (within the method's approximation) evaluation anywhere inside a step.
 * Searches for peaks and crossings run on the node samples and are refined
 * with `evaluate`; a pair of samples at the same instant (end of one step,
 * start of the next) brackets a jump.
 */
export interface SampledTrajectory {
  stepCount: number;
  /** start times of the steps and the end of the last one (stepCount + 1 entries, increasing) */
  stepStarts: Float64Array;
  nodes: readonly number[];
  /** y at node j of step k, stored at k·nodes.length + j */
  nodeOutput: Float64Array;
  evaluate(step: number, sigma: number): TrajectoryPoint;
}

/** Start times k·h of equal steps (k·h rather than a running sum, so grid times stay exact multiples). */
export function uniformStepStarts(stepLength: number, stepCount: number, offset = 0): Float64Array {
  const starts = new Float64Array(stepCount + 1);
  for (let k = 0; k <= stepCount; k++) starts[k] = offset + k * stepLength;
  return starts;
}

export function timeInStep(trajectory: SampledTrajectory, step: number, sigma: number): number {
  const a = trajectory.stepStarts[step];
  return a + sigma * (trajectory.stepStarts[step + 1] - a);
}

export function sampleTime(trajectory: SampledTrajectory, index: number): number {
  const q = trajectory.nodes.length;
  const step = Math.floor(index / q);
  return timeInStep(trajectory, step, trajectory.nodes[index - step * q]);
}

/** The step containing t (the later one at a step boundary), clamped to the simulated span. */
export function stepContaining(trajectory: SampledTrajectory, t: number): number {
  const starts = trajectory.stepStarts;
  let lo = 0;
  let hi = trajectory.stepCount - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid] <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Evaluates the trajectory at time t (right-continuous), clamped to the simulated span. */
export function evaluateAtTime(trajectory: SampledTrajectory, t: number): TrajectoryPoint {
  const step = stepContaining(trajectory, t);
  const a = trajectory.stepStarts[step];
  let sigma = (t - a) / (trajectory.stepStarts[step + 1] - a);
  if (sigma < 0) sigma = 0;
  if (sigma > 1) sigma = 1;
  return trajectory.evaluate(step, sigma);
}
