/**
 * Phase unwrapping: adds whole turns so that successive samples differ by
 * less than half a turn (the usual rule, as in numpy.unwrap). It is only as
 * good as the grid: callers refine the grid wherever the phase turns fast.
 */
export function unwrapDegrees(wrapped: ArrayLike<number>, out = new Float64Array(wrapped.length)): Float64Array {
  let offset = 0;
  for (let i = 0; i < wrapped.length; i++) {
    if (i > 0) {
      const step = wrapped[i] + offset - out[i - 1];
      offset -= 360 * Math.round(step / 360);
    }
    out[i] = wrapped[i] + offset;
  }
  return out;
}

/** Wraps an angle in degrees to (−180, 180]. */
export function wrapDegrees(angle: number): number {
  let a = angle % 360;
  if (a <= -180) a += 360;
  else if (a > 180) a -= 360;
  return a;
}
