/** The figures a verdict rests on, taken from a full analysis. */
import type { LoopAnalysis } from '../analysis/analyze-loop.js';
import type { LoopSummary } from '../contract/schemas/checks.js';

export function summariseLoop(a: LoopAnalysis, loopDelaySeconds: number | null): LoopSummary {
  return {
    closedLoopStable: a.stability.closedLoopStable,
    margins: { gain: a.margins.gain, phase: a.margins.phase, delay: a.margins.delay },
    peaks: a.peaks,
    bandwidth: a.bandwidth,
    loopDelaySeconds,
  };
}
