import { afterEach, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { testConfig } from './support/service-config.js';

let app: FastifyInstance | undefined;
afterEach(async () => app?.close());

const get = (a: FastifyInstance, url: string, headers: Record<string, string> = {}, remoteAddress = '127.0.0.1') =>
  a.inject({ method: 'GET', url, headers, remoteAddress });

describe('rate limiting', () => {
  it('is off by default', async () => {
    app = await buildApp({ config: testConfig() });
    for (let i = 0; i < 30; i++) expect((await get(app, '/v1/criteria')).statusCode).toBe(200);
  });

  it('per address: the request over the limit gets 429 rate_limited with Retry-After; others are not affected', async () => {
    app = await buildApp({ config: testConfig({ LOOPGATE_RATE_LIMIT_MAX: 3, LOOPGATE_RATE_LIMIT_WINDOW_MS: 60_000 }) });
    for (let i = 0; i < 3; i++) expect((await get(app, '/v1/criteria')).statusCode).toBe(200);
    const over = await get(app, '/v1/criteria');
    expect(over.statusCode).toBe(429);
    expect(over.json()).toMatchObject({ statusCode: 429, code: 'rate_limited' });
    expect(Number(over.headers['retry-after'])).toBeGreaterThan(0);
    expect((await get(app, '/v1/criteria', {}, '127.0.0.2')).statusCode).toBe(200);
    expect((await get(app, '/healthz')).statusCode).toBe(200); // health is never limited
  });

  it('per API key when keys are in use, whatever the address', async () => {
    const keys = ['filler-pump-review-key-7f3a', 'pasteuriser-ci-key-19c2e0'];
    app = await buildApp({ config: testConfig({ LOOPGATE_API_KEYS: keys, LOOPGATE_RATE_LIMIT_MAX: 2 }) });
    const as = (k: string, ip: string) => get(app!, '/v1/criteria', { authorization: `Bearer ${k}` }, ip);
    expect((await as(keys[0], '127.0.0.1')).statusCode).toBe(200);
    expect((await as(keys[0], '127.0.0.2')).statusCode).toBe(200);
    expect((await as(keys[0], '127.0.0.3')).statusCode).toBe(429);
    expect((await as(keys[1], '127.0.0.1')).statusCode).toBe(200);
  });
});
