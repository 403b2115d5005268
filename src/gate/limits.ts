/** Size limits and tuning of the review gate. */
export const GATE_LIMITS = {
  /** Loops in one POST /v1/checks (beyond: 413 too_many_loops). */
  maxLoops: 1000,
  maxNameLength: 200,
  /** Body limit of POST /v1/checks only: 1,000 loops of a few kB each. */
  maxCheckBodyBytes: 8 * 1024 * 1024,
  /** Batches above this many loops run on worker threads; smaller ones inline. */
  poolThreshold: 32,
  /** Loops handed to a worker at a time: small enough for progress and fairness between requests. */
  chunkSize: 4,
} as const;
