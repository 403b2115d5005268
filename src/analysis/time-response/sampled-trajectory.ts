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
 * A simulated response on a grid of equal steps, each sampled at the same
 * normalised nodes σ_j ∈ [0, 1] (first node 0, last node 1), with an exact
 * (within the method's approximation) evaluation anywhere inside a step.
 * Searches for peaks and crossings run on the node samples and are refined
 * with `evaluate`; a pair of samples at the same instant (end of one step,
 * start of the next) brackets a jump.
 */
export interface SampledTrajectory {
  stepLength: number;
  stepCount: number;
  nodes: readonly number[];
  /** y at node j of step k, stored at k·nodes.length + j */
  nodeOutput: Float64Array;
  evaluate(step: number, sigma: number): TrajectoryPoint;
}

export function sampleTime(trajectory: SampledTrajectory, index: number): number {
  const q = trajectory.nodes.length;
  const step = Math.floor(index / q);
  return (step + trajectory.nodes[index - step * q]) * trajectory.stepLength;
}

/** Evaluates the trajectory at time t (right-continuous), clamped to the simulated span. */
export function evaluateAtTime(trajectory: SampledTrajectory, t: number): TrajectoryPoint {
  const h = trajectory.stepLength;
  let step = Math.floor(t / h);
  if (step >= trajectory.stepCount) step = trajectory.stepCount - 1;
  if (step < 0) step = 0;
  let sigma = t / h - step;
  if (sigma < 0) sigma = 0;
  if (sigma > 1) sigma = 1;
  return trajectory.evaluate(step, sigma);
}
