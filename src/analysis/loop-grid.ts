/**
 * The loop evaluated on an adaptively refined logarithmic grid.
 *
 * A fixed grid misses crossings of lightly damped pairs and unwraps the
 * phase of long delays wrongly (DESIGN.md, "grid too coarse for the phase").
 * Starting from a log grid of BASE_DENSITY points per decade (ROOTED_DENSITY
 * for rational loops with known roots) plus the
 * natural frequencies of the model's complex roots, every interval is
 * bisected (in log ω) while L turns by more than MAX_TURN_L (MAX_TURN_L_SMALL
 * where |L| < 1/2), |L| changes by
 * more than MAX_STEP_DB, or 1 + L turns by more than MAX_TURN_F between its
 * ends. The unwrapped phases of L and of 1 + L are then sums of turning
 * angles below those limits, so they are continuous by construction.
 *
 * Intervals that straddle a pole on the imaginary axis are not refined; the
 * contour goes round the pole on the right, so the phase there changes by
 * −order·180° (Åström & Murray, Feedback Systems, §10.2, indented contour).
 */
import type { FrequencyModel } from '../model/frequency-model.js';
import { evaluateAll } from '../model/evaluate-all.js';
import { writeLogGrid } from '../numeric/write-log-grid.js';
import { SampleBuffer } from './sample-buffer.js';

export const BASE_DENSITY = 40;
/**
 * Base density for continuous rational loops (times a delay), whose roots are
 * known: every complex pole and zero seeds its own resonance points and the
 * delay fills its own gaps, so the log grid only has to follow real corners
 * (at most 90° over two decades each, about 13° per step at ten points a
 * decade, under half the MAX_TURN_L limit), and refinement adds points
 * wherever L turns or steps. Measured at 20 a decade against 40: a third
 * fewer evaluations. At 10 against 20: the benchmark's delayed loop goes from
 * 298 to 250 evaluations and its 10th-order loop from 212 to 168. The
 * 40-digit reference fixture still passes at its tolerances (every listed
 * phase crossover found, figures to 1e-8), because every figure is refined
 * on the model itself.
 */
export const ROOTED_DENSITY = 10;
const MAX_TURN_L = (30 * Math.PI) / 180;
/** Where |L| < 1/2 the critical point is far away; L only needs to turn less than half a turn per step to keep crossings and unwrapping unambiguous. */
const MAX_TURN_L_SMALL = (90 * Math.PI) / 180;
const MAX_TURN_F = (20 * Math.PI) / 180;
const MAX_STEP_DB = 3;
const MIN_RELATIVE_WIDTH = 1e-9;
export const MAX_GRID_POINTS = 60_000;
/** Model evaluations (in units of evaluationCost) one grid may spend: bounds the time an expression can take. */
const EVALUATION_BUDGET = 4_000_000;

export interface LoopGrid {
  omega: Float64Array;
  re: Float64Array;
  im: Float64Array;
  /** |L| */
  magnitude: Float64Array;
  /** Unwrapped phase of L in degrees. */
  phaseDeg: Float64Array;
  /** Unwrapped argument of 1 + L in radians, starting from its principal value. */
  returnArg: Float64Array;
  /** |1 + L| */
  returnMagnitude: Float64Array;
  /** Interval i (between points i and i+1) contains a pole on the imaginary axis. */
  straddlesPole: Uint8Array;
  /** True when refinement stopped at the point budget. */
  truncated: boolean;
}

/** Signed angle from a to b in (−π, π]. */
const turning = (ar: number, ai: number, br: number, bi: number) => Math.atan2(ar * bi - ai * br, ar * br + ai * bi);

const wrapPi = (x: number) => x - 2 * Math.PI * Math.round(x / (2 * Math.PI));

/** Extra grid points: natural frequencies of complex roots, with neighbours at ±ζωn. */
function resonancePoints(loop: FrequencyModel, min: number, max: number): number[] {
  const out: number[] = [];
  for (const r of [...(loop.poles ?? []), ...(loop.zeros ?? [])]) {
    if (r.im <= 0) continue;
    const wn = Math.hypot(r.re, r.im);
    const half = Math.abs(r.re);
    for (const w of [r.im, wn, r.im - half, r.im + half]) if (w > min && w < max) out.push(w);
  }
  for (const p of loop.imaginaryAxisPoles) {
    out.push(p.frequency * (1 - 1e-7), p.frequency * (1 + 1e-7));
  }
  return out;
}

/**
 * Working storage kept between calls (per thread): the builder runs to
 * completion synchronously and copies its result out, so reusing it is safe,
 * and a grid then costs one allocation instead of one per array and per
 * doubling (see sample-buffer.ts for why that matters).
 */
const scratch = {
  seeds: new Float64Array(1024),
  filled: new Float64Array(1024),
  seedRe: new Float64Array(1024),
  seedIm: new Float64Array(1024),
  done: new SampleBuffer(1024),
  stack: new SampleBuffer(64),
};

function roomFor(key: 'seeds' | 'filled' | 'seedRe' | 'seedIm', size: number): Float64Array {
  if (scratch[key].length < size) scratch[key] = new Float64Array(Math.max(size, 2 * scratch[key].length));
  return scratch[key];
}

/**
 * A delay turns the phase by ωT: on a log grid the step in ω eventually
 * exceeds half a turn and the turning angle aliases. Fill every gap wider
 * than MAX_DELAY_TURN/T with evenly spaced points.
 */
const MAX_DELAY_TURN = Math.PI / 3;
function fillDelayGaps(points: Float64Array, phaseRate: number): Float64Array {
  if (!(phaseRate > 0) || points.length < 2) return points;
  const step = MAX_DELAY_TURN / phaseRate;
  let count = points.length;
  for (let i = 1; i < points.length; i++) count += Math.max(0, Math.ceil((points[i] - points[i - 1]) / step) - 1);
  const out = roomFor('filled', count);
  let n = 0;
  out[n++] = points[0];
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    const parts = Math.ceil((b - a) / step);
    if (parts > 1) for (let k = 1; k < parts; k++) out[n++] = a + ((b - a) * k) / parts;
    out[n++] = b;
  }
  return out.subarray(0, n);
}

/** The seed frequencies in [min, max], strictly increasing, without the imaginary-axis poles themselves. */
function seedFrequencies(loop: FrequencyModel, min: number, max: number, extra: ArrayLike<number>, poleFrequencies: number[]): Float64Array {
  const more = [...resonancePoints(loop, min, max), ...Array.from(extra)];
  // Measured data: the analysis grid is the measured frequencies themselves.
  const sampled = loop.sampledBand?.frequencies;
  const density = loop.rational && loop.poles && loop.zeros ? ROOTED_DENSITY : BASE_DENSITY;
  const baseCount = sampled ? sampled.length : Math.max(2, Math.ceil((Math.log10(max) - Math.log10(min)) * density) + 1);
  const all = roomFor('seeds', baseCount + more.length).subarray(0, baseCount + more.length);
  if (sampled) all.set(sampled);
  else writeLogGrid(all, 0, min, max, baseCount);
  for (let i = 0; i < more.length; i++) all[baseCount + i] = more[i];
  all.sort();
  let n = 0;
  for (let i = 0; i < all.length; i++) {
    const w = all[i];
    if (!(w >= min && w <= max) || poleFrequencies.includes(w) || (n > 0 && !(w > all[n - 1]))) continue;
    all[n++] = w;
  }
  return all.subarray(0, n);
}

/** tan of a turning limit; a limit of a quarter turn or more is tested on the dot product alone. */
const tanOfLimit = (angle: number) => (angle >= Math.PI / 2 ? Infinity : Math.tan(angle));
const TAN_TURN_L = tanOfLimit(MAX_TURN_L);
const TAN_TURN_L_SMALL = tanOfLimit(MAX_TURN_L_SMALL);
const TAN_TURN_F = tanOfLimit(MAX_TURN_F);
/**
 * The magnitude test compares 5·log10(mb/ma) of the squared magnitudes with
 * MAX_STEP_DB (as the grid always has; that is half the step in dB of |L|),
 * written as a ratio so that it needs no logarithm.
 */
const MAX_SQUARED_RATIO = Math.pow(10, MAX_STEP_DB / 5);

/**
 * True when the turn from a to b exceeds the limit whose tangent is given
 * (|∠| > θ ⇔ a·b < 0 or |a×b| > tan θ·(a·b), for θ ≤ 90°): the same test
 * as comparing atan2 of cross and dot products with θ, without the atan2.
 */
function turnsMoreThan(ar: number, ai: number, br: number, bi: number, tanLimit: number): boolean {
  const dot = ar * br + ai * bi;
  return dot < 0 || Math.abs(ar * bi - ai * br) > tanLimit * dot;
}

/** The refinement rule of the header: L turns too far, 1 + L turns too far, or |L| steps by more than MAX_STEP_DB. */
function needsRefinement(ar: number, ai: number, br: number, bi: number): boolean {
  const ma = ar * ar + ai * ai;
  const mb = br * br + bi * bi;
  const tanL = ma < 0.25 && mb < 0.25 ? TAN_TURN_L_SMALL : TAN_TURN_L;
  if (turnsMoreThan(ar, ai, br, bi, tanL) || turnsMoreThan(1 + ar, ai, 1 + br, bi, TAN_TURN_F)) return true;
  const ratio = mb / ma;
  return ratio > MAX_SQUARED_RATIO || ratio < 1 / MAX_SQUARED_RATIO;
}

/**
 * The grid's columns in their own buffer, which the grid keeps: for callers that hold a grid as
 * long as they like.
 */
export function buildLoopGrid(loop: FrequencyModel, min: number, max: number, extra: ArrayLike<number> = []): LoopGrid {
  return buildGrid(loop, min, max, extra, null, false);
}

/**
 * This thread's buffer for the columns of the grid in use, taken by withLoopGrid and given back
 * when its callback returns (null while lent). An ArrayBuffer is allocated outside V8's heap: on
 * the benchmark machine one of 10 KB cost about 4 µs to allocate. With the buffer reused, the
 * benchmark's analyses took 0.94–0.96 of the time (in-process A/B, 7 alternating rounds).
 */
let spare: ArrayBuffer | null = null;
/** Buffers of larger grids are not kept, so a thread holds at most this much between calls. */
const SPARE_LIMIT_BYTES = 1 << 20;

/**
 * Builds the grid and passes it to `use`. The grid's columns live in a buffer that is reused by
 * the next call once `use` has returned, so `use` must copy out whatever it keeps. A call made
 * inside `use` (while the buffer is lent) builds its grid in a buffer of its own.
 */
export function withLoopGrid<T>(loop: FrequencyModel, min: number, max: number, use: (grid: LoopGrid) => T): T {
  const lent = spare;
  spare = null;
  const grid = buildGrid(loop, min, max, [], lent, true);
  try {
    return use(grid);
  } finally {
    const buffer = grid.omega.buffer as ArrayBuffer;
    spare = buffer.byteLength <= SPARE_LIMIT_BYTES ? buffer : lent;
  }
}

/** The byte length of a grid of n points: seven columns of doubles, then one flag per interval. */
const gridBytes = (n: number) => 7 * 8 * n + Math.max(0, n - 1);

/** `storage`: a buffer to write the columns into if it is large enough; `reusable`: a new one gets room to spare for the next grid. */
function buildGrid(
  loop: FrequencyModel,
  min: number,
  max: number,
  extra: ArrayLike<number>,
  storage: ArrayBuffer | null,
  reusable: boolean,
): LoopGrid {
  const poleFrequencies = loop.imaginaryAxisPoles.map((p) => p.frequency);
  const poleOrders = loop.imaginaryAxisPoles.map((p) => p.order);
  const seeds = fillDelayGaps(seedFrequencies(loop, min, max, extra, poleFrequencies), loop.phaseRate);

  const v = { re: 0, im: 0 };
  const poleOrderBetween = (a: number, b: number) => {
    let order = 0;
    for (let k = 0; k < poleFrequencies.length; k++) if (poleFrequencies[k] > a && poleFrequencies[k] < b) order += poleOrders[k];
    return order;
  };
  let truncated = false;
  const maxPoints = Math.max(4_000, Math.min(MAX_GRID_POINTS, Math.floor(EVALUATION_BUDGET / (loop.evaluationCost ?? 1))));
  const done = scratch.done;
  done.reset(2 * seeds.length);
  // The seeds in one batch (evaluate-all.ts), which costs a rational loop about half of one call per point.
  const seedRe = roomFor('seedRe', seeds.length);
  const seedIm = roomFor('seedIm', seeds.length);
  evaluateAll(loop, seeds, seedRe, seedIm, seeds.length);
  done.push(seeds[0], seedRe[0], seedIm[0]);
  // Depth-first bisection towards each next seed point.
  const stack = scratch.stack;
  stack.reset(64);
  for (let s = 1; s < seeds.length; s++) {
    stack.push(seeds[s], seedRe[s], seedIm[s]);
    while (stack.length) {
      const top = stack.length - 1;
      const a = done.length - 1;
      const wa = done.omega[a];
      const wb = stack.omega[top];
      const br = stack.re[top];
      const bi = stack.im[top];
      let refine = false;
      if (wb / wa - 1 > MIN_RELATIVE_WIDTH && done.length + stack.length < maxPoints && poleOrderBetween(wa, wb) === 0) {
        refine = needsRefinement(done.re[a], done.im[a], br, bi);
      } else if (done.length + stack.length >= maxPoints) {
        truncated = true;
      }
      if (refine) {
        const mid = Math.sqrt(wa * wb);
        loop.evaluate(mid, v);
        stack.push(mid, v.re, v.im);
      } else {
        done.push(wb, br, bi);
        stack.pop();
      }
    }
  }

  // Every column of the result is a view into one buffer: the one lent, if it is large enough.
  const n = done.length;
  const buffer = storage && storage.byteLength >= gridBytes(n) ? storage : new ArrayBuffer(gridBytes(reusable ? Math.ceil(1.5 * n) : n));
  const column = (k: number) => new Float64Array(buffer, 8 * n * k, n);
  const w = column(0);
  const re = column(1);
  const im = column(2);
  w.set(done.omega.subarray(0, n));
  re.set(done.re.subarray(0, n));
  im.set(done.im.subarray(0, n));
  const grid: LoopGrid = {
    omega: w,
    re,
    im,
    magnitude: column(3),
    phaseDeg: column(4),
    returnArg: column(5),
    returnMagnitude: column(6),
    straddlesPole: new Uint8Array(buffer, 7 * 8 * n, Math.max(0, n - 1)),
    truncated,
  };
  // Phase anchor: the low-frequency asymptote K0/(jω)^m has phase −90°·m (−180° more when K0 < 0).
  const principal = (Math.atan2(im[0], re[0]) * 180) / Math.PI;
  let start = principal;
  if (loop.referencePhaseDeg) {
    const reference = loop.referencePhaseDeg(w[0]);
    start = principal + 360 * Math.round((reference - principal) / 360);
  } else if (Number.isFinite(loop.lowFrequencyGain) && loop.lowFrequencyGain !== 0) {
    const anchor = -90 * loop.integrators - (loop.lowFrequencyGain < 0 ? 180 : 0);
    start = principal + 360 * Math.round((anchor - principal) / 360);
  }
  let phase = (start * Math.PI) / 180;
  let fArg = Math.atan2(im[0], 1 + re[0]);
  for (let i = 0; i < n; i++) {
    if (i > 0) {
      let dL = turning(re[i - 1], im[i - 1], re[i], im[i]);
      let dF = turning(1 + re[i - 1], im[i - 1], 1 + re[i], im[i]);
      const order = poleOrderBetween(w[i - 1], w[i]);
      // Written for every interval: a reused buffer holds the flags of the grid before.
      grid.straddlesPole[i - 1] = order > 0 ? 1 : 0;
      if (order > 0) {
        dL = -order * Math.PI + wrapPi(dL + order * Math.PI);
        dF = -order * Math.PI + wrapPi(dF + order * Math.PI);
      }
      phase += dL;
      fArg += dF;
    }
    grid.magnitude[i] = Math.sqrt(re[i] * re[i] + im[i] * im[i]);
    grid.phaseDeg[i] = (phase * 180) / Math.PI;
    grid.returnArg[i] = fArg;
    const fr = 1 + re[i];
    grid.returnMagnitude[i] = Math.sqrt(fr * fr + im[i] * im[i]);
  }
  return grid;
}
