/**
 * Runs computations on worker threads with a hard time limit, counted from
 * the moment the task is accepted (waiting for a worker included): a task
 * still waiting or running when its time is up is answered with 503
 * `analysis_timeout`; a running one has its worker terminated and a
 * replacement started at once, so one pathological request cannot hold a
 * core for longer than the limit.
 * Tasks wait in a bounded queue; when it is full the caller gets 503
 * `overloaded` at once instead of queueing without bound.
 *
 * Each worker is handed up to `pipeline` tasks at a time (two by default;
 * up to four light ones, see chooseSlot): the next one is already in its
 * inbox when it finishes the current one.
 * Without that a worker sat idle for a whole round trip through the event
 * loop after every task. A cheap analysis costs less than that round trip
 * on a busy two-core machine. The tasks on one worker run in the order they
 * were accepted, so the first is the one computing and has the earliest
 * deadline. When it is stopped, the tasks queued behind it go back to the
 * front of the queue with what is left of their time.
 *
 * With size 0 the tasks run inline on the main thread (tests, embedding):
 * then only the up-front compute budget bounds them.
 *
 * The worker is the BUILT file dist/http/compute-worker.js: next to this
 * file when running from dist/, found through the repository root when this
 * file runs as TypeScript source (under vitest).
 */
import { Worker } from 'node:worker_threads';
import { LoopgateError, isErrorCode } from '../contract/errors.js';
import { guardRawBody } from '../contract/input-guards.js';
import { COMPUTE_TASKS, type ComputeReply, type ComputeResult, type ComputeTaskName } from './compute-tasks.js';

export function computeWorkerUrl(): URL {
  return import.meta.url.endsWith('.ts')
    ? new URL('../../dist/http/compute-worker.js', import.meta.url)
    : new URL('./compute-worker.js', import.meta.url);
}

export interface ComputePoolOptions {
  /** Worker threads; 0 runs every task inline. */
  size: number;
  /** Tasks allowed to wait for a worker. */
  maxQueue: number;
  /** Time limit of one task on a worker, ms. */
  timeoutMs: number;
  /** Called whenever a task is stopped at its deadline (metrics). */
  onTimeout?: () => void;
  /** Tasks handed to one worker at a time (default 2); 1 hands over the next only when the last is answered. */
  pipeline?: number;
  /** Light tasks one worker may hold when they are queued behind light ones (default 4; see chooseSlot). */
  lightPipeline?: number;
  /** A light task queues behind another light one only while that one is younger than this, ms (default 0.5). */
  packWindowMs?: number;
}

/** What the caller knows of a task before it runs. */
export interface TaskHint {
  /** The up-front work estimate says this task is small (compute-budget.ts, isLightRequest). */
  light?: boolean;
}

interface Job {
  id: number;
  task: ComputeTaskName;
  body: unknown;
  options?: unknown;
  light: boolean;
  /** When run() was called: the time limit counts from here, waiting included. */
  accepted: number;
  /** Fires if the job is still waiting when its time is up. */
  waitTimer?: NodeJS.Timeout;
  resolve: (value: unknown) => void;
  reject: (err: Error) => void;
}

interface Slot {
  worker: Worker;
  /** The worker has loaded its modules (it says so once). */
  ready: boolean;
  /** Tasks handed to this worker, in order: the first is computing, the others wait in its inbox. */
  jobs: Job[];
  /** The deadline of jobs[0]. */
  timer: NodeJS.Timeout | null;
  /** When jobs[0] became the task this worker computes (as far as this thread can tell). */
  headSince: number;
}

function fromReply(reply: ComputeReply): Error | null {
  if (reply.ok) return null;
  if ('error' in reply) {
    const code = isErrorCode(reply.error.code) ? reply.error.code : 'internal_error';
    return new LoopgateError(code, reply.error.message, reply.error.issues);
  }
  return new Error(`compute worker fault: ${reply.fault}`);
}

export class ComputePool {
  private readonly slots: Slot[] = [];
  private readonly queue: Job[] = [];
  private nextId = 1;
  private closed = false;
  /** Tasks stopped at their deadline since the pool started (for tests and metrics). */
  timeouts = 0;

  constructor(readonly options: ComputePoolOptions) {}

  get inline(): boolean {
    return this.options.size === 0;
  }

  private get pipeline(): number {
    return Math.max(1, this.options.pipeline ?? 2);
  }

  private get lightPipeline(): number {
    return Math.max(this.pipeline, this.options.lightPipeline ?? 4);
  }

  /** Tasks not yet computing: in the queue, or in a busy worker's inbox. */
  get waiting(): number {
    return this.slots.reduce((n, s) => n + Math.max(0, s.jobs.length - 1), this.queue.length);
  }

  /** Tasks no worker has taken yet: every worker is busy and its inbox full (the saturation metric). */
  get queued(): number {
    return this.queue.length;
  }

  /** Tasks computing on a worker (one per busy worker). */
  get running(): number {
    return this.slots.filter((s) => s.jobs.length > 0).length;
  }

  /** Every worker is busy and the queue is full: a new task would be refused with `overloaded`. */
  get saturated(): boolean {
    return !this.inline && this.running + this.waiting >= this.options.size + this.options.maxQueue;
  }

  run<T extends ComputeTaskName>(task: T, body: unknown, options?: unknown, hint: TaskHint = {}): Promise<ComputeResult<T>> {
    if (this.closed) return Promise.reject(new LoopgateError('shutting_down', 'The service is shutting down; send the request again to another instance.'));
    try {
      // Depth, forbidden keys and non-finite numbers first, on this thread: a body nested
      // thousands deep would overflow the stack of the structured clone that carries it over.
      guardRawBody(body);
    } catch (err) {
      return Promise.reject(err);
    }
    if (this.inline) {
      try {
        return Promise.resolve(COMPUTE_TASKS[task](body, options) as ComputeResult<T>);
      } catch (err) {
        return Promise.reject(err);
      }
    }
    // At most size computing plus maxQueue waiting; a worker still starting counts as free.
    if (this.saturated) {
      return Promise.reject(new LoopgateError('overloaded', `Every worker is busy and ${this.waiting} requests are waiting; retry shortly.`));
    }
    return new Promise<unknown>((resolve, reject) => {
      const job: Job = { id: this.nextId++, task, body, options, light: hint.light === true, accepted: performance.now(), resolve, reject };
      this.armWaiting(job);
      this.queue.push(job);
      this.dispatch();
    }) as Promise<ComputeResult<T>>;
  }

  /** Rejects what still waits and stops the workers; call once in-flight requests are answered. */
  async close(): Promise<void> {
    this.closed = true;
    const closing = new LoopgateError('shutting_down', 'The service is shutting down; send the request again to another instance.');
    for (const job of this.queue.splice(0)) {
      clearTimeout(job.waitTimer);
      job.reject(closing);
    }
    const slots = this.slots.splice(0);
    for (const s of slots) {
      if (s.timer) clearTimeout(s.timer);
      for (const job of s.jobs.splice(0)) job.reject(closing);
    }
    await Promise.all(slots.map((s) => s.worker.terminate()));
  }

  /** Starts every worker and resolves once all have loaded their modules (call before listening). */
  async warm(): Promise<void> {
    while (!this.inline && this.slots.length < this.options.size) this.spawn();
    // Referenced while loading, so that a process with nothing else to do waits for them.
    await Promise.all(
      this.slots.map((s) => {
        if (s.ready) return undefined;
        s.worker.ref();
        return new Promise<void>((resolve) => s.worker.once('message', () => (s.jobs.length ? undefined : s.worker.unref(), resolve())));
      }),
    );
  }

  private dispatch(): void {
    while (this.queue.length && !this.closed) {
      const slot = this.chooseSlot(this.queue[0]);
      if (slot) {
        const job = this.queue.shift()!;
        clearTimeout(job.waitTimer);
        slot.jobs.push(job);
        if (slot.jobs.length === 1) {
          slot.worker.ref();
          this.armDeadline(slot);
        }
        slot.worker.postMessage({ id: job.id, task: job.task, body: job.body, options: job.options });
        continue;
      }
      const starting = this.slots.filter((s) => !s.ready).length;
      if (this.slots.length < this.options.size && starting < this.queue.length) {
        this.spawn();
        continue;
      }
      return;
    }
  }

  /**
   * Where the next task goes, or null when it has to wait in the queue. First choice, for a light
   * task: the inbox of a busy worker that holds only light tasks (fewer than lightPipeline), the
   * current one begun less than packWindowMs ago. On a small machine one worker kept busy costs
   * less than two taking turns to sleep and wake: measured on two cores with the benchmark's
   * summary analyses, packing up to four gave about 1.2 times the rate of spreading them two per
   * worker (bench/). Next: an idle worker, so that nothing waits behind a task that may be slow
   * while a worker is free. Last: the busy worker with the fewest tasks, below `pipeline`.
   */
  private chooseSlot(next: Job): Slot | null {
    const now = performance.now();
    const window = this.options.packWindowMs ?? 0.5;
    let packable: Slot | null = null;
    let idle: Slot | null = null;
    let least: Slot | null = null;
    for (const s of this.slots) {
      if (!s.ready) continue;
      if (s.jobs.length === 0) {
        idle ??= s;
        continue;
      }
      if (next.light && s.jobs.length < this.lightPipeline && now - s.headSince < window && s.jobs.every((j) => j.light)) packable ??= s;
      if (s.jobs.length < this.pipeline && (!least || s.jobs.length < least.jobs.length)) least = s;
    }
    return packable ?? idle ?? least;
  }

  /** What is left of a task's time limit, counted from its acceptance (waiting included), ms. */
  private remainingMs(job: Job, now = performance.now()): number {
    return Math.max(1, this.options.timeoutMs - (now - job.accepted));
  }

  /** The timer of a task in the queue: it is refused with analysis_timeout if still waiting when its time is up. */
  private armWaiting(job: Job): void {
    job.waitTimer = setTimeout(() => this.expireWaiting(job), this.remainingMs(job));
    job.waitTimer.unref();
  }

  /** The timer of the slot's first task: what is left of its time limit, waiting included. */
  private armDeadline(slot: Slot): void {
    if (slot.timer) clearTimeout(slot.timer);
    const head = slot.jobs[0];
    const now = performance.now();
    slot.headSince = now;
    slot.timer = head ? setTimeout(() => this.expire(slot), this.remainingMs(head, now)) : null;
  }

  /** Takes the slot's first task off it (answered, failed or stopped) and arms the next one's deadline. */
  private finishHead(slot: Slot): Job | null {
    const job = slot.jobs.shift() ?? null;
    this.armDeadline(slot);
    if (!slot.jobs.length) slot.worker.unref();
    return job;
  }

  /**
   * For a worker being stopped (deadline) or lost (exit): takes off the task it was computing and
   * returns it, and puts those still in its inbox back at the front of the queue with what is left
   * of their time.
   */
  private emptySlot(slot: Slot): Job | undefined {
    const [computing, ...inbox] = slot.jobs.splice(0);
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = null;
    for (const job of inbox) this.armWaiting(job);
    this.queue.unshift(...inbox);
    return computing;
  }

  private timeoutError(): LoopgateError {
    return new LoopgateError('analysis_timeout', `The computation took longer than ${this.options.timeoutMs} ms and was stopped; ask for a narrower band, fewer points or a simpler model.`);
  }

  private expireWaiting(job: Job): void {
    const i = this.queue.indexOf(job);
    if (i < 0) return;
    this.queue.splice(i, 1);
    this.timeouts++;
    this.options.onTimeout?.();
    job.reject(this.timeoutError());
  }

  private expire(slot: Slot): void {
    const job = this.emptySlot(slot);
    this.timeouts++;
    this.options.onTimeout?.();
    this.retire(slot);
    void slot.worker.terminate();
    job?.reject(this.timeoutError());
    // Start the replacement now: loading a worker takes a while, and waiting tasks count that time.
    if (!this.closed && this.slots.length < this.options.size) this.spawn();
    this.dispatch();
  }

  private retire(slot: Slot): void {
    const i = this.slots.indexOf(slot);
    if (i >= 0) this.slots.splice(i, 1);
  }

  private spawn(): Slot {
    const worker = new Worker(computeWorkerUrl());
    const slot: Slot = { worker, ready: false, jobs: [], timer: null, headSince: 0 };
    worker.on('message', (reply: ComputeReply | { ready: true }) => {
      if ('ready' in reply) {
        slot.ready = true;
        this.dispatch();
        return;
      }
      // Answers come in the order the tasks were handed over; anything else is stale.
      if (slot.jobs[0]?.id !== reply.id) return;
      const job = this.finishHead(slot)!;
      const err = fromReply(reply);
      if (err) job.reject(err);
      else job.resolve((reply as { result: unknown }).result);
      this.dispatch();
    });
    const died = (err: Error) => {
      if (!this.slots.includes(slot)) return;
      this.retire(slot);
      // The task it was computing fails; those still in its inbox go to another worker.
      this.emptySlot(slot)?.reject(err);
      // A worker that cannot even start (a broken build) would be respawned for ever: fail what waits instead.
      if (!slot.ready) {
        for (const job of this.queue.splice(0)) {
          clearTimeout(job.waitTimer);
          job.reject(err);
        }
      }
      if (!this.closed) this.dispatch();
    };
    worker.on('error', died);
    worker.on('exit', (code) => died(new Error(`a compute worker exited with code ${code}`)));
    worker.unref();
    this.slots.push(slot);
    return slot;
  }
}
