import type { EstimationDetrend } from './types.js';

/**
 * Removes, in place, the segment's mean ('mean') or its least-squares straight
 * line ('linear') before tapering, as Welch (1967) averaging usually does and
 * as scipy.signal.detrend does with type 'constant' / 'linear'. Offsets and
 * drifts would otherwise leak through the window's side lobes into the
 * lowest bins.
 *
 * The line is fitted against the centred index t = i − (n−1)/2, for which the
 * normal equations decouple: intercept = mean, slope = Σt·x / Σt², with
 * Σt² = n(n²−1)/12.
 */
export function detrendSegment(segment: Float64Array, mode: EstimationDetrend): void {
  if (mode === 'none') return;
  const n = segment.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += segment[i];
  const mean = sum / n;
  if (mode === 'mean') {
    for (let i = 0; i < n; i++) segment[i] -= mean;
    return;
  }
  const centre = (n - 1) / 2;
  let moment = 0;
  for (let i = 0; i < n; i++) moment += (i - centre) * segment[i];
  const slope = n > 1 ? moment / ((n * (n * n - 1)) / 12) : 0;
  for (let i = 0; i < n; i++) segment[i] -= mean + slope * (i - centre);
}
