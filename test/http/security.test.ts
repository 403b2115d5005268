import { afterEach, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { PAGE_CONTENT_SECURITY_POLICY } from '../../src/http/routes/page.js';
import { testConfig } from './support/service-config.js';

let app: FastifyInstance | undefined;
afterEach(async () => app?.close());

describe('security headers', () => {
  it('the API answers with a CSP that allows nothing, and the usual helmet headers', async () => {
    app = await buildApp({ config: testConfig() });
    const res = await app.inject({ method: 'GET', url: '/healthz' });
    expect(res.headers['content-security-policy']).toBe("default-src 'none';base-uri 'none';form-action 'none';frame-ancestors 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
    expect(res.headers['strict-transport-security']).toMatch(/max-age=/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('the page at / keeps its own CSP (its script by hash, inline styles), and still works', async () => {
    app = await buildApp({ config: testConfig() });
    const res = await app.inject({ method: 'GET', url: '/' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-security-policy']).toBe(PAGE_CONTENT_SECURITY_POLICY);
    expect(String(res.headers['content-security-policy'])).toMatch(/script-src 'sha256-[A-Za-z0-9+/=]+'/);
    expect(String(res.headers['content-security-policy'])).toContain("style-src 'unsafe-inline'");
  });

  it('refusals carry the headers too', async () => {
    app = await buildApp({ config: testConfig({ LOOPGATE_API_KEYS: ['pasteuriser-ci-key-19c2e0'] }) });
    const res = await app.inject({ method: 'GET', url: '/v1/criteria' });
    expect(res.statusCode).toBe(401);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });
});

describe('CORS', () => {
  const preflight = (a: FastifyInstance, origin: string) =>
    a.inject({ method: 'OPTIONS', url: '/v1/analyses', headers: { origin, 'access-control-request-method': 'POST', 'access-control-request-headers': 'content-type' } });

  it('is off by default: no Access-Control headers', async () => {
    app = await buildApp({ config: testConfig() });
    const res = await app.inject({ method: 'GET', url: '/v1/criteria', headers: { origin: 'https://review.example.org' } });
    expect(res.headers['access-control-allow-origin']).toBeUndefined();
    expect((await preflight(app, 'https://review.example.org')).headers['access-control-allow-origin']).toBeUndefined();
  });

  it('allows exactly the configured origins', async () => {
    app = await buildApp({ config: testConfig({ LOOPGATE_CORS_ORIGINS: ['https://review.example.org'] }) });
    const ok = await preflight(app, 'https://review.example.org');
    expect(ok.statusCode).toBe(204);
    expect(ok.headers['access-control-allow-origin']).toBe('https://review.example.org');
    expect(String(ok.headers['access-control-allow-headers'])).toContain('authorization');
    const other = await app.inject({ method: 'GET', url: '/v1/criteria', headers: { origin: 'https://elsewhere.example.net' } });
    expect(other.headers['access-control-allow-origin']).toBeUndefined();
  });
});
