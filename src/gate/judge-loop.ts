/**
 * Findings and verdict of one analysed loop under resolved criteria.
 *
 * - An unstable closed loop (Nyquist Z = N + P, cross-checked by the roots)
 *   always fails, whatever the profile.
 * - A breached threshold fails or warns as its criterion's severity says.
 *   A margin that does not exist because nothing crosses (no phase
 *   crossover: unbounded gain margin; no gain crossover: unbounded phase
 *   and delay margins) breaches nothing.
 * - Analysis cautions that put the verdict itself in doubt (assumed
 *   open-loop poles, disagreeing stability methods, an unproven Nyquist
 *   sweep, a truncated grid) and an unfiltered derivative warn.
 */
import type { LoopAnalysis } from '../analysis/analyze-loop.js';
import { WARNING_CODES, type Warning } from '../analysis/warnings.js';
import type { Finding, Verdict } from '../contract/schemas/checks.js';
import type { GateCriterion, Limit } from './criteria-profiles.js';
import type { ResolvedCriteria } from './resolve-gate-criteria.js';
import { verdictOf } from './verdict.js';

export const GATE_FINDING_CODES = {
  ...WARNING_CODES,
  delayMarginBelowMultiple: 'delay_margin_below_multiple',
  loopDelayUnknown: 'loop_delay_unknown',
} as const;

/** Analysis warnings that make the verdict rest on an assumption or an unchecked step. */
const CAUTIONS_THAT_WARN = new Set<string>([
  WARNING_CODES.openLoopPolesAssumed,
  WARNING_CODES.stabilityMethodsDisagree,
  WARNING_CODES.sweepUnbounded,
  WARNING_CODES.gridTruncated,
  WARNING_CODES.unfilteredDerivative,
]);

const STABILITY_SOURCE = 'Åström & Murray, Feedback Systems, 2nd ed., §10.2 (Nyquist criterion)';

export interface JudgedLoop {
  verdict: Verdict;
  findings: Finding[];
}

function breach(criterion: GateCriterion, limit: Limit, code: string, message: string, value: number | null): Finding {
  return { code, message, value, limit: limit.value, source: limit.source, severity: limit.severity, criterion };
}

const fmt = (x: number, digits = 4) => x.toPrecision(digits);

/**
 * @param loopDelay the loop's pure delay in seconds, or null when the plant
 *   kind does not state it (expressions, measured data).
 */
export function judgeLoop(analysis: LoopAnalysis, criteria: ResolvedCriteria, loopDelay: number | null): JudgedLoop {
  const findings: Finding[] = [];
  const { limits } = criteria;
  const { margins, peaks } = analysis;
  const crossesUnity = margins.gainCrossovers.length > 0;

  if (!analysis.stability.closedLoopStable) {
    const w = analysis.warnings.find((x) => x.code === WARNING_CODES.closedLoopUnstable);
    findings.push({
      code: WARNING_CODES.closedLoopUnstable,
      message: w?.message ?? 'The closed loop is unstable.',
      value: w?.value ?? analysis.stability.nyquist.closedLoopUnstablePoles,
      limit: 0,
      source: w?.source ?? STABILITY_SOURCE,
      severity: 'fail',
      criterion: null,
    });
  }

  const gm = limits.minGainMarginDb;
  if (gm.value !== null && margins.gain && Math.abs(margins.gain.db) < gm.value) {
    const g = margins.gain;
    findings.push(
      breach('minGainMarginDb', gm, WARNING_CODES.gainMarginLow,
        `Gain margin ${Math.abs(g.db).toFixed(2)} dB at ${fmt(g.frequency)} rad/s is below ${gm.value.toFixed(2)} dB${g.ratio < 1 ? ' (a gain-reduction limit)' : ''}.`,
        Math.abs(g.db)),
    );
  }

  const pm = limits.minPhaseMarginDegrees;
  if (pm.value !== null && margins.phase && margins.phase.degrees < pm.value) {
    findings.push(
      breach('minPhaseMarginDegrees', pm, WARNING_CODES.phaseMarginLow,
        `Phase margin ${margins.phase.degrees.toFixed(2)}° at ${fmt(margins.phase.frequency)} rad/s is below ${pm.value.toFixed(2)}°.`,
        margins.phase.degrees),
    );
  }

  const ms = limits.maxSensitivityPeak;
  if (ms.value !== null && peaks.sensitivity.value > ms.value) {
    findings.push(
      breach('maxSensitivityPeak', ms, WARNING_CODES.sensitivityPeakHigh,
        `Sensitivity peak Ms = ${peaks.sensitivity.value.toFixed(3)} exceeds ${ms.value.toFixed(3)} (stability margin 1/Ms = ${(1 / peaks.sensitivity.value).toFixed(3)}).`,
        peaks.sensitivity.value),
    );
  }

  const mt = limits.maxComplementaryPeak;
  if (mt.value !== null && peaks.complementarySensitivity.value > mt.value) {
    findings.push(
      breach('maxComplementaryPeak', mt, WARNING_CODES.complementaryPeakHigh,
        `Complementary sensitivity peak Mt = ${peaks.complementarySensitivity.value.toFixed(3)} exceeds ${mt.value.toFixed(3)}.`,
        peaks.complementarySensitivity.value),
    );
  }

  // Delay margin: none at all while |L| crosses 1 means every crossover has PM ≤ 0.
  const dm = margins.delay;
  const dmSeconds = dm ? dm.seconds : crossesUnity ? null : Infinity;
  const ds = limits.minDelayMarginSeconds;
  if (ds.value !== null && (dmSeconds === null || dmSeconds < ds.value)) {
    findings.push(
      breach('minDelayMarginSeconds', ds, WARNING_CODES.delayMarginLow,
        dmSeconds === null
          ? `There is no positive delay margin; at least ${fmt(ds.value)} s is required.`
          : `Delay margin ${fmt(dmSeconds)} s at ${fmt(dm!.frequency)} rad/s is below ${fmt(ds.value)} s.`,
        dmSeconds),
    );
  }

  const dk = limits.minDelayMarginMultiple;
  if (dk.value !== null) {
    if (loopDelay === null) {
      findings.push(
        breach('minDelayMarginMultiple', dk, GATE_FINDING_CODES.loopDelayUnknown,
          `The loop delay is not stated by this plant kind, so "delay margin ≥ ${dk.value} × delay" cannot be checked; give minDelayMarginSeconds instead.`,
          null),
      );
    } else {
      const required = dk.value * loopDelay;
      if (dmSeconds === null || dmSeconds < required) {
        findings.push(
          breach('minDelayMarginMultiple', dk, GATE_FINDING_CODES.delayMarginBelowMultiple,
            dmSeconds === null
              ? `There is no positive delay margin; at least ${dk.value} × the loop delay ${fmt(loopDelay)} s is required.`
              : `Delay margin ${fmt(dmSeconds)} s is ${fmt(dmSeconds / loopDelay, 3)} × the loop delay ${fmt(loopDelay)} s; at least ${dk.value} × (${fmt(required)} s) is required.`,
            dmSeconds === null || loopDelay === 0 ? null : dmSeconds / loopDelay),
        );
      }
    }
  }

  for (const w of analysis.warnings) {
    if (CAUTIONS_THAT_WARN.has(w.code)) findings.push(caution(w));
  }
  return { verdict: verdictOf(findings), findings };
}

const caution = (w: Warning): Finding => ({ ...w, severity: 'warn', criterion: null });
