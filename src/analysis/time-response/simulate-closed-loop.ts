import { assessClosedLoopStability } from './closed-loop-stability.js';
import { closedLoopDcGains } from './closed-loop-dc-gains.js';
import { simulateDelayFreeLoop } from './delay-free-trajectory.js';
import { simulateDelayedLoop } from './delayed-trajectory.js';
import { assembleLoopEquations, type LoopEquations } from './loop-equations.js';
import { estimateLoopTimeScales } from './loop-time-scales.js';
import { normaliseLoopInput } from './normalise-loop-input.js';
import { measureRegulationResponse, measureStepResponse } from './response-metrics.js';
import { evaluateAtTime, type SampledTrajectory } from './sampled-trajectory.js';
import { planSimulationGrid, type SimulationGrid } from './simulation-grid.js';
import { realiseTransferFunction } from './state-space-realisation.js';
import { createStepInterpolation } from './step-interpolation.js';
import { TimeResponseInputError } from './time-response-input-error.js';
import type { ClosedLoopSimulationInput, ClosedLoopTimeResponses } from './types.js';

/** Interpolation nodes per step for the delayed input (polynomial degree 7). */
const NODES_PER_STEP = 8;

const METHOD_DELAY_FREE =
  'exact propagation of the closed-loop state space by the matrix exponential (Higham 2005 scaling and squaring)';
const METHOD_DELAYED =
  'method of steps (Bellen & Zennaro 2003) on a grid dividing the delay; delayed input interpolated by a degree-7 polynomial per step at Chebyshev–Lobatto nodes, states propagated exactly for it by the exponential of an augmented matrix (Van Loan 1978); a delay far shorter than the dynamics gets steps of T, then steps of p·T with the in-step delayed input solved implicitly';

/**
 * Closed-loop time responses of the unity-feedback loop with plant
 * P(s) = Np/Dp·e^{−sT} and controller C(s) = Nc/Dc: the response to a unit
 * setpoint step (with overshoot, peak time, 10–90 % rise time, 2 % settling
 * time and steady-state error from the exact DC gain T(0) = L(0)/(1 + L(0)))
 * and to a unit load step added at the plant input (peak deviation, IAE, IE).
 *
 * Both transfer functions are realised in balanced controllable canonical
 * form. Without delay the loop is propagated exactly by the matrix
 * exponential; with a delay, by the method of steps with exact propagation
 * for a polynomial interpolant of the delayed input on each step (see
 * simulateDelayedLoop; measured error 1e−11 to 1e−13 against closed forms and
 * a scipy method-of-steps reference in the tests). Stability comes first (closed-loop eigenvalues
 * without delay, a Nyquist winding count with delay); an unstable loop still
 * gets its responses but no figures, and `stability.reason` says why.
 *
 * Example:
 *   simulateClosedLoop({ plant: { numerator: [1], denominator: [1, 1, 0], delay: 0 },
 *                        controller: { numerator: [1], denominator: [1] } })
 *   → setpointStep.overshootPercent ≈ 16.3 (ζ = 0.5, ωn = 1).
 */
export function simulateClosedLoop(input: ClosedLoopSimulationInput): ClosedLoopTimeResponses {
  const loopInput = normaliseLoopInput(input);
  const { plant, controller, delay, points } = loopInput;
  const loop = assembleLoopEquations(
    realiseTransferFunction(plant.numerator, plant.denominator),
    realiseTransferFunction(controller.numerator, controller.denominator),
  );
  if (delay === 0 && 1 + loop.controllerFeedthrough * loop.plantFeedthrough === 0) {
    throw new TimeResponseInputError(
      'LOOP_NOT_WELL_POSED',
      'controller',
      '1 + C(∞)·P(∞) = 0: the loop without delay has no solution (the algebraic loop is singular)',
    );
  }
  const stability = assessClosedLoopStability(loop, plant, controller, delay);
  const scales = estimateLoopTimeScales(loop, plant, controller, delay, stability.delayFreeRoots);
  const grid = planSimulationGrid(
    scales,
    delay,
    stability.stable,
    loopInput.duration,
    Math.abs(loop.controllerFeedthrough * loop.plantFeedthrough),
  );
  const notes = [...grid.notes];

  const simulate = (setpoint: number, disturbance: number): SampledTrajectory =>
    runSimulation(loop, grid, delay, setpoint, disturbance);
  const setpointRun = simulate(1, 0);
  const disturbanceRun = simulate(0, 1);

  const time = Array.from({ length: points }, (_, i) => (i === points - 1 ? grid.duration : (grid.duration * i) / (points - 1)));
  const series = (run: SampledTrajectory) => {
    const output: number[] = [];
    const control: number[] = [];
    for (const t of time) {
      const p = evaluateAtTime(run, t);
      output.push(p.output);
      control.push(p.control);
    }
    return { output, control };
  };
  const setpointSeries = series(setpointRun);
  const disturbanceSeries = series(disturbanceRun);

  const base = {
    stable: stability.stable,
    stability: { method: stability.method, unstableRootCount: stability.unstableRootCount, reason: stability.reason },
    time,
    duration: grid.duration,
    internalStep: grid.stepLength,
    method: delay === 0 ? METHOD_DELAY_FREE : METHOD_DELAYED,
  };
  if (!stability.stable) {
    notes.push(`no response figures: the closed loop is not stable (${stability.reason})`);
    if ([setpointSeries, disturbanceSeries].some((s) => s.output.some((v) => !Number.isFinite(v)))) {
      notes.push('the unstable response overflows within the horizon: later samples are not finite');
    }
    return {
      ...base,
      setpointStep: {
        ...setpointSeries,
        finalValue: null,
        overshootPercent: null,
        peakTime: null,
        riseTime: null,
        settlingTime: null,
        steadyStateError: null,
      },
      loadDisturbance: {
        ...disturbanceSeries,
        finalValue: null,
        peakDeviation: null,
        peakDeviationTime: null,
        iae: null,
        ie: null,
      },
      notes,
    };
  }
  const gains = closedLoopDcGains(plant, controller);
  const step = measureStepResponse(setpointRun, gains.setpoint, grid.duration);
  notes.push(...step.notes.map((n) => `setpoint step: ${n}`));
  const regulation = measureRegulationResponse(disturbanceRun, grid.duration);
  return {
    ...base,
    setpointStep: {
      ...setpointSeries,
      finalValue: gains.setpoint,
      overshootPercent: step.overshootPercent,
      peakTime: step.peakTime,
      riseTime: step.riseTime,
      settlingTime: step.settlingTime,
      steadyStateError: 1 - gains.setpoint,
    },
    loadDisturbance: {
      ...disturbanceSeries,
      finalValue: gains.disturbance,
      ...regulation,
    },
    notes,
  };
}

function runSimulation(
  loop: LoopEquations,
  grid: SimulationGrid,
  delay: number,
  setpoint: number,
  disturbance: number,
): SampledTrajectory {
  const interp = createStepInterpolation(NODES_PER_STEP);
  if (delay === 0) {
    return simulateDelayFreeLoop(loop, setpoint, disturbance, grid.stepLength, grid.stepCount, interp.nodes);
  }
  return simulateDelayedLoop(loop, delay, grid.delayed!, setpoint, disturbance, interp);
}
