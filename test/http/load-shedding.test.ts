import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { fillerPumpLoop, testConfig } from './support/service-config.js';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ config: testConfig({ LOOPGATE_MAX_EVENT_LOOP_DELAY_MS: 20 }) });
  await app.ready();
});
afterAll(async () => app.close());

const blockFor = (ms: number) => {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    /* a stalled event loop, as a long synchronous computation would cause */
  }
};
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('load shedding', () => {
  it('sheds /v1 with 503 overloaded and Retry-After while the event loop lags; health, readiness and metrics still answer', async () => {
    expect((await app.inject({ method: 'POST', url: '/v1/analyses', payload: fillerPumpLoop })).statusCode).toBe(200);
    let shed = null;
    // under-pressure takes the mean delay over 250 ms samples: one long stall lifts it over 20 ms.
    for (let i = 0; i < 5 && !shed; i++) {
      blockFor(1500);
      await sleep(5);
      const res = await app.inject({ method: 'POST', url: '/v1/analyses', payload: fillerPumpLoop });
      if (res.statusCode === 503) shed = res;
    }
    expect(shed).not.toBeNull();
    expect(shed!.json()).toMatchObject({ statusCode: 503, code: 'overloaded' });
    expect(shed!.headers['retry-after']).toBe('2');
    expect((await app.inject({ method: 'GET', url: '/healthz' })).statusCode).toBe(200);
    expect((await app.inject({ method: 'GET', url: '/metrics' })).statusCode).toBe(200);
    const ready = await app.inject({ method: 'GET', url: '/readyz' });
    expect([200, 503]).toContain(ready.statusCode); // 503 overloaded while the sample still shows the lag
  });

  it('recovers once the loop is idle again', async () => {
    let status = 0;
    for (let i = 0; i < 20 && status !== 200; i++) {
      await sleep(300);
      status = (await app.inject({ method: 'POST', url: '/v1/analyses', payload: fillerPumpLoop })).statusCode;
    }
    expect(status).toBe(200);
  });
});
