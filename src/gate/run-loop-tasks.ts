/**
 * Runs a batch of loop checks: inline for small batches (yielding to the
 * event loop between loops), on the worker pool above
 * GATE_LIMITS.poolThreshold. Once a loop has been refused, chunks that
 * start after it are not sent: the request will be refused anyway, and the
 * refusal of the lowest loop index is the one reported.
 */
import type { LoopTask } from './check-loop.js';
import { GATE_LIMITS } from './limits.js';
import { runLoopTask, type LoopOutcome } from './loop-outcome.js';

/**
 * What checks chunks of loops off the event loop: the library's LoopCheckPool
 * (worker-pool.ts), or the service's compute pool with its time limit.
 */
export interface ChunkRunner {
  /** How many chunks it works on at once. */
  readonly size: number;
  runChunk(tasks: LoopTask[]): Promise<LoopOutcome[]>;
}

export interface RunOptions {
  /** The pool, or a function that makes it on first need. Without one every batch runs inline. */
  pool?: ChunkRunner | (() => ChunkRunner);
  /** Called after each loop or chunk with the number of loops done. */
  onProgress?: (done: number, total: number) => void;
  /** Batches larger than this use the pool (default GATE_LIMITS.poolThreshold). */
  poolThreshold?: number;
}

const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

async function runInline(tasks: readonly LoopTask[], onProgress?: RunOptions['onProgress']): Promise<LoopOutcome[]> {
  const out: LoopOutcome[] = [];
  for (const task of tasks) {
    const outcome = runLoopTask(task);
    out.push(outcome);
    onProgress?.(out.length, tasks.length);
    if (outcome.kind !== 'checked') break;
    await nextTurn();
  }
  return out;
}

/** Loops per chunk for a batch of `count` loops on `workers` workers (see GATE_LIMITS). */
export function chunkSize(count: number, workers: number): number {
  const even = Math.ceil(count / (Math.max(1, workers) * GATE_LIMITS.chunksPerWorker));
  return Math.min(GATE_LIMITS.maxChunkSize, Math.max(GATE_LIMITS.minChunkSize, even));
}

async function runPooled(pool: ChunkRunner, tasks: readonly LoopTask[], onProgress?: RunOptions['onProgress']): Promise<LoopOutcome[]> {
  const out: LoopOutcome[] = [];
  let firstRefused = Infinity;
  const chunks: LoopTask[][] = [];
  const size = chunkSize(tasks.length, pool.size);
  for (let i = 0; i < tasks.length; i += size) chunks.push(tasks.slice(i, i + size));
  // Two lanes per worker, each taking the next chunk when its last one is back: every worker has
  // the next chunk in its inbox when it finishes one (both pools hold two per worker), and a
  // batch keeps at most 2·pool.size chunks handed out, so concurrent batches interleave fairly.
  let next = 0;
  const lane = async () => {
    while (next < chunks.length) {
      const chunk = chunks[next++];
      if (chunk[0].index > firstRefused) continue;
      for (const o of await pool.runChunk(chunk)) {
        out.push(o);
        if (o.kind !== 'checked') firstRefused = Math.min(firstRefused, o.index);
      }
      onProgress?.(out.length, tasks.length);
    }
  };
  await Promise.all(Array.from({ length: Math.min(2 * pool.size, chunks.length) }, lane));
  return out;
}

export async function runLoopTasks(tasks: readonly LoopTask[], options: RunOptions = {}): Promise<LoopOutcome[]> {
  const threshold = options.poolThreshold ?? GATE_LIMITS.poolThreshold;
  if (!options.pool || tasks.length <= threshold) return runInline(tasks, options.onProgress);
  const pool = typeof options.pool === 'function' ? options.pool() : options.pool;
  return runPooled(pool, tasks, options.onProgress);
}
