import { Writable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { keyFingerprint, matchKey } from '../../src/http/api-keys.js';
import { createHash } from 'node:crypto';
import { fillerPumpLoop, testConfig } from './support/service-config.js';

const KEYS = ['filler-pump-review-key-7f3a', 'pasteuriser-ci-key-19c2e0'];
let app: FastifyInstance;
const logLines: string[] = [];

beforeAll(async () => {
  const stream = new Writable({ write: (chunk, _enc, done) => (logLines.push(String(chunk)), done()) });
  app = await buildApp({ config: testConfig({ LOOPGATE_API_KEYS: KEYS }), logger: { level: 'trace', stream } });
});
afterAll(async () => app.close());

const analyse = (authorization?: string) =>
  app.inject({ method: 'POST', url: '/v1/analyses', payload: fillerPumpLoop, headers: authorization === undefined ? {} : { authorization } });

describe('API keys', () => {
  it('401 unauthorized without a bearer key, with WWW-Authenticate', async () => {
    for (const auth of [undefined, '', 'Basic Zm9vOmJhcg==', 'Bearer', `Token ${KEYS[0]}`]) {
      const res = await analyse(auth);
      expect(res.statusCode).toBe(401);
      expect(res.json()).toMatchObject({ statusCode: 401, code: 'unauthorized' });
      expect(res.headers['www-authenticate']).toMatch(/^Bearer/);
    }
  });

  it('403 forbidden for a key that is not configured, including near misses', async () => {
    for (const key of ['wrong-key-wrong-key', KEYS[0].slice(0, -1), `${KEYS[0]}x`, KEYS[0].toUpperCase()]) {
      const res = await analyse(`Bearer ${key}`);
      expect(res.statusCode).toBe(403);
      expect(res.json()).toMatchObject({ statusCode: 403, code: 'forbidden' });
    }
  });

  it('200 with any configured key; every /v1 route is covered', async () => {
    expect((await analyse(`Bearer ${KEYS[0]}`)).statusCode).toBe(200);
    expect((await analyse(`bearer ${KEYS[1]}`)).statusCode).toBe(200);
    expect((await app.inject({ method: 'GET', url: '/v1/criteria' })).statusCode).toBe(401);
    expect((await app.inject({ method: 'GET', url: '/v1/criteria', headers: { authorization: `Bearer ${KEYS[1]}` } })).statusCode).toBe(200);
  });

  it('leaves health, readiness, metrics and OpenAPI open', async () => {
    for (const url of ['/healthz', '/readyz', '/metrics', '/openapi.json']) {
      expect((await app.inject({ method: 'GET', url })).statusCode).toBe(200);
    }
  });

  it('never writes a key to the log, only its fingerprint', () => {
    const text = logLines.join('');
    expect(text.length).toBeGreaterThan(0);
    for (const key of KEYS) expect(text).not.toContain(key);
    expect(text).toContain(keyFingerprint(KEYS[0]));
  });
});

describe('matchKey', () => {
  const digests = KEYS.map((k) => createHash('sha256').update(k).digest());
  it('finds the index of the matching key, −1 otherwise', () => {
    expect(matchKey(KEYS[1], digests)).toBe(1);
    expect(matchKey(KEYS[0], digests)).toBe(0);
    expect(matchKey('', digests)).toBe(-1);
    expect(matchKey(`${KEYS[1]} `, digests)).toBe(-1);
  });
});
