/**
 * The exact sample-and-hold equivalent of a continuous plant with an input
 * delay: u is held constant between samples (zero-order hold), the plant
 * ẋ = Ax + Bu(t − T), y = Cx + Du(t − T) is sampled at t = kTs, and the
 * result is a rational G(z) with no approximation
 * (Åström & Wittenmark, Computer-Controlled Systems, 3rd ed., §2.3–2.4;
 * delays that are not a whole number of samples by the modified z-transform,
 * Franklin, Powell & Workman, Digital Control of Dynamic Systems, 3rd ed., §4.4).
 *
 * With T = d·Ts + τ, 0 ≤ τ < Ts, the held input seen by the plant during
 * [kTs, kTs + Ts) is u_{k−1−d} for the first τ seconds and u_{k−d} after, so
 *   x_{k+1} = Φ·x_k + Γ0·u_{k−d} + Γ1·u_{k−1−d},
 *   Φ = e^{ATs},  Γ0 = ∫_0^{Ts−τ} e^{Aσ}dσ·B,  Γ1 = e^{A(Ts−τ)}·∫_0^{τ} e^{Aσ}dσ·B,
 * and G(z) = z^(−d)·[C(zI − Φ)⁻¹(Γ0 + Γ1/z) + D·z^(−1 if τ > 0)].
 * Φ and the integrals come from one matrix exponential of [[A, B], [0, 0]]·h
 * (Van Loan's block form), computed by Padé scaling and squaring (Higham 2005).
 *
 * The denominator is det(zI − Φ) = Π(z − e^{p_i·Ts}) over the continuous
 * poles p_i (times z when τ > 0); its roots are kept as z − 1 = expm1(p_i·Ts)
 * so fast sampling does not blur them. The numerator
 * det(zI − Φ)·[C(zI − Φ)⁻¹g(z) + D] is a polynomial recovered from its values
 * at roots of unity by the discrete Fourier transform (interpolation at
 * equispaced points on the unit circle, which is well conditioned there).
 *
 * @example K/(τs + 1) sampled at Ts: a = e^{−Ts/τ}, G(z) = K(1 − a)/(z − a)
 */
import type { Complex } from '../../numeric/complex.js';
import { complexExpm1 } from '../../numeric/complex-exponential.js';
import { complexSolveWithDeterminant } from '../../numeric/complex-linear-solve.js';
import { matrixExponential } from '../../numeric/matrix-exponential.js';
import { matrixProduct, type RealMatrix } from '../../numeric/real-matrix.js';
import type { StateSpaceRealisation } from './companion-realisation.js';
import { discreteRationalModel, type DiscreteModel } from './discrete-model.js';

export interface HeldPlant {
  realisation: StateSpaceRealisation;
  /** Eigenvalues of the realisation's A (the continuous poles). */
  poles: Complex[];
  /** Input delay in seconds. */
  delay: number;
}

/** Whole samples and remainder of a delay; a remainder within 1e-9 of a sample boundary counts as none. */
export function splitDelay(delay: number, samplePeriod: number): { samples: number; fraction: number } {
  const ratio = delay / samplePeriod;
  const nearest = Math.round(ratio);
  if (Math.abs(ratio - nearest) <= 1e-9 * Math.max(1, ratio)) return { samples: nearest, fraction: 0 };
  const samples = Math.floor(ratio);
  return { samples, fraction: delay - samples * samplePeriod };
}

/** Φ(h) = e^{Ah} and Γ(h) = ∫_0^h e^{Aσ}dσ·B from exp([[A, B], [0, 0]]·h). */
function holdStep(a: RealMatrix, b: number[], h: number): { phi: RealMatrix; gamma: number[] } {
  const n = a.length;
  const m: RealMatrix = Array.from({ length: n + 1 }, (_, i) =>
    Array.from({ length: n + 1 }, (_, j) => (i === n ? 0 : j === n ? b[i] * h : a[i][j] * h)),
  );
  const e = matrixExponential(m);
  return { phi: e.slice(0, n).map((r) => r.slice(0, n)), gamma: e.slice(0, n).map((r) => r[n]) };
}

export function zeroOrderHoldEquivalent(plant: HeldPlant, samplePeriod: number): DiscreteModel {
  const { a, b, c, d } = plant.realisation;
  const n = a.length;
  const ts = samplePeriod;
  const { samples, fraction } = splitDelay(plant.delay, ts);
  const delayed = fraction > 0;

  let phi: RealMatrix;
  let gamma0: number[];
  let gamma1: number[];
  if (!delayed) {
    const s = holdStep(a, b, ts);
    phi = s.phi;
    gamma0 = s.gamma;
    gamma1 = new Array<number>(n).fill(0);
  } else {
    const late = holdStep(a, b, ts - fraction);
    const early = holdStep(a, b, fraction);
    phi = matrixProduct(late.phi, early.phi);
    gamma0 = late.gamma;
    gamma1 = matrixProduct(late.phi, early.gamma.map((x) => [x])).map((r) => r[0]);
  }

  // Numerator values at M points on the unit circle, rotated off the roots of unity so that
  // they do not meet eigenvalues of Φ at z = 1 or z = −1.
  // C·adj(zI − Φ)·g(z) has degree n − 1 (n when τ > 0), D·det(zI − Φ) degree n.
  const degree = delayed || d !== 0 ? n : n - 1;
  const points = Math.max(degree + 1, 1);
  const offset = (0.6180339887498949 * Math.PI) / points;
  const values: Complex[] = [];
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  const gr = new Float64Array(n);
  const gi = new Float64Array(n);
  for (let k = 0; k < points; k++) {
    const angle = (2 * Math.PI * k) / points + offset;
    const zr = Math.cos(angle);
    const zi = Math.sin(angle);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        re[i * n + j] = (i === j ? zr : 0) - phi[i][j];
        im[i * n + j] = i === j ? zi : 0;
      }
      // g(z) = Γ0 (τ = 0) or Γ0·z + Γ1 (τ > 0)
      gr[i] = delayed ? gamma0[i] * zr + gamma1[i] : gamma0[i];
      gi[i] = delayed ? gamma0[i] * zi : 0;
    }
    const sol = complexSolveWithDeterminant(re, im, n, gr, gi);
    let vr = d;
    let vi = 0;
    for (let i = 0; i < n; i++) {
      vr += c[i] * sol.re[i];
      vi += c[i] * sol.im[i];
    }
    values.push({ re: sol.det.re * vr - sol.det.im * vi, im: sol.det.re * vi + sol.det.im * vr });
  }
  const ascending = new Array<number>(points).fill(0);
  for (let i = 0; i < points; i++) {
    let sum = 0;
    for (let k = 0; k < points; k++) {
      const angle = -i * ((2 * Math.PI * k) / points + offset);
      sum += values[k].re * Math.cos(angle) - values[k].im * Math.sin(angle);
    }
    ascending[i] = sum / points;
  }
  // Leading coefficients at round-off level of the largest are zero.
  const largest = Math.max(...ascending.map(Math.abs));
  let top = ascending.length - 1;
  while (top > 0 && Math.abs(ascending[top]) <= 1e-13 * largest) top--;
  const numerator = ascending.slice(0, top + 1).reverse();

  const rootsMinusOne = plant.poles.map((p) => complexExpm1({ re: p.re * ts, im: p.im * ts }));
  if (delayed) rootsMinusOne.push({ re: -1, im: 0 });
  return discreteRationalModel(
    { samplePeriod: ts, numerator, denominator: { leading: 1, rootsMinusOne }, delaySamples: samples },
    ['plant'],
  );
}
