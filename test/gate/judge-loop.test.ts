import { describe, expect, it } from 'vitest';
import type { LoopAnalysis } from '../../src/analysis/analyze-loop.js';
import { judgeLoop } from '../../src/gate/judge-loop.js';
import { resolveGateCriteria } from '../../src/gate/resolve-gate-criteria.js';

/** A hand-made analysis: the judge reads only figures, so each edge case can be set up exactly. */
function analysis(over: Omit<Partial<LoopAnalysis>, 'margins'> & { margins?: Partial<LoopAnalysis['margins']> } = {}): LoopAnalysis {
  const base: LoopAnalysis = {
    stability: {
      closedLoopStable: true,
      openLoopUnstablePoles: 0,
      openLoopUnstablePolesAssumed: false,
      integrators: 1,
      imaginaryAxisPoles: [],
      method: 'nyquist',
      nyquist: { clockwiseEncirclements: 0, closedLoopUnstablePoles: 0, sweepTo: 100, closestApproachToCritical: 0.8 },
    },
    margins: {
      gain: { ratio: 4, db: 20 * Math.log10(4), frequency: 2 },
      phase: { degrees: 60, frequency: 0.5 },
      delay: { seconds: 2, frequency: 0.5 },
      gainCrossovers: [{ frequency: 0.5, phaseMarginDegrees: 60, delayMarginSeconds: 2 }],
      phaseCrossovers: [{ frequency: 2, ratio: 4, db: 20 * Math.log10(4) }],
    },
    peaks: { sensitivity: { value: 1.3, db: 2.3, frequency: 1 }, complementarySensitivity: { value: 1.1, db: 0.8, frequency: 0.4 } },
    bandwidth: { closedLoop: 0.8, sensitivity: 0.3, crossover: 0.5 },
    warnings: [],
    grid: { min: 0.001, max: 1000, points: 500 },
  };
  return { ...base, ...over, margins: { ...base.margins, ...over.margins } } as LoopAnalysis;
}

const strict = resolveGateCriteria({ minDelayMarginSeconds: 1, minDelayMarginMultiple: 1 });

describe('judgeLoop', () => {
  it('passes a loop inside every limit, with no findings', () => {
    expect(judgeLoop(analysis(), strict, 1)).toEqual({ verdict: 'pass', findings: [] });
  });

  it('a margin that does not exist because nothing crosses breaches nothing', () => {
    // No phase crossover: unbounded gain margin. No gain crossover: unbounded phase and delay margins.
    const a = analysis({ margins: { gain: null, phase: null, delay: null, gainCrossovers: [], phaseCrossovers: [] } });
    expect(judgeLoop(a, strict, 1).findings).toEqual([]);
  });

  it('no delay margin while |L| crosses 1 (every crossover with PM ≤ 0) breaches both delay criteria, with value null', () => {
    const a = analysis({
      margins: { phase: { degrees: -5, frequency: 1 }, delay: null, gainCrossovers: [{ frequency: 1, phaseMarginDegrees: -5, delayMarginSeconds: null }] },
    });
    const j = judgeLoop(a, strict, 0.5);
    const codes = j.findings.map((f) => f.code);
    expect(codes).toEqual(['phase_margin_low', 'delay_margin_low', 'delay_margin_below_multiple']);
    expect(j.findings[1].value).toBeNull();
    expect(j.findings[2].value).toBeNull();
  });

  it('the delay-multiple criterion cannot be checked without a stated delay: a finding at its own severity', () => {
    const j = judgeLoop(analysis(), strict, null);
    expect(j.findings).toHaveLength(1);
    expect(j.findings[0]).toMatchObject({ code: 'loop_delay_unknown', severity: 'fail', criterion: 'minDelayMarginMultiple', value: null, limit: 1 });
    const warnOnly = resolveGateCriteria({ minDelayMarginMultiple: 1, severity: { minDelayMarginMultiple: 'warn' } });
    expect(judgeLoop(analysis(), warnOnly, null).verdict).toBe('warn');
  });

  it('uses |dB| of a gain-reduction margin (ratio below 1), as the analysis reports it', () => {
    const a = analysis({ margins: { gain: { ratio: 0.7, db: 20 * Math.log10(0.7), frequency: 0.1 } } });
    const j = judgeLoop(a, resolveGateCriteria(undefined), 1);
    expect(j.findings[0].code).toBe('gain_margin_low');
    expect(j.findings[0].value).toBeCloseTo(-20 * Math.log10(0.7), 12);
    expect(j.findings[0].message).toContain('gain-reduction');
  });

  it('analysis cautions that put the verdict in doubt warn; descriptive ones do not', () => {
    const w = (code: string) => ({ code, message: code, value: null, limit: null, source: 'common practice' });
    const a = analysis({
      warnings: [w('open_loop_poles_assumed'), w('stability_methods_disagree'), w('nyquist_sweep_unproven'), w('grid_truncated'), w('derivative_unfiltered'), w('multiple_gain_crossovers'), w('peak_at_infinite_frequency'), w('no_gain_crossover')],
    });
    const j = judgeLoop(a, resolveGateCriteria(undefined), 1);
    expect(j.verdict).toBe('warn');
    expect(j.findings.map((f) => f.code)).toEqual(['open_loop_poles_assumed', 'stability_methods_disagree', 'nyquist_sweep_unproven', 'grid_truncated', 'derivative_unfiltered']);
    expect(j.findings.every((f) => f.severity === 'warn' && f.criterion === null)).toBe(true);
  });

  it('an unstable loop fails first, with the analysis’ own message and source', () => {
    const a = analysis({
      stability: { ...analysis().stability, closedLoopStable: false },
      warnings: [{ code: 'closed_loop_unstable', message: 'unstable: 2 poles', value: 2, limit: 0, source: 'Nyquist' }],
    });
    const j = judgeLoop(a, resolveGateCriteria({ profile: 'advisory' }), 1);
    expect(j.verdict).toBe('fail');
    expect(j.findings[0]).toEqual({ code: 'closed_loop_unstable', message: 'unstable: 2 poles', value: 2, limit: 0, source: 'Nyquist', severity: 'fail', criterion: null });
  });
});
