/** Size limits of the estimation request, in one place so the HTTP schema can quote them. */

/** Longest record accepted, samples per channel. */
export const MAX_RECORD_SAMPLES = 2_000_000;

/**
 * Fewest segments an estimate may average. With one segment the coherence is
 * identically 1 whatever the data (Bendat & Piersol, Random Data, 4th ed.), so
 * two is the least that says anything; the response reports the count so
 * callers can demand more.
 */
export const MIN_SEGMENTS = 2;

/** Range of an explicitly requested segment length (powers of two). */
export const MIN_SEGMENT_LENGTH = 8;
export const MAX_SEGMENT_LENGTH = 2 ** 21;

/** Range of the default segment length. */
export const MIN_DEFAULT_SEGMENT_LENGTH = 64;
export const MAX_DEFAULT_SEGMENT_LENGTH = 65_536;

/** Averages the default segment length aims for. */
export const DEFAULT_TARGET_SEGMENTS = 8;

export const DEFAULT_OVERLAP = 0.5;

/**
 * Largest overlap fraction: every sample then enters at most ten segments,
 * which bounds the work per request at about ten FFT passes over the record.
 */
export const MAX_OVERLAP = 0.9;
