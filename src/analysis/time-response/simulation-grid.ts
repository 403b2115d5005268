import type { LoopTimeScales } from './loop-time-scales.js';
import { TimeResponseInputError } from './time-response-input-error.js';

/** Upper bound on simulation steps (memory: all step states are kept for refinement). */
export const MAX_STEPS = 200_000;
/**
 * Target |λ|·h for the fastest mode: with 8 interpolation nodes the
 * in-step interpolation error of e^{λt} is about (|λ|h/2)^8/(8!·2^7) ≈ 3e−12.
 */
const TARGET_RATE_STEP = 0.5;
/** Steps may grow to this multiple of the target before the horizon is cut instead. */
const MAX_STEP_STRETCH = 2;

export interface SimulationGrid {
  duration: number;
  stepLength: number;
  stepCount: number;
  /** delay = delaySteps · stepLength exactly (0 without delay) */
  delaySteps: number;
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
 * a whole m so the delay is an exact number of steps.
 */
export function planSimulationGrid(
  scales: LoopTimeScales,
  delay: number,
  stable: boolean,
  requestedDuration: number | null,
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
    return { duration, stepLength: duration / stepCount, stepCount, delaySteps: 0, notes };
  }

  let delaySteps = Math.max(1, Math.ceil(delay / target));
  let stepLength = delay / delaySteps;
  let stepCount = Math.ceil(duration / stepLength - 1e-9);
  if (stepCount > MAX_STEPS) {
    delaySteps = Math.floor((delay * MAX_STEPS) / duration);
    if (delaySteps < 1) {
      throw new TimeResponseInputError(
        'DELAY_TOO_SHORT_FOR_HORIZON',
        'plant.delay',
        `the delay ${delay} s is shorter than duration/${MAX_STEPS} (${duration / MAX_STEPS} s): the simulation grid cannot hold it as a whole number of steps; choose a shorter duration`,
      );
    }
    stepLength = delay / delaySteps;
    stepCount = Math.ceil(duration / stepLength - 1e-9);
    notes.push(
      `stiff loop: step ${stepLength} s is ${(stepLength * rate).toPrecision(3)}/|λ|max (target ${TARGET_RATE_STEP}); accuracy is reduced`,
    );
  }
  if (requestedDuration === null) duration = stepCount * stepLength;
  return { duration, stepLength, stepCount, delaySteps, notes };
}
