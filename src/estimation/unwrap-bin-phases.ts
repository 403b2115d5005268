import { unwrapDegrees, wrapDegrees } from '../numeric/unwrap.js';

/**
 * Unwrapped phase (degrees) of a spectrum from bin 0 up to Nyquist.
 *
 * Unwrapping (numpy.unwrap's rule: neighbours differ by less than half a
 * turn) starts at bin 1 with its principal value in (−180°, 180°], not at
 * DC: with the mean removed the DC bin carries little power and its phase
 * (0° or 180° for a real record) is a poor anchor, and anchoring there could
 * shift the whole curve by a turn. The DC bin is then put on the branch
 * nearest to bin 1. Like any unwrapping it assumes the phase turns less than
 * 180° between bins; resolution is fs/segmentLength.
 */
export function unwrapBinPhases(re: Float64Array, im: Float64Array): Float64Array {
  const bins = re.length;
  const wrapped = new Float64Array(bins);
  for (let k = 0; k < bins; k++) wrapped[k] = (Math.atan2(im[k], re[k]) * 180) / Math.PI;
  const phase = new Float64Array(bins);
  if (bins < 2) {
    phase.set(wrapped);
    return phase;
  }
  unwrapDegrees(wrapped.subarray(1), phase.subarray(1));
  phase[0] = phase[1] + wrapDegrees(wrapped[0] - phase[1]);
  return phase;
}
