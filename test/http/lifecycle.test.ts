import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { fillerPumpLoop, testConfig } from './support/service-config.js';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ config: testConfig() });
});
afterAll(async () => app.close());

describe('readiness and draining', () => {
  it('/readyz is 200 while taking work; /healthz is liveness only', async () => {
    const res = await app.inject({ method: 'GET', url: '/readyz' });
    expect(res.statusCode).toBe(200);
    expect(res.json()).toMatchObject({ status: 'ready', computeWorkers: 0, computeWaiting: 0 });
    expect((await app.inject({ method: 'GET', url: '/healthz' })).json().status).toBe('ok');
  });

  it('once draining: /readyz 503 shutting_down, new /v1 work 503 with Connection: close, /healthz still 200', async () => {
    expect((await app.inject({ method: 'POST', url: '/v1/analyses', payload: fillerPumpLoop })).statusCode).toBe(200);
    app.beginDrain();
    expect(app.draining).toBe(true);
    const ready = await app.inject({ method: 'GET', url: '/readyz' });
    expect(ready.statusCode).toBe(503);
    expect(ready.json()).toMatchObject({ statusCode: 503, code: 'shutting_down' });
    const work = await app.inject({ method: 'POST', url: '/v1/analyses', payload: fillerPumpLoop });
    expect(work.statusCode).toBe(503);
    expect(work.json().code).toBe('shutting_down');
    expect(work.headers.connection).toBe('close');
    expect((await app.inject({ method: 'GET', url: '/healthz' })).statusCode).toBe(200);
  });
});
