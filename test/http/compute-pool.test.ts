import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyze } from '../../src/contract/analyze.js';
import { estimate } from '../../src/contract/estimate.js';
import { LoopgateError } from '../../src/contract/errors.js';
import { buildApp } from '../../src/http/app.js';
import { ComputePool } from '../../src/http/compute-pool.js';
import { ensureBuilt, fillerPumpLoop, slowPasteuriserAnalysis, testConfig } from './support/service-config.js';

beforeAll(() => ensureBuilt(), 240_000);

const pools: ComputePool[] = [];
const pool = (size: number, maxQueue: number, timeoutMs: number, packWindowMs?: number) => {
  const p = new ComputePool({ size, maxQueue, timeoutMs, packWindowMs });
  pools.push(p);
  return p;
};
afterAll(async () => Promise.all(pools.map((p) => p.close())));

/** Two light analyses handed to the pool back to back. */
const twoLightTasks = (p: ComputePool) => [1, 2].map(() => p.run('analyze', fillerPumpLoop, undefined, { light: true }));

async function refusal(promise: Promise<unknown>): Promise<LoopgateError> {
  try {
    await promise;
  } catch (err) {
    if (err instanceof LoopgateError) return err;
    throw err;
  }
  throw new Error('expected a refusal');
}

describe('ComputePool', () => {
  it('answers on a worker exactly what analyze answers inline', async () => {
    const p = pool(1, 4, 30_000);
    const full = { ...fillerPumpLoop, detail: 'full' };
    const onWorker = await p.run('analyze', full);
    // The worker serialises the answer itself: the text is what fastify would have written for the inline answer.
    expect(onWorker.json).toBe(JSON.stringify(analyze(full)));
    expect(onWorker.gridPoints).toBe(analyze(full).grid.points);
  });

  it('estimates on a worker exactly what estimate answers inline', async () => {
    const p = pool(1, 4, 30_000);
    const input = Array.from({ length: 1024 }, (_, k) => Math.sin(0.37 * k) + 0.5 * Math.sin(1.91 * k + 1));
    const output = input.map((_, k) => (k ? 0.5 * input[k - 1] : 0));
    const body = { sampleRate: 10, input, output };
    expect((await p.run('estimate', body)).json).toBe(JSON.stringify(estimate(body)));
  });

  it('carries a refusal across the thread boundary with its code, status and issues', async () => {
    const p = pool(1, 4, 30_000);
    const err = await refusal(p.run('analyze', { plant: { kind: 'transfer-function', numerator: 'x', denominator: [1] } }));
    expect(err.code).toBe('validation_failed');
    expect(err.statusCode).toBe(400);
    expect(err.issues?.[0].path).toEqual(['plant', 'numerator']);
  });

  it('stops a computation at its deadline with analysis_timeout, replaces the worker and goes on', async () => {
    const p = pool(1, 4, 300);
    await p.warm();
    const started = performance.now();
    const err = await refusal(p.run('analyze', slowPasteuriserAnalysis()));
    const took = performance.now() - started;
    expect(err.code).toBe('analysis_timeout');
    expect(err.statusCode).toBe(503);
    expect(took).toBeGreaterThanOrEqual(290);
    expect(took).toBeLessThan(1_200); // the slow analysis alone takes longer than this
    expect(p.timeouts).toBe(1);
    await p.warm(); // the replacement worker
    expect(JSON.parse((await p.run('analyze', fillerPumpLoop)).json)).toMatchObject({ grid: { points: expect.any(Number) } });
  });

  it('counts the wait for a worker in the time limit', async () => {
    const p = pool(1, 4, 300);
    await p.warm();
    const first = p.run('analyze', slowPasteuriserAnalysis()).catch((e: LoopgateError) => e);
    const second = await refusal(p.run('analyze', fillerPumpLoop));
    expect(second.code).toBe('analysis_timeout'); // a fast task, but it waited its whole 300 ms behind the slow one
    expect(((await first) as LoopgateError).code).toBe('analysis_timeout');
  });

  it('hands a busy worker its next task ahead of time, and an idle worker gets a task first', async () => {
    const p = pool(2, 8, 30_000);
    await p.warm();
    const slow = p.run('analyze', slowPasteuriserAnalysis());
    const fast = p.run('analyze', fillerPumpLoop); // to the idle worker, not behind the slow task
    const third = p.run('analyze', fillerPumpLoop);
    const fourth = p.run('analyze', fillerPumpLoop);
    // Two computing, two in the workers' inboxes: nothing is left in the queue itself.
    expect(p.running).toBe(2);
    expect(p.waiting).toBe(2);
    let slowDone = false;
    void slow.then(() => (slowDone = true));
    await fast;
    expect(slowDone).toBe(false);
    const answers = await Promise.all([slow, third, fourth]);
    for (const a of answers) expect(JSON.parse(a.json)).toMatchObject({ version: expect.any(String) });
    expect(p.running + p.waiting).toBe(0);
  });

  it('queues a light task behind a young light one instead of waking an idle worker; other tasks go to the idle worker', async () => {
    // A window of a minute: "young" must not depend on how fast this machine runs the test.
    const p = pool(2, 8, 30_000, 60_000);
    await p.warm();
    const light = twoLightTasks(p);
    // Both on one worker: one computing, one in its inbox.
    expect(p.running).toBe(1);
    expect(p.waiting).toBe(1);
    await Promise.all(light);
    const plain = [p.run('analyze', fillerPumpLoop), p.run('analyze', fillerPumpLoop)];
    expect(p.running).toBe(2);
    expect(p.waiting).toBe(0);
    for (const a of await Promise.all([...light, ...plain])) expect(JSON.parse(a.json)).toEqual(analyze(fillerPumpLoop));
  });

  it('sends a light task to an idle worker once the light task it could follow is older than the window', async () => {
    const p = pool(2, 8, 30_000, 0);
    await p.warm();
    const light = twoLightTasks(p);
    expect(p.running).toBe(2);
    expect(p.waiting).toBe(0);
    for (const a of await Promise.all(light)) expect(JSON.parse(a.json)).toEqual(analyze(fillerPumpLoop));
  });

  it('never queues a light task behind a task that is not light', async () => {
    const p = pool(2, 8, 30_000, 60_000);
    await p.warm();
    const slow = p.run('analyze', slowPasteuriserAnalysis());
    const light = p.run('analyze', fillerPumpLoop, undefined, { light: true });
    expect(p.running).toBe(2);
    let slowDone = false;
    void slow.then(() => (slowDone = true));
    await light;
    expect(slowDone).toBe(false);
    await slow;
  });

  it("gives the tasks in a dead worker's inbox to its replacement; only the one it was computing fails", async () => {
    const p = pool(1, 8, 30_000);
    await p.warm();
    const computing = p.run('analyze', slowPasteuriserAnalysis()).catch((e: Error) => e);
    const queued = p.run('analyze', fillerPumpLoop);
    expect(p.waiting).toBe(1);
    // The private worker list is reached into on purpose: nothing a caller sends can kill a worker.
    const slots = (p as unknown as { slots: { worker: { terminate(): Promise<number> } }[] }).slots;
    await slots[0].worker.terminate();
    const err = await computing;
    expect(err).toBeInstanceOf(Error);
    expect((err as Error).message).toMatch(/exited/);
    expect(JSON.parse((await queued).json)).toEqual(analyze(fillerPumpLoop));
  });

  it('sheds with overloaded when every worker is busy and the queue is full', async () => {
    const p = pool(1, 1, 10_000);
    await p.warm();
    const running = p.run('analyze', slowPasteuriserAnalysis()).catch((e: LoopgateError) => e);
    const waiting = p.run('analyze', fillerPumpLoop);
    const err = await refusal(p.run('analyze', fillerPumpLoop));
    expect(err.code).toBe('overloaded');
    expect(err.statusCode).toBe(503);
    expect(JSON.parse(((await running) as { json: string }).json)).toMatchObject({ grid: { points: expect.any(Number) } });
    expect(JSON.parse((await waiting).json)).toMatchObject({ version: expect.any(String) });
  });
});

describe('POST /v1/analyses on workers', () => {
  it('writes the text the worker serialised: the same bytes and type as the inline answer', async () => {
    const onWorkers = await buildApp({ config: testConfig({ LOOPGATE_ANALYSIS_WORKERS: 1 }) });
    const inline = await buildApp({ config: testConfig() });
    try {
      await onWorkers.computePool.warm();
      for (const url of ['/v1/analyses', '/v1/comparisons']) {
        const payload =
          url === '/v1/analyses'
            ? { ...fillerPumpLoop, detail: 'full' }
            : { plant: fillerPumpLoop.plant, baseline: fillerPumpLoop.controller, candidate: { ...fillerPumpLoop.controller, gain: 1.5 * fillerPumpLoop.controller.gain } };
        const a = await onWorkers.inject({ method: 'POST', url, payload });
        const b = await inline.inject({ method: 'POST', url, payload });
        expect(a.statusCode).toBe(200);
        expect(a.headers['content-type']).toBe('application/json; charset=utf-8');
        expect(a.headers['content-type']).toBe(b.headers['content-type']);
        expect(a.body).toBe(b.body);
      }
    } finally {
      await Promise.all([onWorkers.close(), inline.close()]);
    }
  });

  it('answers 503 analysis_timeout instead of stalling, and /healthz answers meanwhile', async () => {
    const app = await buildApp({ config: testConfig({ LOOPGATE_ANALYSIS_WORKERS: 1, LOOPGATE_REQUEST_TIMEOUT_MS: 400 }) });
    try {
      await app.computePool.warm();
      const slow = app.inject({ method: 'POST', url: '/v1/analyses', payload: slowPasteuriserAnalysis() });
      const health = await app.inject({ method: 'GET', url: '/healthz' });
      expect(health.statusCode).toBe(200);
      const res = await slow;
      expect(res.statusCode).toBe(503);
      expect(res.json()).toMatchObject({ statusCode: 503, code: 'analysis_timeout' });
      await app.computePool.warm();
      expect((await app.inject({ method: 'POST', url: '/v1/analyses', payload: fillerPumpLoop })).statusCode).toBe(200);
    } finally {
      await app.close();
    }
  });
});

describe('POST /v1/checks and /v1/comparisons on workers', () => {
  const { plant, controller } = slowPasteuriserAnalysis() as { plant: unknown; controller: { gain: number } };
  const bodies = {
    '/v1/checks': { loops: [{ name: 'pasteuriser', plant, controller }] },
    '/v1/comparisons': { plant, baseline: controller, candidate: { ...controller, gain: 1.2 * controller.gain } },
  };

  it.each(Object.entries(bodies))('%s answers 503 analysis_timeout for a loop slower than the time limit, and /healthz answers meanwhile', async (url, payload) => {
    // The slow loop takes over a second on one core without a frequency option; the limit is 300 ms.
    const app = await buildApp({ config: testConfig({ LOOPGATE_ANALYSIS_WORKERS: 1, LOOPGATE_REQUEST_TIMEOUT_MS: 300 }) });
    try {
      await app.computePool.warm();
      const slow = app.inject({ method: 'POST', url, payload });
      expect((await app.inject({ method: 'GET', url: '/healthz' })).statusCode).toBe(200);
      const res = await slow;
      expect(res.statusCode).toBe(503);
      expect(res.json()).toMatchObject({ statusCode: 503, code: 'analysis_timeout' });
      expect(app.computePool.timeouts).toBe(1);
    } finally {
      await app.close();
    }
  });

  it('a check on workers answers what the inline check answers', async () => {
    const onWorkers = await buildApp({ config: testConfig({ LOOPGATE_ANALYSIS_WORKERS: 2 }) });
    const inline = await buildApp({ config: testConfig() });
    try {
      await onWorkers.computePool.warm();
      const payload = { loops: Array.from({ length: 10 }, (_, i) => ({ name: `pump ${i}`, plant: fillerPumpLoop.plant, controller: { ...fillerPumpLoop.controller, gain: 0.4 + 0.2 * i } })) };
      const a = await onWorkers.inject({ method: 'POST', url: '/v1/checks', payload });
      const b = await inline.inject({ method: 'POST', url: '/v1/checks', payload });
      expect(a.statusCode).toBe(200);
      expect(a.json()).toEqual(b.json());
    } finally {
      await Promise.all([onWorkers.close(), inline.close()]);
    }
  });
});
