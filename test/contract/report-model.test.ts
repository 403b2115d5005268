/**
 * The report's rows and marks for L(s) = e^{−s}/s, whose figures are
 * closed forms (common practice, worked by hand): |L| = 1/ω, so ωc = 1 rad/s
 * and PM = 180° − 90° − (1 rad = 57.30°) = 32.70°; the delay margin is
 * PM/ωc = (π/2 − 1) s = 0.5708 s; the phase −90° − ω·57.30° reaches −180°
 * at ω180 = π/2, where |L| = 2/π, so GM = π/2 (3.92 dB).
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/contract/analyze.js';
import { reportModel } from '../../src/contract/report-model.js';

const loop = { plant: { kind: 'transfer-function', numerator: [1], denominator: [1, 0], delay: 1 } };
const row = (m: ReturnType<typeof reportModel>, key: string) => m.criteriaRows.find((r) => r.key === key)!;

describe('reportModel', () => {
  it('carries the closed-form figures with their marks under the baseline', () => {
    const m = reportModel(loop);
    expect(row(m, 'minGainMarginDb').value!).toBeCloseTo(20 * Math.log10(Math.PI / 2), 9);
    expect(row(m, 'minGainMarginDb').mark).toBe('fail'); // 3.92 dB < 6 dB
    expect(row(m, 'minPhaseMarginDegrees').value!).toBeCloseTo(90 - 180 / Math.PI, 8);
    expect(row(m, 'minPhaseMarginDegrees').mark).toBe('pass'); // 32.7° ≥ 30°
    expect(row(m, 'minDelayMarginSeconds').value!).toBeCloseTo(Math.PI / 2 - 1, 9);
    expect(row(m, 'minDelayMarginSeconds').mark).toBe('none');
    expect(m.verdict).toBe('fail');
    expect(m.profile).toBe('baseline');
    expect(m.criteriaRows.some((r) => r.key === 'minDelayMarginMultiple')).toBe(false);
  });

  it('adds the delay-margin multiple under the uncertain-delay profile', () => {
    const m = reportModel({ ...loop, report: { profile: 'uncertain-delay' } });
    const r = row(m, 'minDelayMarginMultiple');
    expect(r.value!).toBeCloseTo(Math.PI / 2 - 1, 9); // over a loop delay of 1 s
    expect(r.mark).toBe('fail'); // 0.57 < 1
    expect(r.limit).toBe('≥ 1 × the loop delay');
  });

  it('lets the request criteria set the limits, citing the caller', () => {
    const m = reportModel({ ...loop, criteria: { minGainMarginDb: 3 } });
    expect(row(m, 'minGainMarginDb').mark).toBe('pass');
    expect(row(m, 'minGainMarginDb').source).toBe('set by the caller');
  });

  it('computes the time responses of a rational plant even when the request did not ask', () => {
    const m = reportModel(loop);
    expect(m.analysis.timeResponse).toBeDefined();
    expect(m.timeRows.map((r) => r.key)).toContain('overshootPercent');
  });
});

describe('reportModel when the simulation cannot run', () => {
  it('keeps the frequency-domain report and says why there is no time response', () => {
    // P = s + 1 is improper on its own (no state-space realisation), yet L = (0.5/s)·(s + 1) is biproper and analysable.
    const m = reportModel({ plant: { kind: 'transfer-function', numerator: [1, 1], denominator: [1] }, controller: { kind: 'pid', form: 'parallel', ki: 0.5 } });
    expect(m.analysis.timeResponse).toBeUndefined();
    expect(m.timeResponseUnavailable).toMatch(/cannot be simulated/);
    expect(m.criteriaRows.length).toBeGreaterThan(4);
  });
});

describe('reportModel for a plant given in z', () => {
  it('reports the sampled-loop review without a continuous time response', () => {
    const body = {
      plant: { kind: 'transfer-function', numerator: [0.1], denominator: [1, -0.9], variable: 'z', samplePeriod: 0.1 },
      controller: { kind: 'pid', form: 'parallel', kp: 1, ki: 1, implementation: { samplePeriod: 0.1, method: 'tustin' } },
    };
    const m = reportModel(body);
    expect(m.analysis.timeResponse).toBeUndefined();
    expect(m.timeResponseUnavailable).toMatch(/sampled loop/);
    expect(m.criteriaRows.find((r) => r.key === 'minPhaseMarginDegrees')!.value).toBe(analyze(body).margins.phase?.degrees ?? null);
  });
});
