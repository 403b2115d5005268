/**
 * The loop transfer function L = C·P as a product of two frequency models.
 * The product keeps both factors separate for evaluation (no multiplied-out
 * polynomials in the hot path) and combines what is known about each. Two
 * coefficient-form rational models (the common plant and PID) are evaluated
 * by one fused kernel (rational-kernel.ts), every factor still on its own.
 */
import type { Complex } from '../numeric/complex.js';
import { multiply } from '../numeric/polynomial.js';
import type { FrequencyModel } from './frequency-model.js';
import { evaluateAll } from './evaluate-all.js';
import { rationalKernel } from './rational-kernel.js';
import { ModelError } from './model-error.js';
import { rootStructure } from './root-structure.js';

export function productModel(a: FrequencyModel, b: FrequencyModel): FrequencyModel {
  const rational =
    a.rational && b.rational
      ? { numerator: multiply(a.rational.numerator, b.rational.numerator), denominator: multiply(a.rational.denominator, b.rational.denominator) }
      : null;
  const poles = a.poles && b.poles ? [...a.poles, ...b.poles] : null;
  const zeros = a.zeros && b.zeros ? [...a.zeros, ...b.zeros] : null;
  const structure = poles && zeros ? rootStructure(poles, zeros) : null;
  const relativeDegree = a.relativeDegree === null || b.relativeDegree === null ? null : a.relativeDegree + b.relativeDegree;
  const rationalFactors =
    a.rationalFactors && b.rationalFactors
      ? { factors: [...a.rationalFactors.factors, ...b.rationalFactors.factors], delay: a.rationalFactors.delay + b.rationalFactors.delay }
      : undefined;
  const { evaluate, evaluateBatch } = rationalFactors ? rationalKernel(rationalFactors) : separateEvaluation(a, b);
  return {
    evaluate,
    evaluateBatch,
    rational,
    rationalFactors,
    poles,
    zeros,
    delay: a.delay + b.delay,
    phaseRate: a.phaseRate + b.phaseRate,
    integrators: structure ? structure.integrators : a.integrators + b.integrators,
    imaginaryAxisPoles: structure ? structure.imaginaryAxisPoles : [...a.imaginaryAxisPoles, ...b.imaginaryAxisPoles],
    // Unstable poles are counted in each factor: one cancelled by a zero of the other still makes the loop internally unstable.
    unstablePoles: a.unstablePoles + b.unstablePoles,
    unstablePolesAssumed: a.unstablePolesAssumed || b.unstablePolesAssumed,
    relativeDegree,
    highFrequencyGain: a.highFrequencyGain * b.highFrequencyGain,
    lowFrequencyGain: a.lowFrequencyGain * b.lowFrequencyGain,
    characteristicFrequencies: [...a.characteristicFrequencies, ...b.characteristicFrequencies],
    magnitudeBoundAbove: (w) => a.magnitudeBoundAbove(w) * b.magnitudeBoundAbove(w),
    deviationBoundAbove: (w) => {
      // |ab − a∞b∞| ≤ |a − a∞|·|b| + |a∞|·|b − b∞|
      const da = a.deviationBoundAbove(w);
      const db = b.deviationBoundAbove(w);
      return da * b.magnitudeBoundAbove(w) + Math.abs(a.highFrequencyGain) * db;
    },
    exact: a.exact && b.exact,
    sampledBand: a.sampledBand ?? b.sampledBand,
    evaluationCost: (a.evaluationCost ?? 1) + (b.evaluationCost ?? 1),
    referencePhaseDeg: a.referencePhaseDeg || b.referencePhaseDeg ? (w) => phaseOf(a, w) + phaseOf(b, w) : undefined,
  };
}

/** a·b evaluated factor by factor: for products of which at least one factor is not in coefficient form. */
function separateEvaluation(a: FrequencyModel, b: FrequencyModel): Pick<FrequencyModel, 'evaluate' | 'evaluateBatch'> {
  const tmp: Complex = { re: 0, im: 0 };
  // The second factor's values during a batch, grown as needed and kept for the next batch.
  let bRe = new Float64Array(0);
  let bIm = new Float64Array(0);
  return {
    evaluate(omega, out) {
      a.evaluate(omega, out);
      b.evaluate(omega, tmp);
      const re = out.re * tmp.re - out.im * tmp.im;
      out.im = out.re * tmp.im + out.im * tmp.re;
      out.re = re;
      return out;
    },
    evaluateBatch(omega, re, im, count) {
      if (bRe.length < count) {
        bRe = new Float64Array(count);
        bIm = new Float64Array(count);
      }
      evaluateAll(a, omega, re, im, count);
      evaluateAll(b, omega, bRe, bIm, count);
      for (let k = 0; k < count; k++) {
        const r = re[k] * bRe[k] - im[k] * bIm[k];
        im[k] = re[k] * bIm[k] + im[k] * bRe[k];
        re[k] = r;
      }
    },
  };
}

/** Phase in degrees: the model's own reference where it has one, else the principal value. */
function phaseOf(m: FrequencyModel, omega: number): number {
  if (m.referencePhaseDeg) return m.referencePhaseDeg(omega);
  const v = m.evaluate(omega, { re: 0, im: 0 });
  return (Math.atan2(v.im, v.re) * 180) / Math.PI;
}

/** Refuses loops that cannot be analysed as a feedback loop: improper ones, and biproper delayed ones with |L(∞)| ≥ 1. */
export function requireAnalysableLoop(loop: FrequencyModel): void {
  if (loop.relativeDegree !== null && loop.relativeDegree < 0) {
    throw new ModelError(
      'improper_loop',
      'The loop C·P is improper (more zeros than poles): its gain grows without bound with frequency. Filter the derivative or check the plant.',
      ['controller', 'derivativeFilter'],
    );
  }
  if (loop.relativeDegree === 0 && Math.abs(1 + loop.highFrequencyGain) < 1e-12) {
    throw new ModelError(
      'closed_loop_improper',
      'L(∞) = −1: the closed loop 1/(1 + L) is improper and cannot be analysed.',
      ['controller'],
    );
  }
  if (loop.relativeDegree === 0 && loop.delay > 0 && Math.abs(loop.highFrequencyGain) >= 1) {
    throw new ModelError(
      'neutral_loop',
      `The loop is biproper with |L(∞)| = ${Math.abs(loop.highFrequencyGain)} ≥ 1 and a delay: the closed loop is of neutral type and has infinitely many poles near the imaginary axis.`,
      ['plant', 'delay'],
    );
  }
}
