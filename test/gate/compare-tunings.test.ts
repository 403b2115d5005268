import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/contract/analyze.js';
import { LoopgateError } from '../../src/contract/errors.js';
import { FIGURES } from '../../src/contract/schemas/comparisons.js';
import { compareTunings } from '../../src/gate/compare-tunings.js';

// The pasteuriser temperature loop: 2·e^{−s}/(5s + 1) under PI control.
const plant = { kind: 'transfer-function', numerator: [2], denominator: [5, 1], delay: 1 };
const pi = (gain: number, integralTime: number) => ({ kind: 'pid', form: 'standard', gain, integralTime });
const baseline = pi(1, 5);
const candidate = pi(1.5, 5);

describe('compareTunings', () => {
  it('each change equals the difference of two separate analyses (POST /v1/analyses, detail summary)', () => {
    const c = compareTunings({ plant, baseline, candidate });
    const a = analyze({ plant, controller: baseline, detail: 'summary' });
    const b = analyze({ plant, controller: candidate, detail: 'summary' });
    const pairs: Record<(typeof FIGURES)[number], [number | null, number | null]> = {
      gainMarginDb: [a.margins.gain!.db, b.margins.gain!.db],
      gainMarginRatio: [a.margins.gain!.ratio, b.margins.gain!.ratio],
      phaseCrossoverFrequency: [a.margins.gain!.frequency, b.margins.gain!.frequency],
      phaseMarginDegrees: [a.margins.phase!.degrees, b.margins.phase!.degrees],
      delayMarginSeconds: [a.margins.delay!.seconds, b.margins.delay!.seconds],
      crossoverFrequency: [a.bandwidth.crossover, b.bandwidth.crossover],
      sensitivityPeak: [a.peaks.sensitivity.value, b.peaks.sensitivity.value],
      complementarySensitivityPeak: [a.peaks.complementarySensitivity.value, b.peaks.complementarySensitivity.value],
      closedLoopBandwidth: [a.bandwidth.closedLoop, b.bandwidth.closedLoop],
      sensitivityBandwidth: [a.bandwidth.sensitivity, b.bandwidth.sensitivity],
    };
    for (const f of FIGURES) {
      const [x, y] = pairs[f];
      expect(c.changes[f].baseline).toBe(x);
      expect(c.changes[f].candidate).toBe(y);
      expect(c.changes[f].change).toBe(y! - x!);
    }
    expect(c.baseline.analysis.margins).toEqual(a.margins);
    expect(c.candidate.analysis.peaks).toEqual(b.peaks);
    expect('response' in c.candidate.analysis).toBe(false);
  });

  it('closed form: with Ti equal to the lag, L = (K·2/5)·e^{−s}/s, so raising K by 50% changes PM by −0.2 rad·(180/π) and GM by −20·log10(1.5) dB', () => {
    // k·e^{−sT}/s: crossover k, PM = π/2 − kT, GM = π/(2kT) (derivation, REFERENCES.md); k = 0.4 → 0.6, T = 1.
    const c = compareTunings({ plant, baseline, candidate });
    expect(c.changes.crossoverFrequency.change!).toBeCloseTo(0.2, 9);
    expect(c.changes.phaseMarginDegrees.change!).toBeCloseTo((-0.2 * 180) / Math.PI, 8);
    expect(c.changes.gainMarginDb.change!).toBeCloseTo(-20 * Math.log10(1.5), 8);
    expect(c.changes.delayMarginSeconds.change!).toBeCloseTo(Math.PI / (2 * 0.6) - Math.PI / (2 * 0.4), 8);
  });

  it('judges both under the chosen profile', () => {
    const c = compareTunings({ plant, baseline, candidate: pi(2.5, 5), criteria: { profile: 'plant-changes' } });
    expect(c.profile).toBe('plant-changes');
    expect(c.baseline.verdict).toBe('fail'); // Ms = 1.44 > 1.4
    expect(c.baseline.findings.map((f) => f.code)).toContain('sensitivity_peak_high');
    expect(c.candidate.verdict).toBe('fail');
    expect(c.requestHash).toMatch(/^sha256:/);
  });

  it('a change is null when a figure exists on one side only', () => {
    // On 1/((s+1)(s+2)) the phase of a P loop stays above −180°: no phase crossover. A PI with
    // strong integral action (ki/kp = 10) adds −90° + atan(kp·ω/ki) and crosses −180° once.
    const lag = { kind: 'transfer-function', numerator: [1], denominator: [1, 3, 2] };
    const c = compareTunings({ plant: lag, baseline: { kind: 'pid', form: 'parallel', kp: 1 }, candidate: { kind: 'pid', form: 'parallel', kp: 0.1, ki: 1 } });
    expect(c.changes.gainMarginDb.baseline).toBeNull();
    expect(c.changes.gainMarginDb.candidate).not.toBeNull();
    expect(c.changes.gainMarginDb.change).toBeNull();
  });

  it('a controller error points at baseline or candidate', () => {
    try {
      compareTunings({ plant, baseline, candidate: { kind: 'pid', form: 'standard', gain: 1, integralTime: -3 } });
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(LoopgateError);
      expect((err as LoopgateError).issues?.[0].path).toEqual(['candidate', 'integralTime']);
    }
    try {
      compareTunings({ plant: { kind: 'transfer-function', numerator: [1, 2], denominator: [1, 3] }, baseline: { kind: 'pid', form: 'parallel', kp: 1, kd: 1 }, candidate });
      expect.unreachable();
    } catch (err) {
      expect((err as LoopgateError).code).toBe('improper_loop');
      expect((err as LoopgateError).issues?.[0].path[0]).toBe('baseline');
    }
  });
});
