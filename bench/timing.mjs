/**
 * Median cost of repeated calls, after a warm-up (so the JIT has compiled
 * the hot path). The machine is shared, so the cost is measured as CPU time
 * of this process (all its threads: GC and compiler included) rather than
 * wall time, which another busy process would inflate; both are returned.
 * Calls are timed in batches of at least BATCH_MS so the clock's resolution
 * does not matter, and the median is taken over batches.
 */
import { performance } from 'node:perf_hooks';

const BATCH_MS = 2;

const cpuMicroseconds = () => {
  const u = process.cpuUsage();
  return u.user + u.system;
};

/** Median (the mean of the middle two for an even count). */
export function median(values) {
  const s = [...values].sort((x, y) => x - y);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

/**
 * Calls `f` for about `seconds` (at least `minBatches` batches) after a
 * warm-up of a fifth of that; returns the median CPU and wall time per call
 * in microseconds and the number of calls.
 */
export function medianMicroseconds(f, { seconds = 1, minBatches = 15 } = {}) {
  const warmUntil = performance.now() + seconds * 200;
  do f();
  while (performance.now() < warmUntil);
  const cpu = [];
  const wall = [];
  let runs = 0;
  const stop = performance.now() + seconds * 1000;
  while (cpu.length < minBatches || performance.now() < stop) {
    const w0 = performance.now();
    const c0 = cpuMicroseconds();
    let n = 0;
    do {
      f();
      n++;
    } while (performance.now() - w0 < BATCH_MS);
    cpu.push((cpuMicroseconds() - c0) / n);
    wall.push(((performance.now() - w0) * 1000) / n);
    runs += n;
  }
  return { microseconds: median(cpu), wallMicroseconds: median(wall), runs };
}

/** First and third quartiles (linear interpolation between order statistics). */
export function quartiles(values) {
  const s = [...values].sort((a, b) => a - b);
  const at = (p) => {
    const x = p * (s.length - 1);
    const i = Math.floor(x);
    return i + 1 < s.length ? s[i] + (x - i) * (s[i + 1] - s[i]) : s[i];
  };
  return [at(0.25), at(0.75)];
}
