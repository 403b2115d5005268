/**
 * The factor between neighbouring points. max/min overflows beyond about
 * 1e308 (a band from 1e-290 to 1e290 rad/s, say), so such a span is
 * taken through its logarithms; within range the plain ratio is kept, and
 * with it every grid's exact values.
 */
export function logStep(min: number, max: number, points: number): number {
  const span = max / min;
  return Number.isFinite(span) ? Math.pow(span, 1 / (points - 1)) : Math.exp((Math.log(max) - Math.log(min)) / (points - 1));
}

/**
 * `points` logarithmically spaced frequencies from `min` to `max` written into
 * `out` from `offset` on by repeated multiplication, last point exactly
 * `max`, for callers that keep their own storage and must not allocate per
 * call (logGrid is this into a new array).
 */
export function writeLogGrid(out: Float64Array | number[], offset: number, min: number, max: number, points: number): void {
  if (points === 1) {
    out[offset] = min;
    return;
  }
  const ratio = logStep(min, max, points);
  let w = min;
  for (let i = 0; i < points; i++) {
    out[offset + i] = w;
    w *= ratio;
  }
  out[offset + points - 1] = max;
}
