import { evaluateAtTime, type SampledTrajectory, type TrajectoryPoint } from './sampled-trajectory.js';
import {
  locateSignChange,
  pointAtSample,
  refineMaximum,
  samplesWithinHorizon,
} from './trajectory-search.js';

/** Fractions of the final value between which the rise time is measured (10–90 %, common practice). */
const RISE_LOW = 0.1;
const RISE_HIGH = 0.9;
/** Settling band: ±2 % of the final value (common practice; Ogata, Modern Control Engineering, §5-3). */
const SETTLING_BAND = 0.02;

export interface StepMetrics {
  overshootPercent: number | null;
  peakTime: number | null;
  riseTime: number | null;
  settlingTime: number | null;
  notes: string[];
}

/**
 * Step-response figures relative to the exact final value y∞ (Ogata,
 * Modern Control Engineering, 5th ed., §5-3): maximum overshoot
 * 100·(y_max − y∞)/|y∞| (0 if the response never exceeds y∞), the time of
 * that maximum (null without overshoot), the 10–90 % rise time between the
 * first crossings of 0.1·y∞ and 0.9·y∞, and the settling time after which
 * |y − y∞| ≤ 0.02·|y∞| up to the horizon. Crossings and the peak are
 * located on the node samples and refined by bisection on the exact
 * in-step evaluation. A response whose final value is 0 has none of them.
 */
export function measureStepResponse(trajectory: SampledTrajectory, finalValue: number, horizon: number): StepMetrics {
  const notes: string[] = [];
  if (finalValue === 0 || !Number.isFinite(finalValue)) {
    notes.push('the final value is 0: overshoot, rise time and settling time relative to it are not defined');
    return { overshootPercent: null, peakTime: null, riseTime: null, settlingTime: null, notes };
  }
  const sign = finalValue > 0 ? 1 : -1;
  const target = Math.abs(finalValue);
  const y = trajectory.nodeOutput;
  const count = samplesWithinHorizon(trajectory, horizon);

  let peakIndex = 0;
  for (let i = 1; i < count; i++) if (sign * y[i] > sign * y[peakIndex]) peakIndex = i;
  let overshootPercent = 0;
  let peakTime: number | null = null;
  if (sign * y[peakIndex] > target) {
    const peak = refineMaximum(trajectory, peakIndex, count, sign);
    overshootPercent = (100 * (sign * peak.point.output - target)) / target;
    peakTime = peak.time;
    if (peakIndex >= count - 1) notes.push('the largest output is at the end of the horizon: overshoot and peak time may be larger');
  }

  const firstCrossing = (level: number): number | null => {
    const above = (p: TrajectoryPoint): number => sign * p.output - level;
    if (sign * y[0] >= level) return 0;
    for (let i = 1; i < count; i++) {
      if (sign * y[i] >= level) return locateSignChange(trajectory, i - 1, above).time;
    }
    return null;
  };
  const t10 = firstCrossing(RISE_LOW * target);
  const t90 = firstCrossing(RISE_HIGH * target);
  const riseTime = t10 !== null && t90 !== null ? t90 - t10 : null;
  if (riseTime === null) notes.push('the output does not reach 90 % of its final value within the horizon');

  const band = SETTLING_BAND * target;
  const outside = (p: TrajectoryPoint): number => Math.abs(p.output - finalValue) - band;
  const endOutside = outside(evaluateAtTime(trajectory, horizon)) > 0;
  let settlingTime: number | null = null;
  if (endOutside) {
    notes.push('the output is not within 2 % of its final value at the end of the horizon');
  } else {
    let last = -1;
    for (let i = count - 1; i >= 0; i--) {
      if (Math.abs(y[i] - finalValue) > band) {
        last = i;
        break;
      }
    }
    settlingTime = last < 0 ? 0 : last + 1 < count ? locateSignChange(trajectory, last, outside).time : null;
    if (settlingTime !== null && settlingTime > 0.8 * horizon) {
      notes.push('the output settles late in the horizon: a longer duration would confirm the settling time');
    }
  }
  return { overshootPercent, peakTime, riseTime, settlingTime, notes };
}

export interface DeviationMetrics {
  peakDeviation: number;
  peakDeviationTime: number;
  iae: number;
  ie: number;
}

/**
 * Figures of a regulation response (setpoint 0, error e = −y): the largest
 * |y| (refined like the step peak), IAE = ∫₀^{t_end} |y| dt and
 * IE = ∫₀^{t_end} e dt = −∫ y dt. ∫ y dt is carried by the simulation as an
 * extra state, so IE is exact to the method's accuracy, and IAE sums |∫ y|
 * over the intervals between sign changes of y (located by bisection) —
 * more accurate than a trapezoidal rule on the samples, and the
 * Åström–Hägglund identity IE = −Ti/Kc for a unit load step under PI
 * control can be checked directly (K. J. Åström, T. Hägglund, Advanced PID
 * Control, ISA 2006, §4.4 (from memory)).
 */
export function measureRegulationResponse(trajectory: SampledTrajectory, horizon: number): DeviationMetrics {
  const y = trajectory.nodeOutput;
  const count = samplesWithinHorizon(trajectory, horizon);
  let peakIndex = 0;
  for (let i = 1; i < count; i++) if (Math.abs(y[i]) > Math.abs(y[peakIndex])) peakIndex = i;
  const sign = y[peakIndex] >= 0 ? 1 : -1;
  const peak = refineMaximum(trajectory, peakIndex, count, sign);

  const signed = (p: TrajectoryPoint): number => p.output;
  let iae = 0;
  let segmentStart = pointAtSample(trajectory, 0).outputIntegral;
  for (let i = 0; i + 1 < count; i++) {
    if (y[i] === 0 || y[i + 1] === 0 || y[i] > 0 === y[i + 1] > 0) continue;
    const crossing = locateSignChange(trajectory, i, signed);
    iae += Math.abs(crossing.point.outputIntegral - segmentStart);
    segmentStart = crossing.point.outputIntegral;
  }
  const end = evaluateAtTime(trajectory, horizon).outputIntegral;
  iae += Math.abs(end - segmentStart);
  return { peakDeviation: Math.abs(peak.point.output), peakDeviationTime: peak.time, iae, ie: -end };
}
