/**
 * `points` logarithmically spaced frequencies from `min` to `max` written into
 * `out` from `offset` on: the same values as logGrid (repeated
 * multiplication, last point exactly `max`), for callers that keep their own
 * storage and must not allocate per call.
 */
export function writeLogGrid(out: Float64Array, offset: number, min: number, max: number, points: number): void {
  if (points === 1) {
    out[offset] = min;
    return;
  }
  const ratio = Math.pow(max / min, 1 / (points - 1));
  let w = min;
  for (let i = 0; i < points; i++) {
    out[offset + i] = w;
    w *= ratio;
  }
  out[offset + points - 1] = max;
}
