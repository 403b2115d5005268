/**
 * A rational transfer function times a pure delay, N(s)/D(s)·e^{−sT},
 * evaluated exactly on the imaginary axis.
 *
 * The coefficient form is evaluated by the one-pass kernel of
 * rational-kernel.ts (Horner's rule, in 1/(jω) above ω = 1); the factored
 * form multiplies one zero/pole ratio at a time.
 */
import type { Complex } from '../numeric/complex.js';
import { trimLeading, zeroRootMultiplicity, addPolynomials } from '../numeric/polynomial.js';
import { lowDegreeRoots } from '../numeric/low-degree-roots.js';
import type { FrequencyModel } from './frequency-model.js';
import { ModelError } from './model-error.js';
import { rootStructure } from './root-structure.js';
import { integerPower, pointThroughBatch, rationalKernel, storeDelayed, type RationalKernel } from './rational-kernel.js';

export interface RationalOptions {
  /** Evaluate from factors instead of coefficients (better conditioned). */
  factored?: { gain: number; zeros: Complex[]; poles: Complex[] };
  /** Known roots, to skip root finding. */
  zeros?: Complex[];
  poles?: Complex[];
}

export function rationalModel(
  numeratorIn: readonly number[],
  denominatorIn: readonly number[],
  delay: number,
  options: RationalOptions = {},
): FrequencyModel {
  const numerator = trimLeading(numeratorIn);
  const denominator = trimLeading(denominatorIn);
  if (denominator.every((c) => c === 0)) {
    throw new ModelError('zero_denominator', 'The denominator is identically zero.', ['denominator']);
  }
  const zeros = options.zeros ?? lowDegreeRoots(numerator);
  const poles = options.poles ?? lowDegreeRoots(denominator);
  const n = numerator.length - 1;
  const m = denominator.length - 1;
  const relativeDegree = m - n;
  const structure = rootStructure(poles, zeros);
  const zN = zeroRootMultiplicity(numerator);
  const zD = zeroRootMultiplicity(denominator);
  const lowFrequencyGain = numerator[n - zN] / denominator[m - zD];
  const highFrequencyGain = relativeDegree > 0 ? 0 : numerator[0] / denominator[0];

  // Coefficient form: the one-pass kernel, which a product with another coefficient-form model fuses into one (loop.ts).
  const rationalFactors = options.factored ? undefined : { factors: [{ numerator, denominator }], delay };
  const { evaluate, evaluateBatch } = rationalFactors ? rationalKernel(rationalFactors) : factoredModel(options.factored!, delay);

  const coefficientMagnitudeBound = coefficientBound(numerator, denominator);
  const rootMagnitudeBound = rootBound(numerator[0] / denominator[0], zeros, poles);
  const magnitudeBound = (w: number) => Math.min(coefficientMagnitudeBound(w), rootMagnitudeBound(w));
  const deviationBound =
    relativeDegree > 0
      ? magnitudeBound
      : coefficientBound(trimLeading(addPolynomials(numerator, denominator.map((d) => -highFrequencyGain * d))), denominator);

  const characteristicFrequencies = [...poles, ...zeros]
    .map((r) => Math.hypot(r.re, r.im))
    .filter((w) => w > 0 && Number.isFinite(w));
  if (delay > 0) characteristicFrequencies.push(1 / delay);

  return {
    evaluate,
    evaluateBatch,
    rational: { numerator, denominator },
    rationalFactors,
    poles,
    zeros,
    delay,
    phaseRate: delay,
    integrators: structure.integrators,
    imaginaryAxisPoles: structure.imaginaryAxisPoles,
    unstablePoles: structure.unstablePoles,
    unstablePolesAssumed: false,
    relativeDegree,
    highFrequencyGain,
    lowFrequencyGain,
    characteristicFrequencies,
    magnitudeBoundAbove: magnitudeBound,
    deviationBoundAbove: deviationBound,
    exact: true,
  };
}

/** k·Π(jω − z)/Π(jω − p)·e^{−jωT} at every frequency of a batch, multiplying one zero/pole ratio at a time so the product stays in range. */
function factoredModel(f: { gain: number; zeros: Complex[]; poles: Complex[] }, delay: number): RationalKernel {
  const zr = Float64Array.from(f.zeros, (z) => z.re);
  const zi = Float64Array.from(f.zeros, (z) => z.im);
  const pr = Float64Array.from(f.poles, (p) => p.re);
  const pi = Float64Array.from(f.poles, (p) => p.im);
  const nz = zr.length;
  const np = pr.length;
  const common = Math.min(nz, np);
  const gain = f.gain;
  const evaluateBatch: RationalKernel['evaluateBatch'] = (omegas, outRe, outIm, count) => {
    for (let j = 0; j < count; j++) {
      const omega = omegas[j];
      let re = gain;
      let im = 0;
      for (let i = 0; i < common; i++) {
        // (jω − z)/(jω − p)
        const ar = -zr[i];
        const ai = omega - zi[i];
        const br = -pr[i];
        const bi = omega - pi[i];
        const bb = br * br + bi * bi;
        const qr = (ar * br + ai * bi) / bb;
        const qi = (ai * br - ar * bi) / bb;
        const t = re * qr - im * qi;
        im = re * qi + im * qr;
        re = t;
      }
      for (let i = common; i < nz; i++) {
        const ar = -zr[i];
        const ai = omega - zi[i];
        const t = re * ar - im * ai;
        im = re * ai + im * ar;
        re = t;
      }
      for (let i = common; i < np; i++) {
        const br = -pr[i];
        const bi = omega - pi[i];
        const bb = br * br + bi * bi;
        const t = (re * br + im * bi) / bb;
        im = (im * br - re * bi) / bb;
        re = t;
      }
      storeDelayed(outRe, outIm, j, re, im, omega, delay);
    }
  };
  return { evaluate: pointThroughBatch(evaluateBatch), evaluateBatch };
}

/**
 * Bound of |N(jν)/D(jν)| for all ν ≥ ω from the roots: with k = n0/d0,
 * |N/D| = |k|·Π|jν − z|/Π|jν − p|, and for every root r and ν ≥ 0
 *   |jν − r| ≥ max(|Re r|, ν − |r|)   and   |jν − z| ≤ ν + |z|.
 * Each zero is paired with a pole; the pair's bound (ν + |z|)/max(|Re p|, ν − |p|)
 * rises until ν = |p| + |Re p| and falls after, so its supremum over ν' ≥ ν is
 * taken at max(ν, |p| + |Re p|). Unpaired poles give 1/max(|Re p|, ν − |p|),
 * which falls with ν. The product is therefore nonincreasing in ω. Much
 * tighter than the coefficient bound for poles far apart (a slow integrator
 * and a fast lag, say).
 */
function rootBound(k: number, zeros: Complex[], poles: Complex[]) {
  // Moduli computed once, then sorted (a stable sort, so equal moduli keep their order as before).
  const z = zeros.map((r) => Math.hypot(r.re, r.im)).sort((a, b) => a - b);
  const p = poles.map((r) => ({ modulus: Math.hypot(r.re, r.im), real: Math.abs(r.re) })).sort((a, b) => a.modulus - b.modulus);
  return (omega: number): number => {
    if (z.length > p.length || !Number.isFinite(k)) return Infinity;
    let bound = Math.abs(k);
    for (let i = 0; i < p.length; i++) {
      const { modulus, real } = p[i];
      if (i < z.length) {
        const nu = Math.max(omega, modulus + real);
        const d = Math.max(real, nu - modulus);
        bound *= d > 0 ? (nu + z[i]) / d : Infinity;
      } else {
        const d = Math.max(real, omega - modulus);
        bound *= d > 0 ? 1 / d : Infinity;
      }
      if (bound === Infinity) return Infinity;
    }
    return bound;
  };
}

/**
 * Bound of |N(jν)/D(jν)| for all ν ≥ ω from the triangle inequality:
 * |N| ≤ Σ|n_i|ν^(n−i) and |D| ≥ |d_0|ν^m − Σ_{i≥1}|d_i|ν^(m−i). Divided by
 * ν^m, the first falls and the second rises with ν (for n ≤ m), so their
 * ratio is nonincreasing wherever the second is positive.
 */
function coefficientBound(numerator: number[], denominator: number[]) {
  const n = numerator.length - 1;
  const m = denominator.length - 1;
  // Hoisted out of the bound, which the band search calls dozens of times per analysis.
  const absN = numerator.map(Math.abs);
  const absD = denominator.map(Math.abs);
  const zeroNumerator = numerator.every((c) => c === 0);
  return (omega: number): number => {
    if (n > m) return Infinity;
    if (zeroNumerator) return 0;
    if (!(omega > 0)) return Infinity;
    // Both sums by Horner's rule in u = 1/ν: Σ|n_i|ν^(n−i−m) = ν^(n−m)·Σ|n_i|u^i, Σ_{i≥1}|d_i|ν^(−i) = Σ|d_i|u^i.
    const u = 1 / omega;
    let upper = 0;
    for (let i = n; i >= 0; i--) upper = upper * u + absN[i];
    upper *= integerPower(omega, n - m);
    let tail = 0;
    for (let i = m; i >= 1; i--) tail = (tail + absD[i]) * u;
    const lower = absD[0] - tail;
    return lower > 0 ? upper / lower : Infinity;
  };
}
