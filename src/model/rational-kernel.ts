/**
 * A product of rational factors times a pure delay,
 * Π N_i(jω)/D_i(jω) · e^{−jωT}, evaluated at jω in one pass.
 *
 * Each factor is evaluated by Horner's rule and divided on its own (no
 * multiplied-out polynomials, whose coefficients would lose what the factors
 * keep). Above ω = 1 every polynomial is evaluated in 1/(jω) (reversed
 * coefficients) and the net power (jω)^(Σ deg N_i − Σ deg D_i) is applied
 * once at the end, so high degrees at high frequencies neither overflow nor
 * lose the ratio to cancellation of huge terms, and powers of opposite
 * factors cancel before they are formed. Where the running product leaves
 * [1e-150, 1e150] (factors with huge or tiny leading coefficients), the
 * powers gathered so far are applied at once, so that the next factor cannot
 * push it out of range.
 *
 * Why one kernel for a whole loop: the grid, the Brent refinements and the
 * peak searches ask for one frequency at a time, a couple of hundred times per
 * analysis. A plant and a controller each evaluated through its own batch of
 * one, then multiplied, cost two to three times the arithmetic itself.
 */
import type { Complex } from '../numeric/complex.js';
import type { RationalPart } from './frequency-model.js';

export interface RationalFactors {
  /** Factors N_i/D_i, coefficients in descending powers of s. */
  factors: readonly RationalPart[];
  /** Total delay T in seconds. */
  delay: number;
}

export interface RationalKernel {
  evaluate(omega: number, out: Complex): Complex;
  evaluateBatch(omega: ArrayLike<number>, re: Float64Array, im: Float64Array, count: number): void;
}

/**
 * x^k for an integer k, by repeated multiplication up to |k| = 8 (V8's Math.pow
 * took a tenth of a worker's time in the benchmark's HTTP profile); relative
 * error at most |k| rounding errors. Beyond 8, or where the product leaves
 * the range of a double, Math.pow.
 */
export function integerPower(x: number, k: number): number {
  const n = k < 0 ? -k : k;
  if (n === 0) return 1;
  if (n > 8) return Math.pow(x, k);
  let p = x;
  for (let i = 1; i < n; i++) p *= x;
  if (!Number.isFinite(p) || p === 0) return Math.pow(x, k);
  return k < 0 ? 1 / p : p;
}

/** The running product's range inside which the powers of jω wait for the last factor. */
const SMALLEST_RUNNING = 1e-150;
const LARGEST_RUNNING = 1e150;

export function rationalKernel({ factors, delay }: RationalFactors): RationalKernel {
  // All coefficients factor by factor (numerator, then denominator), twice: from 0 in descending
  // powers of s (ω ≤ 1), from `total` reversed, in descending powers of 1/s (ω > 1).
  const count = factors.length;
  const lengths = new Int32Array(2 * count);
  /** Each factor's power of jω above ω = 1: deg N_i − deg D_i. */
  const powers = new Int32Array(count);
  let total = 0;
  for (let f = 0; f < count; f++) {
    const { numerator, denominator } = factors[f];
    lengths[2 * f] = numerator.length;
    lengths[2 * f + 1] = denominator.length;
    total += numerator.length + denominator.length;
    powers[f] = numerator.length - denominator.length;
  }
  // A plain array of doubles (filled with 0.5 first so that V8 stores it as doubles whatever the
  // values): a Float64Array of more than eight elements is allocated off V8's heap, which cost about
  // 1 µs per kernel, a sixth of building a loop.
  const coefficients = new Array<number>(2 * total).fill(0.5);
  let at = 0;
  for (let f = 0; f < count; f++) {
    for (const p of [factors[f].numerator, factors[f].denominator]) {
      for (let i = 0; i < p.length; i++) {
        coefficients[at + i] = p[i];
        coefficients[total + at + i] = p[p.length - 1 - i];
      }
      at += p.length;
    }
  }

  const evaluateBatch = (omegas: ArrayLike<number>, outRe: Float64Array, outIm: Float64Array, n: number): void => {
    for (let j = 0; j < n; j++) {
      const omega = omegas[j];
      const isLow = Math.abs(omega) <= 1;
      // Above ω = 1: p(jω) = (jω)^deg · q(1/(jω)) with q the reversed polynomial, and 1/(jω) = j·(−1/ω).
      const x = isLow ? omega : -1 / omega;
      let re = 1;
      let im = 0;
      let k = isLow ? 0 : total; // where this branch's coefficients start
      let pending = 0; // powers of jω gathered and not yet applied (above ω = 1)
      for (let f = 0; f < count; f++) {
        let ar = 0;
        let ai = 0;
        const endN = k + lengths[2 * f];
        for (; k < endN; k++) {
          const t = -ai * x + coefficients[k];
          ai = ar * x;
          ar = t;
        }
        let br = 0;
        let bi = 0;
        const endD = k + lengths[2 * f + 1];
        for (; k < endD; k++) {
          const t = -bi * x + coefficients[k];
          bi = br * x;
          br = t;
        }
        const bb = br * br + bi * bi;
        const qr = (ar * br + ai * bi) / bb;
        const qi = (ai * br - ar * bi) / bb;
        const t = re * qr - im * qi;
        im = re * qi + im * qr;
        re = t;
        if (isLow) continue;
        pending += powers[f];
        const size = Math.abs(re) + Math.abs(im);
        if (pending !== 0 && (f === count - 1 || !(size > SMALLEST_RUNNING && size < LARGEST_RUNNING))) {
          // × (jω)^pending
          const mag = integerPower(omega, pending);
          const quarter = ((pending % 4) + 4) % 4;
          const pr = quarter === 0 ? mag : quarter === 2 ? -mag : 0;
          const pi = quarter === 1 ? mag : quarter === 3 ? -mag : 0;
          const u = re * pr - im * pi;
          im = re * pi + im * pr;
          re = u;
          pending = 0;
        }
      }
      storeDelayed(outRe, outIm, j, re, im, omega, delay);
    }
  };
  return { evaluate: pointThroughBatch(evaluateBatch), evaluateBatch };
}

/** Writes (re + j·im)·e^{−jωT} at index j of a batch's output; with no delay, the value as it is. */
export function storeDelayed(outRe: Float64Array, outIm: Float64Array, j: number, re: number, im: number, omega: number, delay: number): void {
  if (delay !== 0) {
    const c = Math.cos(omega * delay);
    const s = -Math.sin(omega * delay);
    const t = re * c - im * s;
    im = re * s + im * c;
    re = t;
  }
  outRe[j] = re;
  outIm[j] = im;
}

/**
 * One point through the batch (a batch of one), so that the two agree bit for bit.
 */
export function pointThroughBatch(batch: RationalKernel['evaluateBatch']): RationalKernel['evaluate'] {
  const w = new Float64Array(1);
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  return (omega, out) => {
    w[0] = omega;
    batch(w, re, im, 1);
    out.re = re[0];
    out.im = im[0];
    return out;
  };
}

