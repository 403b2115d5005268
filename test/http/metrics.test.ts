import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { countVerdict } from '../../src/http/metrics.js';
import { thirdOrderLag } from '../gate/support/closed-form-loops.js';
import { fillerPumpLoop, testConfig } from './support/service-config.js';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ config: testConfig() });
});
afterAll(async () => app.close());

const scrape = async () => {
  const res = await app.inject({ method: 'GET', url: '/metrics' });
  expect(res.statusCode).toBe(200);
  expect(res.headers['content-type']).toMatch(/^text\/plain; version=0\.0\.4/);
  return res.body;
};

/** The value of one sample line, e.g. value(text, 'loopgate_verdicts_total{outcome="pass"}'). */
function value(text: string, series: string): number {
  const line = text.split('\n').find((l) => l.startsWith(`${series} `));
  return line ? Number(line.slice(series.length + 1)) : 0;
}

describe('GET /metrics', () => {
  it('counts requests and durations per route template and status', async () => {
    const before = await scrape();
    await app.inject({ method: 'POST', url: '/v1/analyses', payload: fillerPumpLoop });
    await app.inject({ method: 'POST', url: '/v1/analyses', payload: { plant: { kind: 'warp-drive' } } });
    await app.inject({ method: 'GET', url: '/no/such/path/123' });
    const after = await scrape();
    const ok = 'loopgate_http_requests_total{method="POST",route="/v1/analyses",status="200"}';
    const bad = 'loopgate_http_requests_total{method="POST",route="/v1/analyses",status="400"}';
    expect(value(after, ok) - value(before, ok)).toBe(1);
    expect(value(after, bad) - value(before, bad)).toBe(1);
    expect(after).toContain('route="unmatched",status="404"');
    expect(after).not.toContain('/no/such/path');
    expect(value(after, 'loopgate_http_request_duration_seconds_count{method="POST",route="/v1/analyses",status="200"}')).toBeGreaterThanOrEqual(1);
  });

  it('counts analyses by plant kind, only for answered requests', async () => {
    const series = 'loopgate_analyses_total{plant_kind="transfer-function"}';
    const before = value(await scrape(), series);
    await app.inject({ method: 'POST', url: '/v1/analyses', payload: fillerPumpLoop });
    await app.inject({ method: 'POST', url: '/v1/analyses', payload: { ...fillerPumpLoop, plant: { ...fillerPumpLoop.plant, delay: -1 } } });
    expect(value(await scrape(), series) - before).toBe(1);
  });

  it('counts the verdict of every loop that POST /v1/checks judges', async () => {
    const outcomes = ['pass', 'warn', 'fail'] as const;
    const counts = (text: string) => outcomes.map((o) => value(text, `loopgate_verdicts_total{outcome="${o}"}`));
    const before = counts(await scrape());
    // K/(s(s + 1)(s + 2)) has GM = 6/K (Ogata): K = 5 gives 1.6 dB, below the baseline's 6 dB.
    const loops = [
      { name: 'filler pump, K = 1', plant: thirdOrderLag(1) },
      { name: 'filler pump, K = 5', plant: thirdOrderLag(5) },
    ];
    const res = await app.inject({ method: 'POST', url: '/v1/checks', payload: { loops } });
    expect(res.statusCode).toBe(200);
    const delta = counts(await scrape()).map((v, k) => v - before[k]);
    expect(delta.reduce((a, b) => a + b, 0)).toBe(2);
    expect(delta[2]).toBe(res.json().loops.filter((l: { verdict: string }) => l.verdict === 'fail').length);
    expect(delta[2]).toBeGreaterThanOrEqual(1);
  });

  it('offers countVerdict to the gate; odd outcomes fall into "other"', async () => {
    const before = await scrape();
    countVerdict('pass');
    countVerdict('pass');
    countVerdict('fail');
    countVerdict('{"evil":1}');
    const after = await scrape();
    expect(value(after, 'loopgate_verdicts_total{outcome="pass"}') - value(before, 'loopgate_verdicts_total{outcome="pass"}')).toBe(2);
    expect(value(after, 'loopgate_verdicts_total{outcome="fail"}') - value(before, 'loopgate_verdicts_total{outcome="fail"}')).toBe(1);
    expect(value(after, 'loopgate_verdicts_total{outcome="other"}')).toBeGreaterThanOrEqual(1);
  });

  it('exposes event-loop lag and process memory', async () => {
    const text = await scrape();
    expect(text).toMatch(/^nodejs_eventloop_lag_seconds \d/m);
    expect(text).toMatch(/^process_resident_memory_bytes \d/m);
  });
});
