import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { fillerPumpLoop, testConfig } from './support/service-config.js';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ config: testConfig({ LOOPGATE_MAX_WORK: 20_000, LOOPGATE_MAX_BATCH: 3, LOOPGATE_MAX_RECORD_LENGTH: 100 }) });
});
afterAll(async () => app.close());

const post = (url: string, payload: unknown) => app.inject({ method: 'POST', url, payload: payload as object });

describe('compute budget', () => {
  it('lets a loop within the budget through', async () => {
    const res = await post('/v1/analyses', fillerPumpLoop);
    expect(res.statusCode).toBe(200);
  });

  it('refuses up front a grid × order over the budget (413 work_budget_exceeded)', async () => {
    const started = performance.now();
    const res = await post('/v1/analyses', { ...fillerPumpLoop, frequency: { min: 0.01, max: 100, points: 20_000 } });
    expect(res.statusCode).toBe(413);
    expect(res.json()).toMatchObject({ statusCode: 413, code: 'work_budget_exceeded' });
    expect(res.json().message).toMatch(/budget/);
    expect(performance.now() - started).toBeLessThan(500);
  });

  it('refuses more loops than the batch bound (413 batch_too_large)', async () => {
    const loop = { name: 'filler pump', plant: fillerPumpLoop.plant, controller: fillerPumpLoop.controller };
    const res = await post('/v1/checks', { loops: [loop, loop, loop, loop] });
    expect(res.statusCode).toBe(413);
    expect(res.json().code).toBe('batch_too_large');
  });

  it('refuses a record longer than the bound (413 record_too_long)', async () => {
    const res = await post('/v1/estimates', { sampleRate: 100, input: new Array(101).fill(0), output: new Array(101).fill(0) });
    expect(res.statusCode).toBe(413);
    expect(res.json().code).toBe('record_too_long');
  });
});
