import { type Matrix, zeroMatrix } from './dense-matrix.js';
import type { LoopEquations } from './loop-equations.js';
import { matrixExponential } from './matrix-exponential.js';
import type { SampledTrajectory, TrajectoryPoint } from './sampled-trajectory.js';
import { evaluateWithDerivative, monomialCoefficients, type StepInterpolation } from './step-interpolation.js';

/**
 * Response of the loop with input delay T = m·h to a setpoint step r and a
 * load-disturbance step d at the plant input, both at t = 0, from rest
 * (zero history).
 *
 * Method: the method of steps for delay differential equations (A. Bellen,
 * M. Zennaro, Numerical Methods for Delay Differential Equations, Oxford
 * 2003, ch. 3) on a grid whose step h divides the delay exactly, so every
 * breakpoint t = iT of the solution is a grid point and the delayed input
 * on step k is the already computed controller output of step k − m. On
 * each step the delayed input w(t) = u(t − T) + d(t − T) is represented by
 * its interpolating polynomial through q Chebyshev–Lobatto nodes (values
 * taken exactly from the stored history at the same nodes), and the loop's
 * states are propagated *exactly* for that polynomial input by the
 * exponential of an augmented matrix (C. F. Van Loan, "Computing integrals
 * involving the matrix exponential", IEEE Trans. Autom. Control 23(3), 1978;
 * the chain of derivatives of the input polynomial is carried as extra
 * states). The only approximation is the polynomial interpolation of w
 * within a step, of order h^q; stiff plant or controller modes are handled
 * exactly by the exponential. The input must be a pure delay: T > 0.
 */
export function simulateDelayedLoop(
  loop: LoopEquations,
  delaySteps: number,
  setpoint: number,
  disturbance: number,
  stepLength: number,
  stepCount: number,
  interp: StepInterpolation,
): SampledTrajectory {
  const n = loop.order;
  const q = interp.nodeCount;
  const dc = loop.controllerFeedthrough;
  const dp = loop.plantFeedthrough;
  const h = stepLength;
  // Augmented state ξ = [x (n); ∫y (1); η_0..η_{q−1}; r] in normalised step time σ = τ/h,
  // with η_i = d^i w/dσ^i, so η_0 = w and the chain ends with a constant.
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

  // For each node σ_j: z(σ_j) = Φ_j z_k + Γ_j W + ψ_j r, rows of [Φ_j | Γ_j | ψ_j] (zSize × (zSize + q + 1)).
  const nodeMaps = interp.nodes.map((sigma) => reducedMap(matrixExponential(m.map((row) => row.map((v) => v * sigma)))));
  function reducedMap(e: Matrix): Float64Array {
    const cols = zSize + q + 1;
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
  }
  const cols = zSize + q + 1;
  // Output and control rows at each node: y = Cy x + Dp W_j, u = K x + Dc r − Dc Dp W_j.
  const yRows = nodeMaps.map((map) => rowCombination(map, loop.cy));
  const uRows = nodeMaps.map((map) => rowCombination(map, loop.k));
  function rowCombination(map: Float64Array, weights: readonly number[]): Float64Array {
    const out = new Float64Array(cols);
    for (let i = 0; i < n; i++) {
      const wgt = weights[i];
      if (wgt === 0) continue;
      for (let j = 0; j < cols; j++) out[j] += wgt * map[i * cols + j];
    }
    return out;
  }

  const states = new Float64Array((stepCount + 1) * zSize);
  const controlNodes = new Float64Array(stepCount * q);
  const nodeOutput = new Float64Array(stepCount * q);
  const inputNodes = new Float64Array(q);
  const work = new Float64Array(cols);
  const lastMap = nodeMaps[q - 1];

  const fillDelayedInput = (step: number, target: Float64Array): void => {
    const source = step - delaySteps;
    if (source < 0) {
      target.fill(0);
      return;
    }
    for (let j = 0; j < q; j++) target[j] = controlNodes[source * q + j] + disturbance;
  };

  for (let k = 0; k < stepCount; k++) {
    fillDelayedInput(k, inputNodes);
    const base = k * zSize;
    for (let i = 0; i < zSize; i++) work[i] = states[base + i];
    for (let l = 0; l < q; l++) work[zSize + l] = inputNodes[l];
    work[zSize + q] = setpoint;
    for (let j = 0; j < q; j++) {
      const yr = yRows[j];
      const ur = uRows[j];
      let y = 0;
      let u = 0;
      for (let c = 0; c < cols; c++) {
        y += yr[c] * work[c];
        u += ur[c] * work[c];
      }
      nodeOutput[k * q + j] = y + dp * inputNodes[j];
      controlNodes[k * q + j] = u + dc * setpoint - dc * dp * inputNodes[j];
    }
    const next = (k + 1) * zSize;
    for (let i = 0; i < zSize; i++) {
      let s = 0;
      const row = i * cols;
      for (let c = 0; c < cols; c++) s += lastMap[row + c] * work[c];
      states[next + i] = s;
    }
  }

  const evaluate = (step: number, sigma: number): TrajectoryPoint => {
    const w = new Float64Array(q);
    fillDelayedInput(step, w);
    const xi = new Array<number>(size).fill(0);
    for (let i = 0; i < zSize; i++) xi[i] = states[step * zSize + i];
    for (let i = 0; i < q; i++) {
      let s = 0;
      for (let l = 0; l < q; l++) s += etaFromValues[i][l] * w[l];
      xi[etaStart + i] = s;
    }
    xi[rIndex] = setpoint;
    const e = sigma === 0 ? null : matrixExponential(m.map((row) => row.map((v) => v * sigma)));
    const z = new Array<number>(zSize).fill(0);
    for (let i = 0; i < zSize; i++) {
      if (e === null) {
        z[i] = xi[i];
        continue;
      }
      let s = 0;
      for (let c = 0; c < size; c++) s += e[i][c] * xi[c];
      z[i] = s;
    }
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
      outputRate: yRate + (dp * wSlope) / h,
      outputIntegral: z[n],
    };
  };
  return { stepLength, stepCount, nodes: interp.nodes, nodeOutput, evaluate };
}
