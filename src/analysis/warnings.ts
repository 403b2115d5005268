/**
 * Warnings: findings a reviewer should see, each with the value, the limit
 * and where the limit comes from. Codes are stable; README lists them.
 */
import type { Criteria } from './criteria.js';
import { CRITERIA_SOURCES } from './criteria.js';
import type { Margins } from './margins.js';
import type { Peak } from './peaks.js';

export interface Warning {
  code: string;
  message: string;
  value: number | null;
  limit: number | null;
  source: string;
}

export const WARNING_CODES = {
  closedLoopUnstable: 'closed_loop_unstable',
  gainMarginLow: 'gain_margin_low',
  phaseMarginLow: 'phase_margin_low',
  delayMarginLow: 'delay_margin_low',
  sensitivityPeakHigh: 'sensitivity_peak_high',
  complementaryPeakHigh: 'complementary_peak_high',
  unfilteredDerivative: 'derivative_unfiltered',
  multipleGainCrossovers: 'multiple_gain_crossovers',
  openLoopPolesAssumed: 'open_loop_poles_assumed',
  stabilityMethodsDisagree: 'stability_methods_disagree',
  peakAtInfiniteFrequency: 'peak_at_infinite_frequency',
  noGainCrossover: 'no_gain_crossover',
  marginalStability: 'marginal_stability',
  sweepUnbounded: 'nyquist_sweep_unproven',
  gridTruncated: 'grid_truncated',
} as const;

export interface WarningInputs {
  criteria: Criteria;
  closedLoopStable: boolean;
  closedLoopUnstablePoles: number;
  margins: Margins;
  sensitivityPeak: Peak;
  complementaryPeak: Peak;
  unfilteredDerivative: boolean;
  unstablePolesAssumed: boolean;
  assumedPoleCount: number;
  rootsDisagree: { nyquist: number; roots: number } | null;
  marginal: boolean;
  sweepBounded: boolean;
  sweepTo: number;
  gridTruncated: boolean;
}

const COMMON = 'common practice';

export function collectWarnings(x: WarningInputs): Warning[] {
  const out: Warning[] = [];
  const c = x.criteria;
  if (!x.closedLoopStable) {
    out.push({
      code: WARNING_CODES.closedLoopUnstable,
      message: x.marginal
        ? 'The closed loop is not asymptotically stable: L(jω) passes through −1 (a closed-loop pole on the imaginary axis).'
        : `The closed loop is unstable: ${x.closedLoopUnstablePoles} closed-loop pole(s) in the right half-plane (Nyquist, Z = N + P).`,
      value: x.closedLoopUnstablePoles,
      limit: 0,
      source: 'Åström & Murray, Feedback Systems, 2nd ed., §10.2 (Nyquist criterion)',
    });
  }
  const gm = x.margins.gain;
  if (gm && Math.abs(gm.db) < c.minGainMarginDb) {
    out.push({
      code: WARNING_CODES.gainMarginLow,
      message: `Gain margin ${gm.db.toFixed(2)} dB at ${gm.frequency.toPrecision(4)} rad/s is below ${c.minGainMarginDb.toFixed(2)} dB${gm.ratio < 1 ? ' (a gain-reduction limit: the loop tolerates little loss of gain)' : ''}.`,
      value: Math.abs(gm.db),
      limit: c.minGainMarginDb,
      source: CRITERIA_SOURCES.minGainMarginDb,
    });
  }
  const pm = x.margins.phase;
  if (pm && pm.degrees < c.minPhaseMarginDegrees) {
    out.push({
      code: WARNING_CODES.phaseMarginLow,
      message: `Phase margin ${pm.degrees.toFixed(2)}° at ${pm.frequency.toPrecision(4)} rad/s is below ${c.minPhaseMarginDegrees}°.`,
      value: pm.degrees,
      limit: c.minPhaseMarginDegrees,
      source: CRITERIA_SOURCES.minPhaseMarginDegrees,
    });
  }
  if (c.minDelayMarginSeconds !== null) {
    const dm = x.margins.delay;
    if (!dm || dm.seconds < c.minDelayMarginSeconds) {
      out.push({
        code: WARNING_CODES.delayMarginLow,
        message: dm
          ? `Delay margin ${dm.seconds.toPrecision(4)} s is below ${c.minDelayMarginSeconds} s.`
          : 'There is no positive delay margin.',
        value: dm ? dm.seconds : null,
        limit: c.minDelayMarginSeconds,
        source: CRITERIA_SOURCES.minDelayMarginSeconds,
      });
    }
  }
  if (x.sensitivityPeak.value > c.maxSensitivityPeak) {
    out.push({
      code: WARNING_CODES.sensitivityPeakHigh,
      message: `Sensitivity peak Ms = ${x.sensitivityPeak.value.toFixed(3)} exceeds ${c.maxSensitivityPeak} (stability margin 1/Ms = ${(1 / x.sensitivityPeak.value).toFixed(3)}).`,
      value: x.sensitivityPeak.value,
      limit: c.maxSensitivityPeak,
      source: CRITERIA_SOURCES.maxSensitivityPeak,
    });
  }
  if (x.complementaryPeak.value > c.maxComplementaryPeak) {
    out.push({
      code: WARNING_CODES.complementaryPeakHigh,
      message: `Complementary sensitivity peak Mt = ${x.complementaryPeak.value.toFixed(3)} exceeds ${c.maxComplementaryPeak}.`,
      value: x.complementaryPeak.value,
      limit: c.maxComplementaryPeak,
      source: CRITERIA_SOURCES.maxComplementaryPeak,
    });
  }
  for (const [peak, name] of [[x.sensitivityPeak, 'sensitivity'], [x.complementaryPeak, 'complementary sensitivity']] as const) {
    if (peak.frequency === null) {
      out.push({
        code: WARNING_CODES.peakAtInfiniteFrequency,
        message: `The ${name} peak is approached as ω → ∞ (the loop is biproper or its gain does not roll off); no finite peak frequency exists.`,
        value: peak.value,
        limit: null,
        source: 'DESIGN.md: improper or non-causal loops (common practice)',
      });
    }
  }
  if (x.unfilteredDerivative) {
    out.push({
      code: WARNING_CODES.unfilteredDerivative,
      message: 'The derivative term has no filter: it amplifies measurement and A/D noise without bound. Add derivativeFilter (N typically 5–20).',
      value: null,
      limit: null,
      source: 'Åström & Hägglund, Advanced PID Control, ISA 2006, §3.3: N typically about 5–20 (from memory)',
    });
  }
  if (x.margins.gainCrossovers.length > 1) {
    out.push({
      code: WARNING_CODES.multipleGainCrossovers,
      message: `|L| crosses 1 at ${x.margins.gainCrossovers.length} frequencies; the phase margin is the smallest of them and the loop may be sensitive to gain changes between them.`,
      value: x.margins.gainCrossovers.length,
      limit: 1,
      source: COMMON,
    });
  }
  if (x.margins.gainCrossovers.length === 0) {
    out.push({
      code: WARNING_CODES.noGainCrossover,
      message: '|L| never crosses 1: there is no phase margin and no crossover frequency.',
      value: null,
      limit: null,
      source: COMMON,
    });
  }
  if (x.unstablePolesAssumed) {
    out.push({
      code: WARNING_CODES.openLoopPolesAssumed,
      message: `The number of open-loop right-half-plane poles cannot be read from this plant; ${x.assumedPoleCount} was assumed. The stability verdict rests on it: give openLoopUnstablePoles.`,
      value: x.assumedPoleCount,
      limit: null,
      source: 'Nyquist criterion Z = N + P needs P (Åström & Murray, Feedback Systems, §10.2)',
    });
  }
  if (x.rootsDisagree) {
    out.push({
      code: WARNING_CODES.stabilityMethodsDisagree,
      message: `The Nyquist count (${x.rootsDisagree.nyquist} unstable closed-loop poles) and the characteristic polynomial's roots (${x.rootsDisagree.roots}) disagree; this points to a cancelled unstable or imaginary-axis mode, or an ill-conditioned polynomial. The verdict takes the worse of the two.`,
      value: x.rootsDisagree.roots,
      limit: x.rootsDisagree.nyquist,
      source: 'DESIGN.md: ill-conditioned polynomials (common practice)',
    });
  }
  if (!x.sweepBounded) {
    out.push({
      code: WARNING_CODES.sweepUnbounded,
      message: `No bound of |L| at high frequency is known for this plant kind; the Nyquist sweep ended at ${x.sweepTo.toPrecision(4)} rad/s where |L| had become negligible on samples.`,
      value: x.sweepTo,
      limit: null,
      source: COMMON,
    });
  }
  if (x.gridTruncated) {
    out.push({
      code: WARNING_CODES.gridTruncated,
      message: 'The adaptive frequency grid reached its point budget; fast phase changes may be under-resolved.',
      value: null,
      limit: null,
      source: COMMON,
    });
  }
  return out;
}
