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

const plant = { kind: 'transfer-function', numerator: [2], denominator: [5, 1], delay: 1 };
const pi = (gain: number) => ({ kind: 'pid', form: 'standard', gain, integralTime: 5 });

describe('POST /v1/comparisons', () => {
  it('answers both analyses, both verdicts and the change in each figure', async () => {
    const res = await app.inject({ method: 'POST', url: '/v1/comparisons', payload: { plant, baseline: pi(1), candidate: pi(0.8) } });
    expect(res.statusCode).toBe(200);
    const r = res.json();
    expect(r.baseline.verdict).toBe('pass');
    expect(r.candidate.verdict).toBe('pass');
    // L = 0.4·K'·e^{−s}/s (Ti cancels the lag): PM = π/2 − k (derivation, REFERENCES.md), k = 0.4 → 0.32.
    expect(r.changes.phaseMarginDegrees.change).toBeCloseTo((0.08 * 180) / Math.PI, 8);
    expect(r.changes.phaseMarginDegrees.change).toBe(r.candidate.analysis.margins.phase.degrees - r.baseline.analysis.margins.phase.degrees);
    expect(r.baseline.analysis.response).toBeUndefined();
  });

  it('400 naming the field; 422 pointing at the tuning that cannot be analysed', async () => {
    const missing = await app.inject({ method: 'POST', url: '/v1/comparisons', payload: { plant, baseline: pi(1) } });
    expect(missing.statusCode).toBe(400);
    expect(missing.json().issues[0].path).toEqual(['candidate']);
    const negative = await app.inject({ method: 'POST', url: '/v1/comparisons', payload: { plant, baseline: { ...pi(1), integralTime: -1 }, candidate: pi(1) } });
    expect(negative.statusCode).toBe(422);
    expect(negative.json().issues[0].path).toEqual(['baseline', 'integralTime']);
  });
});
