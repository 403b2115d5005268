import { type Matrix, solveLinearSystem, zeroMatrix } from './dense-matrix.js';
import type { LoopEquations } from './loop-equations.js';
import { exponentialAction } from './exponential-action.js';
import { matrixExponential } from './matrix-exponential.js';
import { type SampledTrajectory, type TrajectoryPoint } from './sampled-trajectory.js';
import { evaluateWithDerivative, monomialCoefficients, type StepInterpolation } from './step-interpolation.js';

/**
 * Steps of the delayed simulation: first `alignedStepCount` steps of T/m
 * (m = delaySteps), then `longStepCount` steps of p·T (p = longStepFactor ≥ 2,
 * only used when the delay is too short for the step budget).
 */
export interface DelayedStepPlan {
  delaySteps: number;
  alignedStepCount: number;
  longStepFactor: number;
  longStepCount: number;
}

/**
 * Response of the loop with input delay T to a setpoint step r and a
 * load-disturbance step d at the plant input, both at t = 0, from rest
 * (zero history).
 *
 * Method: the method of steps for delay differential equations (A. Bellen,
 * M. Zennaro, Numerical Methods for Delay Differential Equations, Oxford
 * 2003, ch. 3). On each step the delayed input w(t) = u(t − T) + d(t − T) is
 * represented by its interpolating polynomial through q Chebyshev–Lobatto
 * nodes, and the loop's states are propagated *exactly* for that polynomial
 * input by the exponential of an augmented matrix (C. F. Van Loan,
 * "Computing integrals involving the matrix exponential", IEEE Trans. Autom.
 * Control 23(3), 1978; the derivatives of the input polynomial are carried
 * as extra states). The only approximation is the polynomial interpolation
 * of w within a step, of order h^q; stiff modes are handled exactly by the
 * exponential.
 *
 * Aligned steps h = T/m: every breakpoint t = iT of the solution is a grid
 * point and the delayed input at a node is the stored controller output at
 * the same node m steps earlier — explicit and exact in the history.
 * Long steps h = pT (for delays far shorter than the dynamics, after enough
 * aligned steps for the breakpoint non-smoothness to have died out): part of
 * the delayed input falls in the current step, so the node values of u on
 * the step solve a q×q linear system (the collocation form of the step,
 * Bellen & Zennaro ch. 6 on overlapping), factorised once. The input must be
 * a pure delay: T > 0.
 */
export function simulateDelayedLoop(
  loop: LoopEquations,
  delay: number,
  plan: DelayedStepPlan,
  setpoint: number,
  disturbance: number,
  interp: StepInterpolation,
): SampledTrajectory {
  const n = loop.order;
  const q = interp.nodeCount;
  const dc = loop.controllerFeedthrough;
  const dp = loop.plantFeedthrough;
  const m = plan.delaySteps;
  const alignedLength = delay / m;
  const longLength = plan.longStepFactor * delay;
  const stepCount = plan.alignedStepCount + plan.longStepCount;

  const stepStarts = new Float64Array(stepCount + 1);
  for (let k = 0; k <= plan.alignedStepCount; k++) stepStarts[k] = k * alignedLength;
  const longStart = plan.alignedStepCount * alignedLength;
  for (let k = 1; k <= plan.longStepCount; k++) stepStarts[plan.alignedStepCount + k] = longStart + k * longLength;

  const zSize = n + 1;
  const cols = zSize + q + 1;
  const aligned = stepPropagation(loop, alignedLength, interp);
  const long = plan.longStepCount > 0 ? stepPropagation(loop, longLength, interp) : aligned;

  const states = new Float64Array((stepCount + 1) * zSize);
  const controlNodes = new Float64Array(stepCount * q);
  const inputNodes = new Float64Array(stepCount * q);
  const nodeOutput = new Float64Array(stepCount * q);
  const work = new Float64Array(cols);

  /** u at time τ from an already computed step (its node interpolant). */
  const controlAt = (tau: number, before: number): number => {
    let lo = 0;
    let hi = before - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (stepStarts[mid] <= tau) lo = mid;
      else hi = mid - 1;
    }
    const a = stepStarts[lo];
    const sigma = Math.min(1, Math.max(0, (tau - a) / (stepStarts[lo + 1] - a)));
    return evaluateWithDerivative(monomialCoefficients(interp, controlNodes, lo * q), sigma)[0];
  };

  // Long steps: node j's delayed time lies in the current step at σ_j − 1/p when σ_j ≥ 1/p.
  const shift = plan.longStepFactor > 0 ? 1 / plan.longStepFactor : 0;
  const inCurrent = interp.nodes.map((s) => plan.longStepCount > 0 && s >= shift);
  const currentEvaluation: Matrix = interp.nodes.map((s, j) => {
    const row = new Array<number>(q).fill(0);
    if (!inCurrent[j]) return row;
    const x = s - shift;
    for (let l = 0; l < q; l++) {
      let v = 0;
      for (let i = q - 1; i >= 0; i--) v = v * x + interp.monomialFromValues[i][l];
      row[l] = v;
    }
    return row;
  });
  // (I − Q A) with Q_jl = ∂u_j/∂w_l on a long step, A the in-step evaluation above.
  const coupling: Matrix = zeroMatrix(q, q);
  for (let j = 0; j < q; j++) {
    for (let l = 0; l < q; l++) {
      let s = 0;
      for (let i = 0; i < q; i++) s += (long.uRows[j][zSize + i] - (i === j ? dc * dp : 0)) * currentEvaluation[i][l];
      coupling[j][l] = (j === l ? 1 : 0) - s;
    }
  }
  const identity = zeroMatrix(q, q).map((row, i) => row.map((_, j) => (i === j ? 1 : 0)));
  const couplingInverse = plan.longStepCount > 0 ? solveLinearSystem(coupling, identity) : identity;

  for (let k = 0; k < stepCount; k++) {
    const isLong = k >= plan.alignedStepCount;
    const prop = isLong ? long : aligned;
    const base = k * zSize;
    for (let i = 0; i < zSize; i++) work[i] = states[base + i];
    work[zSize + q] = setpoint;
    if (!isLong) {
      const source = k - m;
      if (source >= 0) for (let j = 0; j < q; j++) inputNodes[k * q + j] = controlNodes[source * q + j] + disturbance;
    } else {
      // Known part of w (delayed times before this step), then solve for u on the step.
      const known = new Array<number>(q).fill(0);
      for (let j = 0; j < q; j++) {
        known[j] = disturbance + (inCurrent[j] ? 0 : controlAt(stepStarts[k] + interp.nodes[j] * longLength - delay, k));
      }
      const rhs = new Array<number>(q).fill(0);
      for (let j = 0; j < q; j++) {
        const row = prop.uRows[j];
        let s = (row[zSize + q] + dc) * setpoint;
        for (let i = 0; i < zSize; i++) s += row[i] * work[i];
        for (let l = 0; l < q; l++) s += (row[zSize + l] - (l === j ? dc * dp : 0)) * known[l];
        rhs[j] = s;
      }
      const u = couplingInverse.map((row) => row.reduce((acc, v, l) => acc + v * rhs[l], 0));
      for (let j = 0; j < q; j++) {
        let w = known[j];
        for (let l = 0; l < q; l++) w += currentEvaluation[j][l] * u[l];
        inputNodes[k * q + j] = w;
      }
    }
    for (let l = 0; l < q; l++) work[zSize + l] = inputNodes[k * q + l];
    advanceStep(prop, work, k, zSize, q, cols, dc * setpoint, dc * dp, dp, inputNodes, nodeOutput, controlNodes, states);
  }

  const evaluate = (step: number, sigma: number): TrajectoryPoint => {
    const prop = step >= plan.alignedStepCount ? long : aligned;
    const w = inputNodes.subarray(step * q, (step + 1) * q);
    const xi = new Array<number>(prop.size).fill(0);
    for (let i = 0; i < zSize; i++) xi[i] = states[step * zSize + i];
    for (let i = 0; i < q; i++) {
      let s = 0;
      for (let l = 0; l < q; l++) s += prop.etaFromValues[i][l] * w[l];
      xi[zSize + i] = s;
    }
    xi[zSize + q] = setpoint;
    const z = exponentialAction(prop.m, sigma, xi);
    const [wValue, wSlope] = evaluateWithDerivative(monomialCoefficients(interp, w), sigma);
    let y = 0;
    let u = 0;
    let yRate = 0;
    for (let i = 0; i < n; i++) {
      y += loop.cy[i] * z[i];
      u += loop.k[i] * z[i];
      if (loop.cy[i] === 0) continue;
      // dy/dt = Cy (F x + G w + H r) + Dp dw/dt
      let xRate = loop.g[i] * wValue + loop.h[i] * setpoint;
      for (let j = 0; j < n; j++) xRate += loop.f[i][j] * z[j];
      yRate += loop.cy[i] * xRate;
    }
    return {
      output: y + dp * wValue,
      control: u + dc * setpoint - dc * dp * wValue,
      outputRate: yRate + (dp * wSlope) / prop.length,
      outputIntegral: z[n],
    };
  };
  return { stepCount, stepStarts, nodes: interp.nodes, nodeOutput, evaluate };
}

/**
 * Node outputs, node controls and the next state of step k from work = [z_k; W; r]
 * (kept apart and on flat typed arrays so the engine compiles one tight loop).
 */
function advanceStep(
  prop: StepPropagation,
  work: Float64Array,
  k: number,
  zSize: number,
  q: number,
  cols: number,
  controlOffset: number,
  directGain: number,
  dp: number,
  inputNodes: Float64Array,
  nodeOutput: Float64Array,
  controlNodes: Float64Array,
  states: Float64Array,
): void {
  const yRows = prop.yRowsFlat;
  const uRows = prop.uRowsFlat;
  for (let j = 0; j < q; j++) {
    const offset = j * cols;
    let y = 0;
    let u = 0;
    for (let c = 0; c < cols; c++) {
      const v = work[c];
      y += yRows[offset + c] * v;
      u += uRows[offset + c] * v;
    }
    const wj = inputNodes[k * q + j];
    nodeOutput[k * q + j] = y + dp * wj;
    controlNodes[k * q + j] = u + controlOffset - directGain * wj;
  }
  const last = prop.lastMap;
  const next = (k + 1) * zSize;
  for (let i = 0; i < zSize; i++) {
    let s = 0;
    const row = i * cols;
    for (let c = 0; c < cols; c++) s += last[row + c] * work[c];
    states[next + i] = s;
  }
}

interface StepPropagation {
  length: number;
  size: number;
  /** augmented matrix in normalised step time */
  m: Matrix;
  etaFromValues: number[][];
  /** rows giving y − Dp·w and u − Dc·r + Dc·Dp·w at node j from [z; W; r] */
  yRows: Float64Array[];
  uRows: Float64Array[];
  yRowsFlat: Float64Array;
  uRowsFlat: Float64Array;
  /** map [z; W; r] → z at the end of the step, row-major zSize × cols */
  lastMap: Float64Array;
}

/**
 * Precomputed exact propagation over one step of length h for a polynomial
 * input. Augmented state ξ = [x (n); ∫y (1); η_0..η_{q−1}; r] in normalised
 * time σ = τ/h with η_i = d^i w/dσ^i (η_0 = w, the chain ends in a constant).
 */
function stepPropagation(loop: LoopEquations, h: number, interp: StepInterpolation): StepPropagation {
  const n = loop.order;
  const q = interp.nodeCount;
  const dp = loop.plantFeedthrough;
  const zSize = n + 1;
  const etaStart = n + 1;
  const rIndex = n + 1 + q;
  const size = n + q + 2;
  const m: Matrix = zeroMatrix(size, size);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) m[i][j] = h * loop.f[i][j];
    m[i][etaStart] = h * loop.g[i];
    m[i][rIndex] = h * loop.h[i];
  }
  for (let j = 0; j < n; j++) m[n][j] = h * loop.cy[j];
  m[n][etaStart] = h * dp;
  for (let i = 0; i < q - 1; i++) m[etaStart + i][etaStart + i + 1] = 1;

  // η_i(0) = i!·a_i, a = monomial coefficients of the node interpolant.
  const factorial = [1];
  for (let i = 1; i < q; i++) factorial.push(factorial[i - 1] * i);
  const etaFromValues = interp.monomialFromValues.map((row, i) => row.map((v) => v * factorial[i]));

  const cols = zSize + q + 1;
  const reducedMap = (e: Matrix): Float64Array => {
    const out = new Float64Array(zSize * cols);
    for (let i = 0; i < zSize; i++) {
      for (let j = 0; j < zSize; j++) out[i * cols + j] = e[i][j];
      for (let l = 0; l < q; l++) {
        let s = 0;
        for (let i2 = 0; i2 < q; i2++) s += e[i][etaStart + i2] * etaFromValues[i2][l];
        out[i * cols + zSize + l] = s;
      }
      out[i * cols + zSize + q] = e[i][rIndex];
    }
    return out;
  };
  const nodeMaps = interp.nodes.map((sigma) => reducedMap(matrixExponential(m.map((row) => row.map((v) => v * sigma)))));
  const rowCombination = (map: Float64Array, weights: readonly number[]): Float64Array => {
    const out = new Float64Array(cols);
    for (let i = 0; i < n; i++) {
      const wgt = weights[i];
      if (wgt === 0) continue;
      for (let j = 0; j < cols; j++) out[j] += wgt * map[i * cols + j];
    }
    return out;
  };
  const yRows = nodeMaps.map((map) => rowCombination(map, loop.cy));
  const uRows = nodeMaps.map((map) => rowCombination(map, loop.k));
  const flatten = (rows: Float64Array[]): Float64Array => {
    const out = new Float64Array(rows.length * cols);
    rows.forEach((row, j) => out.set(row, j * cols));
    return out;
  };
  return {
    length: h,
    size,
    m,
    etaFromValues,
    yRows,
    uRows,
    yRowsFlat: flatten(yRows),
    uRowsFlat: flatten(uRows),
    lastMap: nodeMaps[q - 1],
  };
}
