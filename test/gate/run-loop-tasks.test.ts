import { afterAll, describe, expect, it } from 'vitest';
import { loopTasks, parseCheckRequest } from '../../src/gate/run-checks.js';
import { runLoopTask } from '../../src/gate/loop-outcome.js';
import { chunkSize, runLoopTasks } from '../../src/gate/run-loop-tasks.js';
import { GATE_LIMITS } from '../../src/gate/limits.js';
import { LoopCheckPool } from '../../src/gate/worker-pool.js';
import { thirdOrderLag } from './support/closed-form-loops.js';

const pool = new LoopCheckPool(2);
afterAll(() => pool.close());

const broken = { kind: 'transfer-function', numerator: [1], denominator: [0, 0] };
const batch = (n: number, brokenAt: number[] = []) =>
  loopTasks(parseCheckRequest({ loops: Array.from({ length: n }, (_, i) => ({ name: `l${i}`, plant: brokenAt.includes(i) ? broken : thirdOrderLag(0.5 + i / n) })) }));

describe('runLoopTasks', () => {
  it(`runs batches of up to ${GATE_LIMITS.poolThreshold} loops inline and larger ones on the pool`, async () => {
    let made = 0;
    const factory = () => {
      made++;
      return pool;
    };
    const small = batch(GATE_LIMITS.poolThreshold);
    expect(await runLoopTasks(small, { pool: factory })).toEqual(small.map(runLoopTask));
    expect(made).toBe(0);
    const large = batch(GATE_LIMITS.poolThreshold + 1);
    const out = await runLoopTasks(large, { pool: factory });
    expect(made).toBe(1);
    expect([...out].sort((a, b) => a.index - b.index)).toEqual(large.map(runLoopTask));
  });

  it('reports progress up to the total, inline and pooled', async () => {
    for (const n of [5, 45]) {
      const seen: number[] = [];
      await runLoopTasks(batch(n), { pool, onProgress: (done, total) => (expect(total).toBe(n), seen.push(done)) });
      expect(seen.at(-1)).toBe(n);
      expect(seen).toEqual([...seen].sort((a, b) => a - b));
    }
  });

  it('stops sending work after a refusal and keeps the refusal of the lowest index', async () => {
    const inline = await runLoopTasks(batch(10, [3, 7]));
    expect(inline).toHaveLength(4);
    expect(inline.at(-1)).toMatchObject({ index: 3, kind: 'refused' });
    const pooled = await runLoopTasks(batch(200, [2, 150]), { pool });
    expect(pooled.length).toBeLessThan(200);
    const refused = pooled.filter((o) => o.kind === 'refused').map((o) => o.index);
    expect(Math.min(...refused)).toBe(2);
  });
});

describe('chunkSize', () => {
  it('gives each worker about four chunks, between 4 and 64 loops each', () => {
    expect(chunkSize(1000, 2)).toBe(64); // 125 even, capped
    expect(chunkSize(200, 2)).toBe(25);
    expect(chunkSize(10, 2)).toBe(4);
    expect(chunkSize(1, 8)).toBe(4);
    expect(chunkSize(100, 0)).toBe(25); // a pool of no workers counts as one
  });
});
