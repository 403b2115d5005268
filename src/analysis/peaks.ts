/**
 * Peaks of the sensitivity |S| = 1/|1 + L| (Ms) and of the complementary
 * sensitivity |T| = |L|/|1 + L| (Mt): the largest local maxima on the grid
 * are refined by Brent's minimisation (golden section with parabolic steps,
 * Brent 1973) in ln ω on the model, and the largest refined value is kept.
 *
 * A supremum approached only as ω → 0 or ω → ∞ is reported at frequency 0 or
 * null with the limit value, never as the grid's end point (DESIGN.md,
 * "improper or non-causal loops").
 */
import type { FrequencyModel } from '../model/frequency-model.js';
import { brentMaximum } from '../numeric/brent-maximum.js';
import type { LoopGrid } from './loop-grid.js';

export interface Peak {
  value: number;
  db: number;
  /** rad/s; 0 for a supremum at zero frequency, null for one approached as ω → ∞. */
  frequency: number | null;
}

export type ClosedLoopFunction = 'sensitivity' | 'complementarySensitivity';

const REFINED_MAXIMA = 4;

/**
 * Tolerance of the peak's abscissa as a fraction of its bracket (the two grid
 * intervals around the grid maximum). brentMaximum's tolerance is relative
 * to |x|; in x = ln ω that vanishes at 1 rad/s (the search then runs to its
 * iteration limit) and ignores how narrow the peak is. Searching the bracket
 * mapped to t ∈ [1, 2] makes it a fraction of the bracket instead. The grid
 * resolves the turning of 1 + L, so a sharp peak (a delay turning the phase
 * fast, a nearly marginal loop) spans several intervals and the abscissa
 * lands well inside it; the value, flat there, is found to full precision.
 */
const PEAK_BRACKET_TOLERANCE = 1e-7;

function magnitudeOf(which: ClosedLoopFunction, re: number, im: number): number {
  const d = Math.sqrt((1 + re) * (1 + re) + im * im);
  return which === 'sensitivity' ? 1 / d : Math.sqrt(re * re + im * im) / d;
}

/** Limits of |S| and |T| at ω = 0 and ω → ∞ from what the model knows (NaN when unknown). */
export function closedLoopLimits(loop: FrequencyModel): { zero: Record<ClosedLoopFunction, number>; infinity: Record<ClosedLoopFunction, number> } {
  const l0 = loop.integrators > 0 ? Infinity : loop.lowFrequencyGain;
  const lInf = loop.relativeDegree === null ? NaN : loop.relativeDegree > 0 ? 0 : loop.highFrequencyGain;
  const fromL = (l: number) =>
    l === Infinity
      ? { sensitivity: 0, complementarySensitivity: 1 }
      : { sensitivity: 1 / Math.abs(1 + l), complementarySensitivity: Math.abs(l / (1 + l)) };
  return { zero: fromL(l0), infinity: loop.delay > 0 && lInf !== 0 ? { sensitivity: NaN, complementarySensitivity: NaN } : fromL(lInf) };
}

let scratch = new Float64Array(1024);

export function findPeak(loop: FrequencyModel, grid: LoopGrid, which: ClosedLoopFunction): Peak {
  const { omega, re, im } = grid;
  const n = omega.length;
  // Working storage kept between calls (per thread; the search is synchronous and keeps nothing of it).
  if (scratch.length < n) scratch = new Float64Array(Math.max(n, 2 * scratch.length));
  const values = scratch;
  for (let i = 0; i < n; i++) values[i] = magnitudeOf(which, re[i], im[i]);
  const candidates: number[] = [];
  for (let i = 1; i + 1 < n; i++) if (values[i] >= values[i - 1] && values[i] >= values[i + 1]) candidates.push(i);
  candidates.sort((a, b) => values[b] - values[a]);
  const v = { re: 0, im: 0 };
  const f = (x: number) => {
    loop.evaluate(Math.exp(x), v);
    return magnitudeOf(which, v.re, v.im);
  };
  let best: Peak | null = null;
  for (const i of candidates.slice(0, REFINED_MAXIMA)) {
    const lo = Math.log(omega[i - 1]);
    const width = Math.log(omega[i + 1]) - lo;
    const m = brentMaximum((t) => f(lo + (t - 1) * width), 1, 2, PEAK_BRACKET_TOLERANCE);
    const value = Math.max(m.value, values[i]);
    const frequency = m.value >= values[i] ? Math.exp(lo + (m.x - 1) * width) : omega[i];
    if (!best || value > best.value) best = { value, db: 20 * Math.log10(value), frequency };
  }
  // Compare with the ends: a supremum at ω → 0 or ω → ∞ is reported as such.
  const limits = closedLoopLimits(loop);
  const atZero = Number.isFinite(limits.zero[which]) ? limits.zero[which] : values[0];
  const atInfinity = Number.isFinite(limits.infinity[which]) ? limits.infinity[which] : values[n - 1];
  if ((!best || values[0] > best.value) && values[0] >= values[n - 1]) {
    const value = Math.max(atZero, values[0]);
    return { value, db: 20 * Math.log10(value), frequency: 0 };
  }
  if (!best || values[n - 1] > best.value) {
    const value = Math.max(atInfinity, values[n - 1]);
    return { value, db: 20 * Math.log10(value), frequency: null };
  }
  return best;
}
