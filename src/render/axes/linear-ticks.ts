/**
 * Tick values for a linear axis at "nice" steps 1, 2 or 5 × 10ⁿ, after
 * Heckbert, "Nice numbers for graph labels", Graphics Gems (1990), with the
 * step chosen so that about `target` intervals cover [lo, hi].
 * `preferredSteps` lets an axis with a natural unit (phase: 45°, 90°, 180°)
 * use those instead.
 */
export interface LinearTicks {
  /** Axis limits widened outward to whole steps. */
  lo: number;
  hi: number;
  step: number;
  values: number[];
}

export function niceStep(span: number, target: number): number {
  const raw = span / Math.max(1, target);
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  const f = raw / power;
  const nice = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
  return nice * power;
}

export function linearTicks(lo: number, hi: number, target = 5, preferredSteps?: readonly number[]): LinearTicks {
  if (!(hi > lo)) {
    const pad = Math.abs(lo) > 0 ? Math.abs(lo) * 0.1 : 1;
    return linearTicks(lo - pad, lo + pad, target, preferredSteps);
  }
  const span = hi - lo;
  let step = niceStep(span, target);
  if (preferredSteps?.length) {
    const raw = span / target;
    step = preferredSteps.find((s) => s >= raw) ?? niceStep(span, target);
  }
  const first = Math.floor(lo / step + 1e-9);
  const last = Math.ceil(hi / step - 1e-9);
  const values: number[] = [];
  for (let i = first; i <= last; i++) values.push(roundToStep(i * step, step));
  return { lo: first * step, hi: last * step, step, values };
}

/** Removes binary noise such as 0.30000000000000004 from a multiple of the step. */
function roundToStep(v: number, step: number): number {
  const decimals = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  return Number(v.toFixed(Math.min(20, decimals)));
}
