/**
 * The band of frequencies the analysis examines, chosen from the loop itself
 * so that a narrow plotting range cannot hide a crossover.
 *
 * - Low end: three decades below the lowest characteristic frequency
 *   (corner frequencies |p|, |z|, 1/delay, and where the low-frequency
 *   asymptote K0/(jω)^m reaches unity).
 * - Nyquist sweep end (`sweepTo`): where a proven bound of |L| over all higher
 *   frequencies drops below 1/2 (or, for a biproper loop without delay, where
 *   |L − L(∞)| stays below |1 + L(∞)|/2). Beyond it 1 + L stays in a disc that
 *   excludes the origin, so it can add no encirclement (DESIGN.md, "where to
 *   stop the Nyquist sweep").
 * - High end: where that bound falls below 1e-3 (so every phase crossover with
 *   a gain margin below 60 dB is inside; located to within 2^(1/16)), at least
 *   a decade above the highest characteristic frequency.
 */
import type { FrequencyModel } from '../model/frequency-model.js';

export interface AnalysisBand {
  min: number;
  max: number;
  /** Where the Nyquist sweep may stop. */
  sweepTo: number;
  /** True when `sweepTo` rests on a proven bound; false when it rests on samples (expressions, data). */
  sweepBounded: boolean;
}

/** |L| below which phase crossovers are no longer looked for (gain margin above 60 dB). */
export const NEGLIGIBLE_LOOP_GAIN = 1e-3;

/**
 * Characteristic frequencies are held inside [FREQUENCY_FLOOR, FREQUENCY_CEILING] rad/s so that
 * the band's ends (three decades below, nine above) stay normal, finite doubles: a corner at a
 * subnormal frequency (a coefficient like 1e-322) would otherwise put the low end at 0, where no
 * logarithmic grid or doubling search can start.
 */
const FREQUENCY_FLOOR = 1e-290;
const FREQUENCY_CEILING = 1e290;
const clampFrequency = (w: number) => Math.min(FREQUENCY_CEILING, Math.max(FREQUENCY_FLOOR, w));

function characteristicFrequencies(loop: FrequencyModel): number[] {
  return rawCharacteristicFrequencies(loop).map(clampFrequency);
}

function rawCharacteristicFrequencies(loop: FrequencyModel): number[] {
  const f = [...loop.characteristicFrequencies];
  const m = loop.integrators;
  if (m > 0 && Number.isFinite(loop.lowFrequencyGain) && loop.lowFrequencyGain !== 0) {
    f.push(Math.pow(Math.abs(loop.lowFrequencyGain), 1 / m));
  }
  if (loop.rational && loop.relativeDegree !== null && loop.relativeDegree > 0) {
    const c = loop.rational.numerator[0] / loop.rational.denominator[0];
    if (c !== 0 && Number.isFinite(c)) f.push(Math.pow(Math.abs(c), 1 / loop.relativeDegree));
  }
  // One filter for all of them: corners, the integrators' unity crossing and the asymptote's.
  const usable = f.filter((w) => w > 0 && Number.isFinite(w));
  return usable.length ? usable : [1];
}

/** Smallest ω ≥ start (by factors of 2) where bound(ω) < target; NaN if none before `limit`. */
function firstBelow(bound: (w: number) => number, target: number, start: number, limit: number): number {
  // The finiteness test ends the search even if `limit` were infinite (∞·2 = ∞ would never pass it).
  for (let w = start; w > 0 && w <= limit && Number.isFinite(w); w *= 2) if (bound(w) < target) return w;
  return NaN;
}

/**
 * The doubling search lands up to a factor 2 above where the bound crosses its target. Bisecting
 * that last step in log ω four times brings the point within 2^(1/16) (4.4 %) of the crossing.
 * The bound is nonincreasing, so the point returned still has bound < target, and so does every
 * frequency above it. A shorter band matters most with a delay, whose grid grows linearly with ω.
 */
function narrowBelow(bound: (w: number) => number, target: number, w: number): number {
  let lo = w / 2;
  let hi = w;
  for (let i = 0; i < 4; i++) {
    const mid = Math.sqrt(lo * hi);
    if (bound(mid) < target) hi = mid;
    else lo = mid;
  }
  return hi;
}

export function chooseBand(loop: FrequencyModel): AnalysisBand {
  // Measured data: the band is the data's; nothing is known beyond it.
  if (loop.sampledBand) return { min: loop.sampledBand.min, max: loop.sampledBand.max, sweepTo: loop.sampledBand.max, sweepBounded: false };
  const chars = characteristicFrequencies(loop);
  const lowest = Math.min(...chars);
  const highest = Math.max(...chars);
  const min = lowest / 1e3;
  const limit = highest * 1e9;
  const hf = loop.highFrequencyGain;
  let sweepTo = NaN;
  let negligible = NaN;
  // The bounds are nonincreasing, so the first frequency (doubling from the band's low end) where
  // one drops below its target holds for everything above it.
  // The negligible level is at or below the sweep's target, so no frequency before sweepTo is
  // below it either: its search continues the same doubling sequence from sweepTo (same answer,
  // half the bound evaluations).
  if (loop.relativeDegree === 0 && loop.delay === 0) {
    sweepTo = firstBelow(loop.deviationBoundAbove, Math.abs(1 + hf) / 2, min, limit);
    const negligibleTarget = NEGLIGIBLE_LOOP_GAIN * Math.abs(1 + hf);
    negligible = Number.isFinite(sweepTo) ? firstBelow(loop.deviationBoundAbove, negligibleTarget, sweepTo, limit) : NaN;
    if (Number.isFinite(negligible)) negligible = narrowBelow(loop.deviationBoundAbove, negligibleTarget, negligible);
  } else {
    const target = loop.relativeDegree === 0 ? (1 + Math.abs(hf)) / 2 : 0.5;
    sweepTo = firstBelow(loop.magnitudeBoundAbove, target, min, limit);
    const negligibleTarget = loop.relativeDegree === 0 ? target : Math.min(target, NEGLIGIBLE_LOOP_GAIN);
    negligible = Number.isFinite(sweepTo) ? firstBelow(loop.magnitudeBoundAbove, negligibleTarget, sweepTo, limit) : NaN;
    if (Number.isFinite(negligible)) negligible = narrowBelow(loop.magnitudeBoundAbove, negligibleTarget, negligible);
  }
  if (Number.isFinite(sweepTo)) {
    const max = Math.max(10 * highest, sweepTo, Number.isFinite(negligible) ? negligible : 0);
    return { min, max, sweepTo, sweepBounded: true };
  }
  // No proven bound (expressions): extend by decades until |L| is negligible over a whole decade.
  const v = { re: 0, im: 0 };
  let max = highest * 1e3;
  // Stops before ω (or the 3.7·ω evaluated with it) overflows, even if `limit` is infinite.
  for (let w = highest; w <= limit && Number.isFinite(3.7 * w); w *= 10) {
    loop.evaluate(w, v);
    const m1 = Math.hypot(v.re, v.im);
    loop.evaluate(w * 3.7, v);
    const m2 = Math.hypot(v.re, v.im);
    if (m1 < NEGLIGIBLE_LOOP_GAIN && m2 < NEGLIGIBLE_LOOP_GAIN) {
      max = Math.max(w * 10, 10 * highest);
      break;
    }
    max = w * 10;
  }
  return { min, max, sweepTo: max, sweepBounded: false };
}
