import { describe, expect, it } from 'vitest';
import {
  CRITERIA_PROFILES,
  CRITERION_DESCRIPTIONS,
  GATE_CRITERIA,
  PROFILE_NAMES,
  gainMarginDbImpliedBy,
  phaseMarginDegreesImpliedBy,
  profileNamed,
} from '../../src/gate/criteria-profiles.js';

describe('criteria profiles', () => {
  it('PROFILE_NAMES lists exactly the profiles, each described, with every criterion given a severity and a source', () => {
    expect(CRITERIA_PROFILES.map((p) => p.name)).toEqual([...PROFILE_NAMES]);
    for (const p of CRITERIA_PROFILES) {
      expect(p.summary.length).toBeGreaterThan(10);
      expect(p.usedFor.length).toBeGreaterThan(20);
      expect(Object.keys(p.limits).sort()).toEqual([...GATE_CRITERIA].sort());
      for (const l of Object.values(p.limits)) {
        expect(['fail', 'warn']).toContain(l.severity);
        expect(l.source.length).toBeGreaterThan(5);
      }
    }
    expect(Object.keys(CRITERION_DESCRIPTIONS).sort()).toEqual([...GATE_CRITERIA].sort());
  });

  it('a number with a published source names the source; the rest say "common practice" or that they are unset', () => {
    for (const p of CRITERIA_PROFILES) {
      for (const l of Object.values(p.limits)) {
        if (l.value === null) continue;
        expect(l.source).toMatch(/Skogestad & Postlethwaite|Åström & Hägglund|common practice/);
      }
    }
  });

  it('baseline: GM 6 dB, PM 30°, Ms 2 fail and Mt 1.25 warns (Skogestad & Postlethwaite §2.4.3, from memory)', () => {
    const l = profileNamed('baseline').limits;
    expect([l.minGainMarginDb.value, l.minPhaseMarginDegrees.value, l.maxSensitivityPeak.value, l.maxComplementaryPeak.value]).toEqual([6, 30, 2, 1.25]);
    expect(l.maxComplementaryPeak.severity).toBe('warn');
    expect(l.minGainMarginDb.severity).toBe('fail');
    expect(l.minDelayMarginSeconds.value).toBeNull();
  });

  it('plant-changes: Ms ≤ 1.4 (Åström & Hägglund) with the margins it implies, GM ≥ Ms/(Ms−1) = 3.5 and PM ≥ 2·asin(1/(2Ms))', () => {
    const l = profileNamed('plant-changes').limits;
    expect(l.maxSensitivityPeak.value).toBe(1.4);
    expect(l.maxSensitivityPeak.source).toContain('Åström & Hägglund, Advanced PID Control');
    // 20·log10(3.5) = 10.88136 dB, 2·asin(1/2.8) = 41.84966° (mpmath, 30 digits)
    expect(l.minGainMarginDb.value).toBeCloseTo(10.881360887005513, 12);
    expect(l.minPhaseMarginDegrees.value).toBeCloseTo(41.8496648552766354, 10);
    expect(gainMarginDbImpliedBy(2)).toBeCloseTo(20 * Math.log10(2), 14);
    expect(phaseMarginDegreesImpliedBy(1)).toBeCloseTo(60, 12); // 2·asin(1/2) = 60°
  });

  it('uncertain-delay: DM ≥ 1 × the loop delay, on top of the baseline; advisory: the baseline numbers as warnings', () => {
    const u = profileNamed('uncertain-delay').limits;
    expect(u.minDelayMarginMultiple).toMatchObject({ value: 1, severity: 'fail' });
    expect(u.minGainMarginDb.value).toBe(6);
    const a = profileNamed('advisory').limits;
    for (const k of GATE_CRITERIA) {
      expect(a[k].severity).toBe('warn');
      expect(a[k].value).toBe(profileNamed('baseline').limits[k].value);
    }
  });
});
