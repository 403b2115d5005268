import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { loopTasks, parseCheckRequest } from '../../src/gate/run-checks.js';
import { runLoopTask } from '../../src/gate/loop-outcome.js';
import { LoopCheckPool, workerFileUrl } from '../../src/gate/worker-pool.js';
import { delayedIntegrator, thirdOrderLag } from './support/closed-form-loops.js';

// The pool loads the BUILT worker: `npm test` builds dist/ before vitest runs.
const pool = new LoopCheckPool(2);
afterAll(() => pool.close());

const tasks = (n: number, offset = 0) =>
  loopTasks(parseCheckRequest({ loops: Array.from({ length: n }, (_, i) => ({ name: `loop ${i}`, plant: i % 2 ? thirdOrderLag(0.2 + (offset + i) / 10) : delayedIntegrator(1, 0.1 + (offset + i) / 100) })) }));

describe('LoopCheckPool', () => {
  it('loads the built worker from dist/ when running from source', () => {
    const file = fileURLToPath(workerFileUrl());
    expect(file).toMatch(/dist[\\/]gate[\\/]check-worker\.js$/);
    expect(existsSync(file)).toBe(true);
  });

  it('answers exactly what the inline check answers, in the same order', async () => {
    const t = tasks(12);
    const pooled = await pool.runChunk(t);
    expect(pooled).toEqual(t.map(runLoopTask));
    expect(pool.started).toBe(1);
  });

  it('serves concurrent batches with at most `size` workers', async () => {
    const a = tasks(8);
    const b = tasks(8, 50);
    const [ra, rb, rc] = await Promise.all([pool.runChunk(a), pool.runChunk(b), pool.runChunk(a)]);
    expect(ra).toEqual(a.map(runLoopTask));
    expect(rb).toEqual(b.map(runLoopTask));
    expect(rc).toEqual(ra);
    expect(pool.started).toBe(2);
  });

  it('hands one worker two chunks at a time and answers each with its own outcomes', async () => {
    const single = new LoopCheckPool(1);
    try {
      const chunks = [tasks(5), tasks(3, 20), tasks(4, 40), tasks(2, 60)];
      const answers = await Promise.all(chunks.map((c) => single.runChunk(c)));
      answers.forEach((a, k) => expect(a).toEqual(chunks[k].map(runLoopTask)));
      expect(single.started).toBe(1);
    } finally {
      await single.close();
    }
  });

  it('fails only the chunk a dying worker was checking; the one in its inbox goes to a new worker', async () => {
    const single = new LoopCheckPool(1);
    try {
      const first = single.runChunk(tasks(40)).then(
        () => 'answered',
        (err: Error) => err.message,
      );
      const second = single.runChunk(tasks(4, 70));
      // Both chunks are handed to the one worker at once; it dies before answering the first.
      const slots = (single as unknown as { slots: { worker: { terminate(): Promise<number> } }[] }).slots;
      expect(slots).toHaveLength(1);
      await slots[0].worker.terminate();
      expect(await first).toMatch(/exited/);
      expect(await second).toEqual(tasks(4, 70).map(runLoopTask));
    } finally {
      await single.close();
    }
  });

  it('brings a refusal back as data, with its path', async () => {
    const broken = loopTasks(parseCheckRequest({ loops: [{ name: 'x', plant: { kind: 'transfer-function', numerator: [1], denominator: [0] } }] }));
    const [outcome] = await pool.runChunk(broken);
    expect(outcome).toMatchObject({ index: 0, kind: 'refused', code: 'zero_denominator', issues: [{ path: ['loops', 0, 'plant', 'denominator'] }] });
  });

  it('refuses work once closed', async () => {
    const p = new LoopCheckPool(1);
    const pending = p.runChunk(tasks(4)).catch((err: Error) => err);
    await p.close();
    expect(String(await pending)).toMatch(/closed/);
    await expect(p.runChunk(tasks(1))).rejects.toThrow(/closed/);
  });
});
