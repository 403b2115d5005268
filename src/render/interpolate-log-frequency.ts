/**
 * Linear interpolation of a sampled curve in log-frequency, for placing a
 * mark (a crossover, a peak) on a plotted curve exactly where the plotted
 * polyline passes. Outside the samples it returns NaN rather than guessing.
 */
export function interpolateLogFrequency(frequency: readonly number[], values: readonly number[], omega: number): number {
  const n = frequency.length;
  if (n === 0 || !(omega >= frequency[0]) || !(omega <= frequency[n - 1])) return NaN;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (frequency[mid] <= omega) lo = mid;
    else hi = mid;
  }
  if (hi === lo) return values[lo];
  const t = (Math.log(omega) - Math.log(frequency[lo])) / (Math.log(frequency[hi]) - Math.log(frequency[lo]));
  return values[lo] + t * (values[hi] - values[lo]);
}
