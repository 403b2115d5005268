/**
 * Frequency responses of L, S and T on the response grid, for plots and
 * callers. Phases are continued from the refined analysis grid (the nearest
 * analysis point at or below each response frequency plus the small turn
 * from there), so they are unwrapped consistently however coarse the
 * response grid is.
 */
import type { FrequencyModel } from '../model/frequency-model.js';
import { evaluateAll } from '../model/evaluate-all.js';
import type { LoopGrid } from './loop-grid.js';

export interface FrequencyResponse {
  frequency: number[];
  loop: { magnitudeDb: number[]; phaseDeg: number[]; real: number[]; imag: number[] };
  sensitivity: { magnitudeDb: number[]; phaseDeg: number[] };
  complementarySensitivity: { magnitudeDb: number[]; phaseDeg: number[] };
}

const DEG = 180 / Math.PI;
/** 10·log10(x) = DB_OF_SQUARED·ln(x) */
const DB_OF_SQUARED = 10 / Math.LN10;
const turning = (ar: number, ai: number, br: number, bi: number) => Math.atan2(ar * bi - ai * br, ar * br + ai * bi);

/** The loop's values on the response grid; kept between calls (per thread), which run to completion. */
let scratch = { re: new Float64Array(0), im: new Float64Array(0) };
function scratchFor(n: number): { re: Float64Array; im: Float64Array } {
  if (scratch.re.length < n) scratch = { re: new Float64Array(n), im: new Float64Array(n) };
  return scratch;
}

/**
 * The response at `frequencies`: a plain array is taken over as the answer's `frequency` (the
 * caller made it for this, analyze-loop.ts), a typed one (measured data) is copied.
 */
export function computeResponse(loop: FrequencyModel, grid: LoopGrid, frequencies: Float64Array | number[]): FrequencyResponse {
  const n = frequencies.length;
  // Plain arrays (what the answer is made of), sized once and filled in place.
  const frequency = Array.isArray(frequencies) ? frequencies : Array.from(frequencies);
  const magL = new Array<number>(n);
  const phL = new Array<number>(n);
  const reL = new Array<number>(n);
  const imL = new Array<number>(n);
  const magS = new Array<number>(n);
  const phS = new Array<number>(n);
  const magT = new Array<number>(n);
  const phT = new Array<number>(n);
  // All points in one batch (evaluate-all.ts), then the phases and magnitudes point by point.
  const values = scratchFor(n);
  evaluateAll(loop, frequencies, values.re, values.im, n);
  const g = grid.omega;
  let k = 0;
  for (let i = 0; i < n; i++) {
    const w = frequencies[i];
    while (k + 1 < g.length && g[k + 1] <= w) k++;
    const re = values.re[i];
    const im = values.im[i];
    const phaseL = grid.phaseDeg[k] + turning(grid.re[k], grid.im[k], re, im) * DEG;
    const argF = grid.returnArg[k] + turning(1 + grid.re[k], grid.im[k], 1 + re, im);
    // dB from squared magnitudes (10·log10 |x|², no square roots; by the natural log, which V8 computes
    // faster than log10), and |T| = |L|/|1 + L| as a difference of dB.
    const dbL = DB_OF_SQUARED * Math.log(re * re + im * im);
    const dbS = -DB_OF_SQUARED * Math.log((1 + re) * (1 + re) + im * im);
    reL[i] = re;
    imL[i] = im;
    magL[i] = dbL;
    phL[i] = phaseL;
    magS[i] = dbS;
    phS[i] = -argF * DEG;
    magT[i] = dbL + dbS;
    phT[i] = phaseL - argF * DEG;
  }
  return {
    frequency,
    loop: { magnitudeDb: magL, phaseDeg: phL, real: reL, imag: imL },
    sensitivity: { magnitudeDb: magS, phaseDeg: phS },
    complementarySensitivity: { magnitudeDb: magT, phaseDeg: phT },
  };
}
