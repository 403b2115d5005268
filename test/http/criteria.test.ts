import { describe, expect, it } from 'vitest';
import { buildApp } from '../../src/http/app.js';
import { CRITERIA_PROFILES } from '../../src/gate/criteria-profiles.js';

describe('GET /v1/criteria', () => {
  it('lists every profile with each limit, its severity and its source, and what always fails', async () => {
    const app = await buildApp();
    const res = await app.inject({ method: 'GET', url: '/v1/criteria' });
    await app.close();
    expect(res.statusCode).toBe(200);
    const r = res.json();
    expect(r.defaultProfile).toBe('baseline');
    expect(r.alwaysFails).toMatch(/unstable/);
    expect(r.profiles.map((p: { name: string }) => p.name)).toEqual(CRITERIA_PROFILES.map((p) => p.name));
    const robust = r.profiles.find((p: { name: string }) => p.name === 'plant-changes');
    expect(robust.limits.maxSensitivityPeak).toEqual({ value: 1.4, severity: 'fail', source: expect.stringContaining('Åström & Hägglund') });
    expect(r.criteria.map((c: { name: string }) => c.name)).toContain('minDelayMarginMultiple');
  });
});
