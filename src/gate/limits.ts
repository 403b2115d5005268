/** Size limits and tuning of the review gate. */
export const GATE_LIMITS = {
  /** Loops in one POST /v1/checks (beyond: 413 too_many_loops). */
  maxLoops: 1000,
  maxNameLength: 200,
  /** Body limit of POST /v1/checks only: 1,000 loops of a few kB each. */
  maxCheckBodyBytes: 8 * 1024 * 1024,
  /** Batches above this many loops run on worker threads; smaller ones inline. */
  poolThreshold: 32,
  /**
   * Loops handed to a worker at a time: at least minChunkSize, growing with the batch so that each
   * worker gets about chunksPerWorker chunks (a round trip to a worker costs about as much as a
   * loop, so chunks of four made the pool no faster than one thread), at most maxChunkSize so
   * progress reports and concurrent requests still interleave.
   */
  minChunkSize: 4,
  maxChunkSize: 64,
  chunksPerWorker: 4,
} as const;
