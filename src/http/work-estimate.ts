/**
 * An up-front estimate of the work a request asks for, read from the raw
 * body before any model is built, so that a request over the configured
 * budget is refused at once (413) instead of occupying a core.
 *
 * Every object with a `plant` object inside it counts as one loop, so the
 * estimate covers single analyses, batches of checks, comparisons and
 * whatever route comes next without knowing its schema. A loop's work is
 * (frequency points) × (model order): the analysis grid is adaptive, so a
 * fixed allowance of ANALYSIS_GRID_ALLOWANCE points is added to the
 * response grid the caller asked for. The order of an expression is taken
 * as its length in characters, since each evaluation walks its whole tree.
 * The longest array of numbers anywhere (records, measured data) is
 * reported too.
 */

export const ANALYSIS_GRID_ALLOWANCE = 2_000;
const MAX_WALK_DEPTH = 64;

export interface LoopEstimate {
  kind: string;
  order: number;
  /** Response-grid points asked for (0 when left to the analysis). */
  requestedPoints: number;
  /** Points the estimate charges: requestedPoints + ANALYSIS_GRID_ALLOWANCE. */
  points: number;
}

export interface WorkEstimate {
  loops: LoopEstimate[];
  /** Σ points × max(order, 1) over the loops. */
  work: number;
  /** Elements of the longest array of numbers in the body. */
  longestRecord: number;
}

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);
const len = (v: unknown): number => (Array.isArray(v) ? v.length : 0);

/** Model order as far as the raw description tells it; unknown kinds use their longest array. */
export function plantOrder(plant: Json): number {
  switch (plant.kind) {
    case 'transfer-function':
      return Math.max(len(plant.numerator), len(plant.denominator)) - 1;
    case 'zeros-poles':
      return Math.max(len(plant.zeros), len(plant.poles));
    case 'state-space':
      return len(plant.a);
    case 'expression':
      return typeof plant.expression === 'string' ? plant.expression.length : 0;
    default: {
      let longest = 0;
      for (const v of Object.values(plant)) longest = Math.max(longest, len(v));
      return longest;
    }
  }
}

function requestedPoints(loop: Json): number {
  const f = loop.frequency;
  const p = isObject(f) ? f.points : undefined;
  return typeof p === 'number' && Number.isFinite(p) && p > 0 ? Math.min(p, 1e9) : 0;
}

export function estimateWork(body: unknown): WorkEstimate {
  const loops: LoopEstimate[] = [];
  let longestRecord = 0;
  const stack: { value: unknown; depth: number }[] = [{ value: body, depth: 0 }];
  while (stack.length) {
    const { value, depth } = stack.pop()!;
    if (depth > MAX_WALK_DEPTH || typeof value !== 'object' || value === null) continue;
    if (Array.isArray(value)) {
      if (value.length > longestRecord && typeof value[0] === 'number') longestRecord = value.length;
      for (const v of value) if (typeof v === 'object' && v !== null) stack.push({ value: v, depth: depth + 1 });
      continue;
    }
    const plant = (value as Json).plant;
    if (isObject(plant)) {
      const order = Math.max(0, plantOrder(plant));
      const requested = requestedPoints(value as Json);
      loops.push({ kind: typeof plant.kind === 'string' ? plant.kind.slice(0, 40) : 'unknown', order, requestedPoints: requested, points: requested + ANALYSIS_GRID_ALLOWANCE });
    }
    for (const key of Object.keys(value)) {
      const v = (value as Json)[key];
      if (typeof v === 'object' && v !== null) stack.push({ value: v, depth: depth + 1 });
    }
  }
  const work = loops.reduce((sum, l) => sum + l.points * Math.max(l.order, 1), 0);
  return { loops, work, longestRecord };
}
