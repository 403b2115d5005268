import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../src/http/app.js';
import { ERROR_CATALOGUE } from '../../src/contract/errors.js';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp();
});
afterAll(async () => {
  await app.close();
});

const lag = { kind: 'transfer-function', numerator: [1], denominator: [1, 3, 3, 1] };

async function post(payload: unknown, headers: Record<string, string> = { 'content-type': 'application/json' }) {
  const res = await app.inject({ method: 'POST', url: '/v1/analyses', payload: typeof payload === 'string' ? payload : JSON.stringify(payload), headers });
  return { status: res.statusCode, body: res.json() as { statusCode: number; code: string; message: string; issues?: { path: (string | number)[]; message: string }[] } };
}

function expectError(r: Awaited<ReturnType<typeof post>>, status: number, code: string, path?: (string | number)[]) {
  expect(r.status).toBe(status);
  expect(r.body.statusCode).toBe(status);
  expect(r.body.code).toBe(code);
  expect(typeof r.body.message).toBe('string');
  expect(r.body.message.length).toBeGreaterThan(10);
  expect(ERROR_CATALOGUE[code as keyof typeof ERROR_CATALOGUE].statusCode).toBe(status);
  if (path) expect(r.body.issues?.[0].path).toEqual(path);
}

describe('POST /v1/analyses refuses what it cannot analyse', () => {
  it('400 with the field path when the body does not match the schema', async () => {
    expectError(await post({ plant: { kind: 'transfer-function', numerator: 'x', denominator: [1] } }), 400, 'validation_failed', ['plant', 'numerator']);
    expectError(await post({ plant: { kind: 'warp-drive' } }), 400, 'validation_failed', ['plant', 'kind']);
    expectError(await post({ plant: lag, controller: { kind: 'pid', form: 'parallel', kp: '1' } }), 400, 'validation_failed', ['controller', 'kp']);
    expectError(await post({ plant: lag, extra: 1 }), 400, 'validation_failed');
  });

  it('400 for a body that is not JSON, 415 for another content type', async () => {
    expectError(await post('{"plant": '), 400, 'invalid_json');
    expectError(await post('plant', { 'content-type': 'text/plain' }), 415, 'unsupported_media_type');
  });

  it('400 for prototype-pollution keys', async () => {
    expectError(await post('{"plant": {"kind":"transfer-function","numerator":[1],"denominator":[1,1]}, "__proto__": {"x": 1}}'), 400, 'forbidden_key');
  });

  it('422 for non-finite numbers, including JSON numbers that overflow a double', async () => {
    expectError(await post('{"plant": {"kind":"transfer-function","numerator":[1e999],"denominator":[1,1]}}'), 422, 'non_finite_number', ['plant', 'numerator', 0]);
    expectError(await post('{"plant": {"kind":"transfer-function","numerator":[1],"denominator":[1,-1e400]}}'), 422, 'non_finite_number', ['plant', 'denominator', 1]);
  });

  it('422 for a zero or empty denominator', async () => {
    expectError(await post({ plant: { kind: 'transfer-function', numerator: [1], denominator: [0, 0] } }), 422, 'zero_denominator', ['plant', 'denominator']);
    expectError(await post({ plant: { kind: 'transfer-function', numerator: [1], denominator: [] } }), 400, 'validation_failed', ['plant', 'denominator']);
  });

  it('422 for a complex root without its conjugate', async () => {
    const r = await post({ plant: { kind: 'zeros-poles', zeros: [], poles: [{ re: -1, im: 2 }, -3], gain: 1 } });
    expectError(r, 422, 'unpaired_complex_root', ['plant', 'poles', 0]);
  });

  it('422 for negative times', async () => {
    expectError(await post({ plant: { ...lag, delay: -0.1 } }), 422, 'negative_time', ['plant', 'delay']);
    expectError(await post({ plant: lag, controller: { kind: 'pid', form: 'standard', gain: 1, integralTime: -2 } }), 422, 'negative_time', ['controller', 'integralTime']);
    expectError(
      await post({ plant: lag, controller: { kind: 'pid', form: 'parallel', kp: 1, kd: 1, derivativeFilter: { timeConstant: -1 } } }),
      422,
      'negative_time',
      ['controller', 'derivativeFilter', 'timeConstant'],
    );
  });

  it('422 for a grid with min ≥ max or min ≤ 0', async () => {
    expectError(await post({ plant: lag, frequency: { min: 10, max: 1, points: 100 } }), 422, 'invalid_frequency_grid', ['frequency', 'max']);
    expectError(await post({ plant: lag, frequency: { min: 0, max: 1, points: 100 } }), 422, 'invalid_frequency_grid', ['frequency', 'min']);
  });

  it('422 for an improper loop (an unfiltered derivative on a biproper plant)', async () => {
    const plant = { kind: 'transfer-function', numerator: [1, 2], denominator: [1, 3] };
    expectError(await post({ plant, controller: { kind: 'pid', form: 'parallel', kp: 1, kd: 1 } }), 422, 'improper_loop');
  });

  it('422 naming the token for expressions outside the whitelist', async () => {
    for (const [expression, token] of [
      ['import(s)', 'import'],
      ['evaluate("1")', 'evaluate'],
      ['s.constructor', 'property access'],
      ['x = 2', 'assignment'],
      ['f(x) = x', 'function definition'],
      ['[1, 2]', 'matrix'],
      ['q * s', '"q"'],
    ] as const) {
      const r = await post({ plant: { kind: 'expression', expression } });
      expectError(r, 422, 'expression_not_allowed', ['plant', 'expression']);
      expect(r.body.message).toContain(token);
    }
    expectError(await post({ plant: { kind: 'expression', expression: '1/(s+' } }), 422, 'expression_syntax');
  });

  it('413 over the size limits', async () => {
    expectError(await post({ plant: lag, frequency: { min: 0.1, max: 10, points: 20001 } }), 413, 'too_many_points', ['frequency', 'points']);
    expectError(await post({ plant: { kind: 'transfer-function', numerator: [1], denominator: new Array(62).fill(1) } }), 413, 'polynomial_too_large');
    expectError(await post({ plant: { kind: 'expression', expression: '1/(s+1)' + '+0'.repeat(2000) } }), 413, 'expression_too_long');
    const huge = JSON.stringify({ plant: lag, padding: 'x'.repeat(1024 * 1024 + 10) });
    expectError(await post(huge), 413, 'body_too_large');
  });

  it('404 in the same shape for an unknown route', async () => {
    const res = await app.inject({ method: 'GET', url: '/v1/nothing-here' });
    expect(res.statusCode).toBe(404);
    expect(res.json()).toMatchObject({ statusCode: 404, code: 'not_found' });
  });
});

describe('POST /v1/analyses answers', () => {
  it('with version, request hash, figures, and the response arrays unless detail is summary', async () => {
    const body = { plant: { kind: 'transfer-function', numerator: [2], denominator: [1, 3, 2, 0] } };
    const full = await app.inject({ method: 'POST', url: '/v1/analyses', payload: body });
    expect(full.statusCode).toBe(200);
    const r = full.json();
    expect(r.requestHash).toMatch(/^sha256:[0-9a-f]{64}$/);
    expect(r.response.frequency.length).toBeGreaterThanOrEqual(200);
    // K/(s(s+1)(s+2)) with K = 2: GM = 6/K = 3 at √2 rad/s (Ogata, Modern Control Engineering, 5th ed.)
    expect(r.margins.gain.ratio).toBeCloseTo(3, 12);
    const summary = await app.inject({ method: 'POST', url: '/v1/analyses', payload: { ...body, detail: 'summary' } });
    expect(summary.json().response).toBeUndefined();
    expect(summary.json().requestHash).not.toBe(r.requestHash);
  });

  it('gives the same hash for the same request written with other key order', async () => {
    const a = await app.inject({ method: 'POST', url: '/v1/analyses', payload: '{"plant":{"kind":"transfer-function","numerator":[1],"denominator":[1,1]},"detail":"summary"}', headers: { 'content-type': 'application/json' } });
    const b = await app.inject({ method: 'POST', url: '/v1/analyses', payload: '{ "detail": "summary", "plant": {"denominator":[1,1], "numerator":[1], "kind":"transfer-function"}}', headers: { 'content-type': 'application/json' } });
    expect(a.json().requestHash).toBe(b.json().requestHash);
  });
});
