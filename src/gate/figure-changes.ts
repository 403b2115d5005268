/** The change in each review figure from one analysis to another: candidate − baseline. */
import type { LoopAnalysis } from '../analysis/analyze-loop.js';
import { FIGURES, type Figure, type FigureChange } from '../contract/schemas/comparisons.js';

type Summary = Pick<LoopAnalysis, 'margins' | 'peaks' | 'bandwidth'>;

const READ: Record<Figure, (a: Summary) => number | null> = {
  gainMarginDb: (a) => a.margins.gain?.db ?? null,
  gainMarginRatio: (a) => a.margins.gain?.ratio ?? null,
  phaseCrossoverFrequency: (a) => a.margins.gain?.frequency ?? null,
  phaseMarginDegrees: (a) => a.margins.phase?.degrees ?? null,
  delayMarginSeconds: (a) => a.margins.delay?.seconds ?? null,
  crossoverFrequency: (a) => a.bandwidth.crossover,
  sensitivityPeak: (a) => a.peaks.sensitivity.value,
  complementarySensitivityPeak: (a) => a.peaks.complementarySensitivity.value,
  closedLoopBandwidth: (a) => a.bandwidth.closedLoop,
  sensitivityBandwidth: (a) => a.bandwidth.sensitivity,
};

export function figureChanges(baseline: Summary, candidate: Summary): Record<Figure, FigureChange> {
  const out = {} as Record<Figure, FigureChange>;
  for (const f of FIGURES) {
    const b = READ[f](baseline);
    const c = READ[f](candidate);
    out[f] = { baseline: b, candidate: c, change: b === null || c === null ? null : c - b };
  }
  return out;
}
