import {
  DEFAULT_TARGET_SEGMENTS,
  MAX_DEFAULT_SEGMENT_LENGTH,
  MIN_DEFAULT_SEGMENT_LENGTH,
} from './limits.js';

/**
 * Default Welch segment length for a record of `recordLength` samples: the
 * largest power of two n that still gives at least 8 segments at 50 % overlap,
 * clamped to 64 ≤ n ≤ 65536.
 *
 * Why: the random error of H1 and coherence falls as 1/√nd (Bendat & Piersol,
 * Random Data, 4th ed.), while the frequency resolution fs/n and the leakage
 * bias improve with n; 8 averages is a common-practice compromise. At 50 %
 * overlap the count is ⌊2N/n⌋ − 1, so "at least 8" means n ≤ 2N/9. Below 64
 * samples a segment resolves too little to be useful; above 65536 the
 * response grows large without helping a loop review.
 *
 * Short records (N < 288) still get 64 and fewer than 8 segments; the
 * request check rejects them only below `MIN_SEGMENTS`.
 */
export function defaultSegmentLength(recordLength: number): number {
  // Integer form of 2N/n − 1 ≥ K, i.e. (K + 1)·n ≤ 2N, so no rounding can bite.
  const fits = (n: number): boolean => (DEFAULT_TARGET_SEGMENTS + 1) * n <= 2 * recordLength;
  let n = MIN_DEFAULT_SEGMENT_LENGTH;
  while (n < MAX_DEFAULT_SEGMENT_LENGTH && fits(n * 2)) n *= 2;
  return n;
}
