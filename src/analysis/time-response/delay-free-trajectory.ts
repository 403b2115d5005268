import { type Matrix, multiplyMatrixVector, zeroMatrix } from './dense-matrix.js';
import type { LoopEquations } from './loop-equations.js';
import { exponentialAction } from './exponential-action.js';
import { matrixExponential } from './matrix-exponential.js';
import { uniformStepStarts, type SampledTrajectory, type TrajectoryPoint } from './sampled-trajectory.js';

/**
 * Response of the loop without delay to a setpoint step of size r and a
 * load-disturbance step of size d, both applied at t = 0, from rest.
 *
 * Method: the closed loop is linear time-invariant with constant inputs, so
 * the augmented state ξ = [x; ∫y; r; d] obeys ξ' = M ξ and is propagated
 * exactly by ξ(t + τ) = e^{Mτ} ξ(t) (C. Moler, C. Van Loan, "Nineteen dubious
 * ways to compute the exponential of a matrix, twenty-five years later",
 * SIAM Review 45, 2003, for the augmented-input idea; the exponential by
 * Higham's scaling and squaring). There is no discretisation error; the steps
 * only set where the response is sampled for the searches.
 */
export function simulateDelayFreeLoop(
  loop: LoopEquations,
  setpoint: number,
  disturbance: number,
  stepLength: number,
  stepCount: number,
  nodes: readonly number[],
): SampledTrajectory {
  const n = loop.order;
  const dc = loop.controllerFeedthrough;
  const dp = loop.plantFeedthrough;
  const denom = 1 + dc * dp;
  if (denom === 0) throw new Error('simulateDelayFreeLoop: loop is not well posed (1 + C(∞)P(∞) = 0)');
  // w = Kw x + wr r + wd d
  const kw = loop.k.map((v) => v / denom);
  const wr = dc / denom;
  const wd = 1 / denom;
  const size = n + 3;
  const iIndex = n;
  const rIndex = n + 1;
  const dIndex = n + 2;
  const m: Matrix = zeroMatrix(size, size);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) m[i][j] = loop.f[i][j] + loop.g[i] * kw[j];
    m[i][rIndex] = loop.g[i] * wr + loop.h[i];
    m[i][dIndex] = loop.g[i] * wd;
  }
  for (let j = 0; j < n; j++) m[iIndex][j] = loop.cy[j] + dp * kw[j];
  m[iIndex][rIndex] = dp * wr;
  m[iIndex][dIndex] = dp * wd;

  const scaled = (tau: number): Matrix => m.map((row) => row.map((v) => v * tau));
  const nodePropagators = nodes.map((sigma) => matrixExponential(scaled(sigma * stepLength)));
  const q = nodes.length;
  const states = new Float64Array((stepCount + 1) * size);
  const nodeOutput = new Float64Array(stepCount * q);
  let xi = new Array<number>(size).fill(0);
  xi[rIndex] = setpoint;
  xi[dIndex] = disturbance;
  const outputOf = (state: ArrayLike<number>): number => {
    let w = wr * state[rIndex] + wd * state[dIndex];
    let y = 0;
    for (let j = 0; j < n; j++) {
      w += kw[j] * state[j];
      y += loop.cy[j] * state[j];
    }
    return y + dp * w;
  };
  for (let k = 0; k < stepCount; k++) {
    states.set(xi, k * size);
    for (let j = 0; j < q; j++) {
      const at = j === 0 ? xi : multiplyMatrixVector(nodePropagators[j], xi);
      nodeOutput[k * q + j] = outputOf(at);
      if (j === q - 1) xi = at;
    }
  }
  states.set(xi, stepCount * size);

  const evaluate = (step: number, sigma: number): TrajectoryPoint => {
    const start = states.subarray(step * size, (step + 1) * size);
    const state = exponentialAction(m, sigma * stepLength, Array.from(start));
    const rate = multiplyMatrixVector(m, state);
    let w = wr * state[rIndex] + wd * state[dIndex];
    let wRate = 0;
    let y = 0;
    let yRate = 0;
    for (let j = 0; j < n; j++) {
      w += kw[j] * state[j];
      wRate += kw[j] * rate[j];
      y += loop.cy[j] * state[j];
      yRate += loop.cy[j] * rate[j];
    }
    return {
      output: y + dp * w,
      control: w - state[dIndex],
      outputRate: yRate + dp * wRate,
      outputIntegral: state[iIndex],
    };
  };
  return { stepCount, stepStarts: uniformStepStarts(stepLength, stepCount), nodes, nodeOutput, evaluate };
}
