import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp();
});
afterAll(async () => {
  await app.close();
});

describe('GET /', () => {
  it('serves the review page with a CSP that allows its own script by hash and nothing from elsewhere', async () => {
    const res = await app.inject({ method: 'GET', url: '/' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    const csp = String(res.headers['content-security-policy']);
    const script = /<script>([\s\S]*?)<\/script>/.exec(res.body)![1];
    const hash = createHash('sha256').update(script, 'utf8').digest('base64');
    expect(csp).toContain(`script-src 'sha256-${hash}'`);
    expect(csp).toContain("default-src 'none'");
    expect(csp).toContain("connect-src 'self'");
    expect(res.body).toContain("fetch('v1/reports'");
  });
});
