/**
 * Gain crossovers (|L(jω)| = 1) and phase crossovers (L(jω) real and
 * negative), located as sign changes on the refined grid and then refined on
 * the model itself by Brent's method in ln ω (R. P. Brent, 1973) to a few
 * ulps — far inside the 1e-12 relative change DESIGN.md asks for
 * (refine-crossing.ts).
 *
 * Phase crossovers are found as zeros of Im L/|L| = sin∠L with Re L < 0,
 * which needs no unwrapped phase and so cannot be misled by it.
 */
import type { FrequencyModel } from '../model/frequency-model.js';
import type { LoopGrid } from './loop-grid.js';
import { NEGLIGIBLE_LOOP_GAIN } from './frequency-band.js';
import { refineCrossing } from './refine-crossing.js';

export interface Crossing {
  frequency: number;
  re: number;
  im: number;
}

const logMagnitude = (re: number, im: number) => 0.5 * Math.log(re * re + im * im);
const sinPhase = (re: number, im: number) => im / Math.sqrt(re * re + im * im);

/** All ω in [min, max] where |L| = 1, ascending. */
export function gainCrossings(loop: FrequencyModel, grid: LoopGrid, min: number, max: number): Crossing[] {
  const out: Crossing[] = [];
  const { omega, magnitude } = grid;
  for (let i = 0; i + 1 < omega.length; i++) {
    if (omega[i] < min || omega[i + 1] > max || grid.straddlesPole[i]) continue;
    const a = magnitude[i] - 1;
    const b = magnitude[i + 1] - 1;
    if (a === 0) out.push({ frequency: omega[i], re: grid.re[i], im: grid.im[i] });
    else if (a * b < 0) out.push(refineCrossing(loop, grid, i, logMagnitude));
  }
  return out;
}

/**
 * All ω in [min, max] where L is real and negative, ascending. A loop
 * without integrators whose zero-frequency gain L(0) is negative (an
 * open-loop unstable first-order plant, say) has a genuine phase crossover
 * at ω = 0: scaling the gain by 1/|L(0)| puts a closed-loop pole at s = 0.
 * Loops with integrators have none there (DESIGN.md: a phase that starts at
 * −180° is not a gain margin).
 */
export function phaseCrossings(loop: FrequencyModel, grid: LoopGrid, min: number, max: number): Crossing[] {
  const out: Crossing[] = [];
  if (loop.integrators === 0) {
    const l0 = Number.isFinite(loop.lowFrequencyGain) ? loop.lowFrequencyGain : loop.evaluate(0, { re: 0, im: 0 }).re;
    if (l0 < 0 && Number.isFinite(l0)) out.push({ frequency: 0, re: l0, im: 0 });
  }
  const { omega, re, im } = grid;
  for (let i = 0; i + 1 < omega.length; i++) {
    if (omega[i] < min || omega[i + 1] > max || grid.straddlesPole[i]) continue;
    if (re[i] >= 0 && re[i + 1] >= 0) continue;
    const a = im[i];
    const b = im[i + 1];
    if (a === 0 && re[i] < 0 && i > 0) out.push({ frequency: omega[i], re: re[i], im: 0 });
    else if (a * b < 0) {
      const c = refineCrossing(loop, grid, i, sinPhase);
      // A delay makes phase crossovers go on for ever; those with |L| below
      // NEGLIGIBLE_LOOP_GAIN (gain margin above 60 dB) are not listed.
      if (c.re < 0 && -c.re >= NEGLIGIBLE_LOOP_GAIN) out.push(c);
    }
  }
  return out;
}
