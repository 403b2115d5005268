import { performance } from 'node:perf_hooks';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { delayedIntegrator, thirdOrderGainFor, thirdOrderLag } from '../gate/support/closed-form-loops.js';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp();
});
afterAll(async () => {
  await app.close();
});

const post = (payload: unknown) =>
  app.inject({ method: 'POST', url: '/v1/checks', payload: typeof payload === 'string' ? payload : JSON.stringify(payload), headers: { 'content-type': 'application/json' } });

describe('POST /v1/checks', () => {
  it('answers the verdict of the batch and of each loop, with findings saying why', async () => {
    const res = await post({
      criteria: { profile: 'baseline' },
      loops: [
        { name: 'filler-pump speed', plant: thirdOrderLag(0.5), controller: { kind: 'pid', form: 'parallel', kp: 1 } },
        { name: 'pasteuriser temperature', plant: thirdOrderLag(thirdOrderGainFor(4)) },
      ],
    });
    expect(res.statusCode).toBe(200);
    const r = res.json();
    expect(r.verdict).toBe('fail');
    expect(r.loops.map((l: { verdict: string }) => l.verdict)).toEqual(['pass', 'fail']);
    const f = r.loops[1].findings.find((x: { code: string }) => x.code === 'gain_margin_low');
    expect(Object.keys(f).sort()).toEqual(['code', 'criterion', 'limit', 'message', 'severity', 'source', 'value']);
    expect(f.value).toBeCloseTo(4, 9); // GM = 6/K (Ogata) set to 4 dB
    expect(r.loops[1].summary.margins.gain.ratio).toBeCloseTo(Math.pow(10, 4 / 20), 9);
    expect(r.loops[1].summary).toHaveProperty('peaks.sensitivity.value');
    expect(r.loops[1].summary).toHaveProperty('bandwidth.crossover');
    expect(r.version).toBeTypeOf('string');
    expect(r.requestHash).toMatch(/^sha256:/);
  });

  it('refuses a batch with a loop that cannot be analysed: 422 with the path under loops[i]', async () => {
    const res = await post({ loops: [{ name: 'a', plant: thirdOrderLag(1) }, { name: 'b', plant: { kind: 'zeros-poles', zeros: [], poles: [{ re: -1, im: 2 }], gain: 1 } }] });
    expect(res.statusCode).toBe(422);
    expect(res.json()).toMatchObject({ statusCode: 422, code: 'unpaired_complex_root', issues: [{ path: ['loops', 1, 'plant', 'poles', 0] }] });
  });

  it('413 over 1,000 loops; the route accepts bodies above the global 1 MiB limit, up to its own', async () => {
    const many = await post({ loops: Array.from({ length: 1001 }, (_, i) => ({ name: `l${i}`, plant: thirdOrderLag(1) })) });
    expect(many.statusCode).toBe(413);
    expect(many.json().code).toBe('too_many_loops');
    // ~1.3 MB of loops, the first broken: the body is read and the batch refused by content, not by size.
    const poles = Array.from({ length: 30 }, (_, j) => -(1.0000001 + j / 7));
    const plant = { kind: 'zeros-poles', zeros: poles.slice(1).map((p) => p - 0.5), poles, gain: 0.25 };
    const loops = Array.from({ length: 1000 }, (_, i) => ({
      name: `loop ${i} ${'x'.repeat(180)}`,
      plant: i === 0 ? { kind: 'transfer-function', numerator: [1], denominator: [0] } : plant,
    }));
    const body = JSON.stringify({ loops });
    expect(body.length).toBeGreaterThan(1024 * 1024);
    const big = await post(body);
    expect(big.statusCode).toBe(422);
    expect(big.json().issues[0].path).toEqual(['loops', 0, 'plant', 'denominator']);
    const huge = await post(JSON.stringify({ loops: [], padding: 'x'.repeat(9 * 1024 * 1024) }));
    expect(huge.statusCode).toBe(413);
    expect(huge.json().code).toBe('body_too_large');
  });

  it('a large batch runs off the event loop: other callers are answered while it runs', async () => {
    const loops = Array.from({ length: 400 }, (_, i) => ({ name: `l${i}`, plant: delayedIntegrator(0.5 + (i % 7) / 10, 0.2 + (i % 11) / 20) }));
    const started = Date.now();
    const busy0 = performance.eventLoopUtilization();
    let batchDone = 0;
    const batch = post({ loops }).then((res) => {
      batchDone = Date.now();
      return res;
    });
    // Let the batch be parsed and handed to the workers, then ask for health while they work.
    await new Promise((r) => setTimeout(r, 50));
    const latencies: number[] = [];
    while (!batchDone && Date.now() - started < 60_000) {
      const t = Date.now();
      const health = await app.inject({ method: 'GET', url: '/healthz' });
      expect(health.statusCode).toBe(200);
      latencies.push(Date.now() - t);
      await new Promise((r) => setTimeout(r, 20));
    }
    const res = await batch;
    // Utilisation of this thread's event loop: near 1 if the loops had been analysed here, inline.
    const busy = performance.eventLoopUtilization(busy0).utilization;
    expect(res.statusCode).toBe(200);
    expect(res.json().loops).toHaveLength(400);
    expect(busy).toBeLessThan(0.5);
    expect(latencies.length).toBeGreaterThan(3); // health was answered several times while the batch was still running
    expect(Math.max(...latencies)).toBeLessThan(500);
  });
});
