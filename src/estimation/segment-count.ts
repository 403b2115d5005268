/**
 * Number of whole segments of `segmentLength` samples, each starting
 * `segmentLength − overlapSamples` after the previous one, that fit in a
 * record; trailing samples that do not fill a segment are left out, as in
 * Welch (1967) and scipy.signal.welch.
 */
export function segmentCount(recordLength: number, segmentLength: number, overlapSamples: number): number {
  if (recordLength < segmentLength) return 0;
  return Math.floor((recordLength - overlapSamples) / (segmentLength - overlapSamples));
}
