/**
 * The loop evaluated on an adaptively refined logarithmic grid.
 *
 * A fixed grid misses crossings of lightly damped pairs and unwraps the
 * phase of long delays wrongly (DESIGN.md, "grid too coarse for the phase").
 * Starting from a log grid of BASE_DENSITY points per decade plus the
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
import { logGrid } from '../numeric/log-grid.js';

export const BASE_DENSITY = 40;
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
 * A delay turns the phase by ωT: on a log grid the step in ω eventually
 * exceeds half a turn and the turning angle aliases. Fill every gap wider
 * than MAX_DELAY_TURN/T with evenly spaced points.
 */
const MAX_DELAY_TURN = Math.PI / 3;
function fillDelayGaps(points: number[], phaseRate: number): number[] {
  if (!(phaseRate > 0)) return points;
  const step = MAX_DELAY_TURN / phaseRate;
  const out: number[] = [points[0]];
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    const parts = Math.ceil((b - a) / step);
    if (parts > 1) for (let k = 1; k < parts; k++) out.push(a + ((b - a) * k) / parts);
    out.push(b);
  }
  return out;
}

export function buildLoopGrid(loop: FrequencyModel, min: number, max: number, extra: ArrayLike<number> = []): LoopGrid {
  const decades = Math.log10(max / min);
  // Measured data: the analysis grid is the measured frequencies themselves.
  const base = loop.sampledBand
    ? Array.from(loop.sampledBand.frequencies)
    : Array.from(logGrid(min, max, Math.max(2, Math.ceil(decades * BASE_DENSITY) + 1)));
  const poleFrequencies = loop.imaginaryAxisPoles.map((p) => p.frequency);
  const poleOrders = loop.imaginaryAxisPoles.map((p) => p.order);
  const points = [...base, ...resonancePoints(loop, min, max), ...Array.from(extra)]
    .filter((w) => w >= min && w <= max && !poleFrequencies.includes(w))
    .sort((a, b) => a - b);
  const unique = points.filter((w, i) => i === 0 || w > points[i - 1]);
  const seeds = fillDelayGaps(unique, loop.phaseRate);

  const w: number[] = [];
  const re: number[] = [];
  const im: number[] = [];
  const v = { re: 0, im: 0 };
  const poleOrderBetween = (a: number, b: number) => {
    let order = 0;
    for (let k = 0; k < poleFrequencies.length; k++) if (poleFrequencies[k] > a && poleFrequencies[k] < b) order += poleOrders[k];
    return order;
  };
  let truncated = false;
  const maxPoints = Math.max(4_000, Math.min(MAX_GRID_POINTS, Math.floor(EVALUATION_BUDGET / (loop.evaluationCost ?? 1))));
  loop.evaluate(seeds[0], v);
  w.push(seeds[0]);
  re.push(v.re);
  im.push(v.im);
  // Depth-first bisection towards each next seed point.
  const stackW: number[] = [];
  const stackRe: number[] = [];
  const stackIm: number[] = [];
  for (let s = 1; s < seeds.length; s++) {
    loop.evaluate(seeds[s], v);
    stackW.push(seeds[s]);
    stackRe.push(v.re);
    stackIm.push(v.im);
    while (stackW.length) {
      const top = stackW.length - 1;
      const a = w.length - 1;
      const wa = w[a];
      const wb = stackW[top];
      const ar = re[a];
      const ai = im[a];
      const br = stackRe[top];
      const bi = stackIm[top];
      let refine = false;
      if (wb / wa - 1 > MIN_RELATIVE_WIDTH && w.length + stackW.length < maxPoints && poleOrderBetween(wa, wb) === 0) {
        const ma = ar * ar + ai * ai;
        const mb = br * br + bi * bi;
        const turnLimit = ma < 0.25 && mb < 0.25 ? MAX_TURN_L_SMALL : MAX_TURN_L;
        refine =
          Math.abs(turning(ar, ai, br, bi)) > turnLimit ||
          Math.abs(turning(1 + ar, ai, 1 + br, bi)) > MAX_TURN_F ||
          Math.abs(5 * Math.log10(mb / ma)) > MAX_STEP_DB;
      } else if (w.length + stackW.length >= maxPoints) {
        truncated = true;
      }
      if (refine) {
        const mid = Math.sqrt(wa * wb);
        loop.evaluate(mid, v);
        stackW.push(mid);
        stackRe.push(v.re);
        stackIm.push(v.im);
      } else {
        w.push(wb);
        re.push(br);
        im.push(bi);
        stackW.pop();
        stackRe.pop();
        stackIm.pop();
      }
    }
  }

  const n = w.length;
  const grid: LoopGrid = {
    omega: Float64Array.from(w),
    re: Float64Array.from(re),
    im: Float64Array.from(im),
    magnitude: new Float64Array(n),
    phaseDeg: new Float64Array(n),
    returnArg: new Float64Array(n),
    returnMagnitude: new Float64Array(n),
    straddlesPole: new Uint8Array(Math.max(0, n - 1)),
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
      if (order > 0) {
        grid.straddlesPole[i - 1] = 1;
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
