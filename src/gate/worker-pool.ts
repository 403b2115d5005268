/**
 * A small pool of worker threads that check loops off the event loop, so a
 * large batch does not stall other callers. Chunks of loops from every
 * batch queue up in arrival order. Each worker holds up to PIPELINE chunks:
 * the one it checks and the next, already in its inbox, so that it does not
 * sit idle for the round trip through the event loop between chunks (about
 * a millisecond each way on a busy two-core machine, as long as checking a
 * few dozen loops).
 * Workers start on demand, are unref'd while idle (an idle pool never keeps
 * a process alive) and are replaced if one dies.
 *
 * The worker is the BUILT file dist/gate/check-worker.js: next to this file
 * when running from dist/, and found through the repository root when this
 * file runs as TypeScript source (under vitest).
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { LoopTask } from './check-loop.js';
import type { LoopOutcome } from './loop-outcome.js';
import type { ChunkReply, ChunkRequest } from './worker-messages.js';

export function workerFileUrl(): URL {
  return import.meta.url.endsWith('.ts')
    ? new URL('../../dist/gate/check-worker.js', import.meta.url)
    : new URL('./check-worker.js', import.meta.url);
}

interface Job {
  request: ChunkRequest;
  resolve: (outcomes: LoopOutcome[]) => void;
  reject: (err: Error) => void;
}

interface Slot {
  worker: Worker;
  /** Chunks handed to this worker, in order: the first is being checked, the others wait in its inbox. */
  jobs: Job[];
}

/** Chunks one worker holds at a time. */
const PIPELINE = 2;

export class LoopCheckPool {
  private readonly slots: Slot[] = [];
  private readonly queue: Job[] = [];
  private nextId = 1;
  private closed = false;

  constructor(readonly size: number = Math.max(1, availableParallelism())) {}

  /** Checks one chunk of loops on a worker. */
  runChunk(tasks: LoopTask[]): Promise<LoopOutcome[]> {
    if (this.closed) return Promise.reject(new Error('the loop-check pool is closed'));
    return new Promise((resolve, reject) => {
      this.queue.push({ request: { id: this.nextId++, tasks }, resolve, reject });
      this.dispatch();
    });
  }

  /** Number of worker threads started so far. */
  get started(): number {
    return this.slots.length;
  }

  async close(): Promise<void> {
    this.closed = true;
    const closing = new Error('the loop-check pool was closed');
    for (const job of this.queue.splice(0)) job.reject(closing);
    const slots = this.slots.splice(0);
    for (const s of slots) for (const job of s.jobs.splice(0)) job.reject(closing);
    await Promise.all(slots.map((s) => s.worker.terminate()));
  }

  /** An idle worker, else a new one while fewer than size run, else the least loaded below PIPELINE. */
  private chooseSlot(): Slot | null {
    const idle = this.slots.find((s) => s.jobs.length === 0);
    if (idle) return idle;
    if (this.slots.length < this.size) return this.spawn();
    let least: Slot | null = null;
    for (const s of this.slots) if (s.jobs.length < PIPELINE && (!least || s.jobs.length < least.jobs.length)) least = s;
    return least;
  }

  private dispatch(): void {
    while (this.queue.length) {
      const slot = this.chooseSlot();
      if (!slot) return;
      const job = this.queue.shift()!;
      slot.jobs.push(job);
      slot.worker.ref();
      slot.worker.postMessage(job.request);
    }
  }

  private spawn(): Slot {
    const worker = new Worker(workerFileUrl());
    const slot: Slot = { worker, jobs: [] };
    worker.on('message', (reply: ChunkReply) => {
      // Replies come in the order the chunks were handed over.
      const job = slot.jobs[0]?.request.id === reply.id ? slot.jobs.shift() : undefined;
      if (!slot.jobs.length) worker.unref();
      job?.resolve(reply.outcomes);
      this.dispatch();
    });
    const retire = (err: Error) => {
      const i = this.slots.indexOf(slot);
      if (i < 0) return;
      this.slots.splice(i, 1);
      // The chunk being checked fails; those still in the worker's inbox (possibly another batch's) go back to the front of the queue.
      const [checking, ...inbox] = slot.jobs.splice(0);
      this.queue.unshift(...inbox);
      checking?.reject(err);
      if (!this.closed) this.dispatch();
    };
    worker.on('error', (err) => retire(err));
    worker.on('exit', (code) => retire(new Error(`a loop-check worker exited with code ${code}`)));
    worker.unref();
    this.slots.push(slot);
    return slot;
  }
}
