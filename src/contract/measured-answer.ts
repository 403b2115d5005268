/**
 * For measured plants: the interpolation note, interpolation errors and
 * coherence-based uncertainty bands attached to the margins, and the data
 * warnings (src/analysis/measured-quality.ts does the work).
 */
import { assessMeasuredLoop } from '../analysis/measured-quality.js';
import type { LoopAnalysis } from '../analysis/analyze-loop.js';
import type { FrequencyModel } from '../model/frequency-model.js';
import { productModel } from '../model/loop.js';
import type { MeasuredModel } from '../model/plants/frequency-response.js';
import type { BuiltLoop } from './build-loop.js';

export const isMeasured = (m: FrequencyModel): m is MeasuredModel => 'withInterpolation' in m;

export function attachMeasuredAssessment(built: BuiltLoop, result: LoopAnalysis): void {
  if (!isMeasured(built.plant)) return;
  const cubicPlant = built.plant.withInterpolation('cubic');
  const cubicLoop = built.controller ? productModel(cubicPlant, built.controller) : cubicPlant;
  const a = assessMeasuredLoop(built.plant, built.loop, cubicLoop, result.margins, {
    sensitivity: result.peaks.sensitivity.value,
    complementary: result.peaks.complementarySensitivity.value,
    sensitivityFrequency: result.peaks.sensitivity.frequency,
  });
  const m = result.margins;
  const u = a.uncertainty;
  const e = a.interpolationError;
  if (m.gain) Object.assign(m.gain, { interpolationError: { db: e.gainMarginDb }, ...(u && u.gainMarginDb !== null ? { uncertainty: { db: u.gainMarginDb } } : {}) });
  if (m.phase) Object.assign(m.phase, { interpolationError: { degrees: e.phaseMarginDegrees }, ...(u && u.phaseMarginDegrees !== null ? { uncertainty: { degrees: u.phaseMarginDegrees } } : {}) });
  if (m.delay) Object.assign(m.delay, { interpolationError: { seconds: e.delayMarginSeconds }, ...(u && u.delayMarginSeconds !== null ? { uncertainty: { seconds: u.delayMarginSeconds } } : {}) });
  result.warnings.push(...a.warnings);
  (result as LoopAnalysis & { measurement?: unknown }).measurement = {
    band: a.band,
    interpolation: a.interpolation,
    interpolationError: e,
    uncertainty: u,
    averages: a.averages,
  };
}
