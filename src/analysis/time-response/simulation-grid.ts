import type { DelayedStepPlan } from './delayed-trajectory.js';
import type { LoopTimeScales } from './loop-time-scales.js';

/** Upper bound on simulation steps (memory: all step states are kept for refinement). */
export const MAX_STEPS = 200_000;
/**
 * Target |λ|·h for the fastest mode: with 8 interpolation nodes the
 * in-step interpolation error of e^{λt} is about (|λ|h/2)^8/(8!·2^7) ≈ 3e−12.
 */
const TARGET_RATE_STEP = 0.5;
/** Steps may grow to this multiple of the target before the horizon is cut instead. */
const MAX_STEP_STRETCH = 2;

/** Delay intervals simulated with aligned steps before long steps may start (retarded loops). */
const SMOOTHING_INTERVALS = 20;
/** Remaining jump size allowed when long steps start in a neutral loop, |Dc·Dp|^k. */
const NEUTRAL_JUMP_DECAY = 1e-13;

export interface SimulationGrid {
  duration: number;
  /** the longest internal step */
  stepLength: number;
  stepCount: number;
  /** with a delay: the step plan (aligned steps T/m, then possibly long steps p·T) */
  delayed: DelayedStepPlan | null;
  notes: string[];
}

/**
 * Chooses the horizon and the step.
 *
 * Horizon (when not given): five times (T + 4/σ), σ the slowest decay rate
 * −Re λ of the closed-loop roots; 4/σ is the 2 % settling time of that mode
 * (e^{−4} ≈ 0.018), so the horizon covers about five settling times. An
 * unstable loop gets 3T + 10/γ (γ its fastest growth rate: a growth of about
 * e^{10}). Bounded so the step stays within twice its target.
 *
 * Step: h ≈ 0.5/|λ|max over the modes to resolve; with a delay, h = T/m for
 * a whole m so the delay is an exact number of steps. A delay shorter than
 * duration/MAX_STEPS gets 20 steps of T (more for a neutral loop, until
 * |Dc·Dp|^k < 1e−13), then steps of p·T ≈ h for a whole p ≥ 2.
 */
export function planSimulationGrid(
  scales: LoopTimeScales,
  delay: number,
  stable: boolean,
  requestedDuration: number | null,
  highFrequencyLoopGain = 0,
): SimulationGrid {
  const notes: string[] = [];
  const rate = scales.fastestRate;
  let duration: number;
  if (requestedDuration !== null) {
    duration = requestedDuration;
  } else if (stable && scales.slowestDecay !== null && scales.slowestDecay > 0) {
    duration = 5 * (delay + 4 / scales.slowestDecay);
  } else if (!stable && scales.fastestGrowth !== null && scales.fastestGrowth > 0) {
    duration = 3 * delay + 10 / scales.fastestGrowth;
  } else {
    duration = rate > 0 ? 20 * (delay + 1 / rate) : delay > 0 ? 20 * delay : 1;
    notes.push('no closed-loop root sets a time scale: default horizon from the fastest mode and the delay');
  }
  let target = rate > 0 ? TARGET_RATE_STEP / rate : duration / 1000;
  target = Math.min(target, duration / 100);
  if (requestedDuration === null) {
    const longest = MAX_STEPS * MAX_STEP_STRETCH * target;
    if (duration > longest) {
      notes.push(
        `the slowest closed-loop mode (decay rate ${scales.slowestDecay}) is far slower than the fastest (${rate} rad/s): horizon cut to ${longest} s`,
      );
      duration = longest;
    }
  }

  if (delay === 0) {
    const stepCount = Math.max(1, Math.min(MAX_STEPS, Math.ceil(duration / target)));
    if (Math.ceil(duration / target) > MAX_STEPS) {
      notes.push('stiff loop: the search grid is coarser than the fastest mode (the propagation itself is exact)');
    }
    return { duration, stepLength: duration / stepCount, stepCount, delayed: null, notes };
  }

  let delaySteps = Math.max(1, Math.ceil(delay / target));
  let stepLength = delay / delaySteps;
  let stepCount = Math.ceil(duration / stepLength - 1e-9);
  if (stepCount <= MAX_STEPS) {
    if (requestedDuration === null) duration = stepCount * stepLength;
    return { duration, stepLength, stepCount, delayed: { delaySteps, alignedStepCount: stepCount, longStepFactor: 0, longStepCount: 0 }, notes };
  }
  delaySteps = Math.floor((delay * MAX_STEPS) / duration);
  if (delaySteps >= 1) {
    stepLength = delay / delaySteps;
    stepCount = Math.ceil(duration / stepLength - 1e-9);
    notes.push(
      `stiff loop: step ${stepLength} s is ${(stepLength * rate).toPrecision(3)}/|λ|max (target ${TARGET_RATE_STEP}); accuracy is reduced`,
    );
    if (requestedDuration === null) duration = stepCount * stepLength;
    return { duration, stepLength, stepCount, delayed: { delaySteps, alignedStepCount: stepCount, longStepFactor: 0, longStepCount: 0 }, notes };
  }
  // The delay is far shorter than the step the dynamics need: steps of T until the
  // breakpoint non-smoothness has died out, then steps of p·T.
  const neutralIntervals =
    highFrequencyLoopGain > 0 && highFrequencyLoopGain < 1 ? Math.ceil(Math.log(NEUTRAL_JUMP_DECAY) / Math.log(highFrequencyLoopGain)) : 0;
  const alignedStepCount = Math.min(Math.max(SMOOTHING_INTERVALS, neutralIntervals), Math.floor(MAX_STEPS / 2));
  const remaining = Math.max(0, duration - alignedStepCount * delay);
  let factor = Math.max(2, Math.floor(target / delay));
  if (remaining / (factor * delay) > MAX_STEPS - alignedStepCount) {
    factor = Math.ceil(remaining / (delay * (MAX_STEPS - alignedStepCount)));
    notes.push(`stiff loop: step ${factor * delay} s is ${(factor * delay * rate).toPrecision(3)}/|λ|max (target ${TARGET_RATE_STEP}); accuracy is reduced`);
  }
  const longStepCount = Math.ceil(remaining / (factor * delay) - 1e-9);
  notes.push(
    `the delay is much shorter than the dynamics: ${alignedStepCount} steps of T, then steps of ${factor}·T with the in-step part of the delayed input solved implicitly`,
  );
  if (requestedDuration === null) duration = alignedStepCount * delay + longStepCount * factor * delay;
  return {
    duration,
    stepLength: longStepCount > 0 ? factor * delay : delay,
    stepCount: alignedStepCount + longStepCount,
    delayed: { delaySteps: 1, alignedStepCount, longStepFactor: factor, longStepCount },
    notes,
  };
}
