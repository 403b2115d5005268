/** A rational transfer function, coefficients in descending powers of s. */
export interface RationalTransferFunction {
  numerator: number[];
  denominator: number[];
}

export interface ClosedLoopSimulationInput {
  /** P(s) = numerator/denominator · e^{−s·delay}; proper; delay in seconds (≥ 0) */
  plant: RationalTransferFunction & { delay: number };
  /** C(s) = numerator/denominator, proper (e.g. a PID with derivative filter as one rational) */
  controller: RationalTransferFunction;
  /** simulated span in seconds; default: about five settling times of the slowest closed-loop root */
  duration?: number;
  /** number of equally spaced output samples including t = 0 and t = duration; default 1000 */
  points?: number;
}

export interface SetpointStepResponse {
  /** plant output y(t) for a unit setpoint step at t = 0 */
  output: number[];
  /** controller output u(t) */
  control: number[];
  /** exact closed-loop DC gain T(0); null when the loop is not stable */
  finalValue: number | null;
  overshootPercent: number | null;
  peakTime: number | null;
  riseTime: number | null;
  settlingTime: number | null;
  /** 1 − T(0) */
  steadyStateError: number | null;
}

export interface LoadDisturbanceResponse {
  /** plant output y(t) for a unit step added to the plant input at t = 0 (setpoint 0) */
  output: number[];
  /** controller output u(t) */
  control: number[];
  /** exact final output P(0)/(1 + L(0)); null when the loop is not stable */
  finalValue: number | null;
  /** max |y| over the horizon */
  peakDeviation: number | null;
  peakDeviationTime: number | null;
  /** ∫ |y| dt over the horizon */
  iae: number | null;
  /** ∫ e dt over the horizon with e = −y the control error */
  ie: number | null;
}

export interface ClosedLoopTimeResponses {
  stable: boolean;
  stability: {
    method: string;
    unstableRootCount: number | null;
    /** why the loop is not stable; null when it is */
    reason: string | null;
  };
  /** sample times in seconds, shared by both responses */
  time: number[];
  duration: number;
  /** internal step of the simulation in seconds */
  internalStep: number;
  /** the numerical method, in words */
  method: string;
  setpointStep: SetpointStepResponse;
  loadDisturbance: LoadDisturbanceResponse;
  notes: string[];
}
