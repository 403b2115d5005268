/**
 * Bandwidths (Skogestad & Postlethwaite, Multivariable Feedback Control,
 * 2nd ed., §2.4.5):
 * - closed loop: the lowest ω where |T| falls to |T(0)|/√2 (3 dB below its
 *   zero-frequency value);
 * - sensitivity ωB: the lowest ω where |S| first rises through 1/√2 from below;
 * - crossover ωc: the lowest gain crossover.
 * Each level crossing is refined on the model by Brent's method in ln ω
 * (refine-crossing.ts).
 */
import type { FrequencyModel } from '../model/frequency-model.js';
import { refineCrossing } from './refine-crossing.js';
import type { LoopGrid } from './loop-grid.js';
import { closedLoopLimits } from './peaks.js';

export interface Bandwidth {
  closedLoop: number | null;
  sensitivity: number | null;
  crossover: number | null;
}

function levelCrossing(
  loop: FrequencyModel,
  grid: LoopGrid,
  value: (re: number, im: number) => number,
  level: number,
  direction: 'falling' | 'rising',
): number | null {
  const { omega, re, im } = grid;
  let previous = value(re[0], im[0]) - level;
  // The crossing must happen on the grid: starting on the wrong side means "never first crosses".
  if (direction === 'falling' ? previous <= 0 : previous >= 0) return null;
  for (let i = 1; i < omega.length; i++) {
    const current = value(re[i], im[i]) - level;
    if (direction === 'falling' ? current <= 0 : current >= 0) {
      if (current === 0) return omega[i];
      return refineCrossing(loop, grid, i - 1, (r, m) => value(r, m) - level).frequency;
    }
    previous = current;
  }
  return null;
}

const magnitudeT = (re: number, im: number) => Math.sqrt(re * re + im * im) / Math.sqrt((1 + re) * (1 + re) + im * im);
const magnitudeS = (re: number, im: number) => 1 / Math.sqrt((1 + re) * (1 + re) + im * im);

export function computeBandwidth(loop: FrequencyModel, grid: LoopGrid, lowestGainCrossover: number | null): Bandwidth {
  const limits = closedLoopLimits(loop);
  const t0 = Number.isFinite(limits.zero.complementarySensitivity)
    ? limits.zero.complementarySensitivity
    : magnitudeT(grid.re[0], grid.im[0]);
  return {
    closedLoop: t0 > 0 ? levelCrossing(loop, grid, magnitudeT, t0 / Math.SQRT2, 'falling') : null,
    sensitivity: levelCrossing(loop, grid, magnitudeS, Math.SQRT1_2, 'rising'),
    crossover: lowestGainCrossover,
  };
}
