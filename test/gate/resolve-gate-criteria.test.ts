import { describe, expect, it } from 'vitest';
import { profileNamed } from '../../src/gate/criteria-profiles.js';
import { resolveGateCriteria } from '../../src/gate/resolve-gate-criteria.js';

describe('resolveGateCriteria', () => {
  it('defaults to the baseline profile, unchanged', () => {
    const r = resolveGateCriteria(undefined);
    expect(r.profile).toBe('baseline');
    expect(r.limits).toEqual(profileNamed('baseline').limits);
    expect(r.overridden).toEqual([]);
  });

  it('overrides single limits and cites the caller; null switches a criterion off', () => {
    const r = resolveGateCriteria({ profile: 'plant-changes', maxSensitivityPeak: 1.6, minPhaseMarginDegrees: null });
    expect(r.profile).toBe('plant-changes');
    expect(r.limits.maxSensitivityPeak).toEqual({ value: 1.6, severity: 'fail', source: 'set by the caller' });
    expect(r.limits.minPhaseMarginDegrees.value).toBeNull();
    expect(r.limits.minGainMarginDb).toEqual(profileNamed('plant-changes').limits.minGainMarginDb);
    expect(r.overridden).toEqual(['minPhaseMarginDegrees', 'maxSensitivityPeak']);
  });

  it('a severity override keeps the profile number and its source', () => {
    const r = resolveGateCriteria({ severity: { maxComplementaryPeak: 'fail' } });
    expect(r.limits.maxComplementaryPeak.value).toBe(1.25);
    expect(r.limits.maxComplementaryPeak.severity).toBe('fail');
    expect(r.limits.maxComplementaryPeak.source).toBe(profileNamed('baseline').limits.maxComplementaryPeak.source);
  });

  it("a loop's criteria with a profile stand alone; without one they are laid over the request's", () => {
    const request = { profile: 'advisory' as const, minGainMarginDb: 8 };
    const alone = resolveGateCriteria(request, { profile: 'baseline' });
    expect(alone.profile).toBe('baseline');
    expect(alone.limits.minGainMarginDb.value).toBe(6);
    const layered = resolveGateCriteria(request, { maxSensitivityPeak: 1.5 });
    expect(layered.profile).toBe('advisory');
    expect(layered.limits.minGainMarginDb).toMatchObject({ value: 8, severity: 'warn' });
    expect(layered.limits.maxSensitivityPeak).toMatchObject({ value: 1.5, severity: 'warn' });
    expect(layered.overridden).toEqual(['minGainMarginDb', 'maxSensitivityPeak']);
  });

  it('does not change the profile tables', () => {
    resolveGateCriteria({ minGainMarginDb: 99 });
    expect(profileNamed('baseline').limits.minGainMarginDb.value).toBe(6);
  });
});
