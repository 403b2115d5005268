/**
 * How far figures computed from measured frequency-response data can be
 * trusted: the interpolation error of each margin, an uncertainty band from
 * the coherence of an H1 estimate, and warnings about the data near the
 * frequencies that matter.
 *
 * Random error (J. S. Bendat, A. G. Piersol, Random Data, 4th ed., Wiley
 * 2010, chapter on frequency-response estimation — the constant is marked
 * "from memory" in REFERENCES.md): for nd averages, the normalised random
 * error of |H| is ε = √(1−γ²)/(|γ|·√(2·nd)) and the phase standard deviation
 * is about ε radians. First-order propagation to the margins:
 *   PM: σ² = σφ² + (dφ/d ln ω · ε / |d ln|L|/d ln ω|)²  (phase error, plus the
 *       crossover moving because the magnitude is uncertain);
 *   GM: σ(ln GM)² = ε² + (d ln|L|/d ln ω · σφ / |dφ/d ln ω|)²;
 *   DM = PM/ωc: relative variances of PM and ωc add.
 * Bands are reported as two standard deviations (about 95 % for a normal
 * error), so a gate can test the pessimistic value.
 */
import type { MeasuredModel } from '../model/plants/frequency-response.js';
import type { FrequencyModel } from '../model/frequency-model.js';
import { h1RandomError } from '../estimation/h1-random-error.js';
import { gainCrossings, phaseCrossings } from './crossings.js';
import { withLoopGrid, type LoopGrid } from './loop-grid.js';
import type { Margins } from './margins.js';
import { computeMargins } from './margins.js';
import { findPeak } from './peaks.js';
import type { Warning } from './warnings.js';

export const UNCERTAINTY_STANDARD_DEVIATIONS = 2;
const MIN_POINTS_PER_DECADE = 10;
const MIN_COHERENCE = 0.8;
/** Steps between measured neighbours above which a resonance or a delay is under-resolved. */
const MAX_PHASE_STEP_DEG = 20;
const MAX_DB_STEP = 3;
const INTERPOLATION = 'linear in log-frequency of dB-magnitude and unwrapped phase, between the bracketing measured points';
const BENDAT_PIERSOL = 'Bendat & Piersol, Random Data, 4th ed., frequency-response estimation (random error of H1; from memory)';

export interface MeasuredAssessment {
  band: { min: number; max: number; points: number };
  interpolation: string;
  /** |linear − cubic| estimate of the interpolation error of each figure. */
  interpolationError: {
    gainMarginDb: number | null;
    phaseMarginDegrees: number | null;
    delayMarginSeconds: number | null;
    sensitivityPeak: number;
    complementaryPeak: number;
  };
  /** Two-standard-deviation bands from the coherence, when coherence and averages are known. */
  uncertainty: {
    standardDeviations: number;
    gainMarginDb: number | null;
    phaseMarginDegrees: number | null;
    delayMarginSeconds: number | null;
  } | null;
  averages: number | null;
  warnings: Warning[];
}

/** log-log slopes of |L| and of the phase (rad) at ω, by a central difference on the loop. */
function slopes(loop: FrequencyModel, omega: number): { magnitude: number; phase: number } {
  const h = 1e-4;
  const a = loop.evaluate(omega * Math.exp(-h), { re: 0, im: 0 });
  const b = loop.evaluate(omega * Math.exp(h), { re: 0, im: 0 });
  const magnitude = (Math.log(Math.hypot(b.re, b.im)) - Math.log(Math.hypot(a.re, a.im))) / (2 * h);
  const phase = Math.atan2(a.re * b.im - a.im * b.re, a.re * b.re + a.im * b.im) / (2 * h);
  return { magnitude, phase };
}

function interpolateCoherence(plant: MeasuredModel, omega: number): number | null {
  const c = plant.data.coherence;
  if (!c) return null;
  const w = plant.data.omega;
  let i = 0;
  while (i + 2 < w.length && w[i + 1] < omega) i++;
  const t = Math.min(1, Math.max(0, (Math.log(omega) - Math.log(w[i])) / (Math.log(w[i + 1]) - Math.log(w[i]))));
  return c[i] + t * (c[i + 1] - c[i]);
}

/** Largest phase step (degrees) and dB step between the measured points around ω (the bracket and its neighbours). */
function resolutionNear(plant: MeasuredModel, omega: number): { phaseDeg: number; db: number } {
  const w = plant.data.omega;
  let i = 0;
  while (i + 2 < w.length && w[i + 1] < omega) i++;
  let phaseDeg = 0;
  let db = 0;
  for (let k = Math.max(0, i - 1); k <= Math.min(w.length - 2, i + 1); k++) {
    phaseDeg = Math.max(phaseDeg, Math.abs(plant.data.phaseDeg[k + 1] - plant.data.phaseDeg[k]));
    db = Math.max(db, Math.abs(20 * Math.log10(plant.data.magnitude[k + 1] / plant.data.magnitude[k])));
  }
  return { phaseDeg, db };
}

function pointsPerDecadeNear(w: Float64Array, omega: number): number {
  const lo = omega / Math.SQRT2 ** 1;
  const hi = omega * Math.SQRT2;
  let count = 0;
  for (const x of w) if (x >= lo && x <= hi) count++;
  return count / Math.log10(hi / lo);
}

function figuresOf(loop: FrequencyModel, grid: LoopGrid, min: number, max: number) {
  const margins = computeMargins(gainCrossings(loop, grid, min, max), phaseCrossings(loop, grid, min, max));
  return {
    margins,
    ms: findPeak(loop, grid, 'sensitivity').value,
    mt: findPeak(loop, grid, 'complementarySensitivity').value,
  };
}

export function assessMeasuredLoop(
  plant: MeasuredModel,
  loop: FrequencyModel,
  cubicLoop: FrequencyModel,
  margins: Margins,
  peaks: { sensitivity: number; complementary: number; sensitivityFrequency: number | null },
): MeasuredAssessment {
  const w = plant.data.omega;
  const min = w[0];
  const max = w[w.length - 1];
  const cubic = withLoopGrid(cubicLoop, min, max, (grid) => figuresOf(cubicLoop, grid, min, max));
  const diff = (a: number | undefined, b: number | undefined) => (a === undefined || b === undefined ? null : Math.abs(a - b));
  const interpolationError = {
    gainMarginDb: diff(margins.gain?.db, cubic.margins.gain?.db),
    phaseMarginDegrees: diff(margins.phase?.degrees, cubic.margins.phase?.degrees),
    delayMarginSeconds: diff(margins.delay?.seconds, cubic.margins.delay?.seconds),
    sensitivityPeak: Math.abs(peaks.sensitivity - cubic.ms),
    complementaryPeak: Math.abs(peaks.complementary - cubic.mt),
  };

  const warnings: Warning[] = [];
  const k = UNCERTAINTY_STANDARD_DEVIATIONS;
  let uncertainty: MeasuredAssessment['uncertainty'] = null;
  const nd = plant.averages;
  if (plant.data.coherence && nd) {
    const band = (omega: number) => h1RandomError(Math.max(1e-12, interpolateCoherence(plant, omega) ?? 1), nd);
    let pm: number | null = null;
    let dm: number | null = null;
    let gm: number | null = null;
    if (margins.phase) {
      const e = band(margins.phase.frequency);
      const s = slopes(loop, margins.phase.frequency);
      const sigmaLnWc = e.magnitudeRelative / Math.max(Math.abs(s.magnitude), 1e-12);
      const sigmaPm = Math.hypot(e.phaseStdRad, s.phase * sigmaLnWc);
      pm = (k * sigmaPm * 180) / Math.PI;
      if (margins.delay) {
        const pmRad = (margins.phase.degrees * Math.PI) / 180;
        const rel = Math.hypot(sigmaPm / Math.max(Math.abs(pmRad), 1e-12), sigmaLnWc);
        dm = k * rel * margins.delay.seconds;
      }
    }
    if (margins.gain && margins.gain.frequency > 0) {
      const e = band(margins.gain.frequency);
      const s = slopes(loop, margins.gain.frequency);
      const sigmaLn = Math.hypot(e.magnitudeRelative, (s.magnitude * e.phaseStdRad) / Math.max(Math.abs(s.phase), 1e-12));
      gm = k * sigmaLn * (20 / Math.LN10);
    }
    uncertainty = { standardDeviations: k, gainMarginDb: gm, phaseMarginDegrees: pm, delayMarginSeconds: dm };
  } else if (plant.data.coherence && !nd) {
    warnings.push({
      code: 'uncertainty_needs_averages',
      message: 'Coherence is given without `averages` (the number of averaged segments); the random-error band needs both.',
      value: null,
      limit: null,
      source: BENDAT_PIERSOL,
    });
  }

  const critical: { name: string; omega: number }[] = [];
  for (const g of margins.gainCrossovers) critical.push({ name: 'gain crossover', omega: g.frequency });
  if (margins.gain && margins.gain.frequency > 0) critical.push({ name: 'phase crossover', omega: margins.gain.frequency });
  if (peaks.sensitivityFrequency !== null && peaks.sensitivityFrequency > 0) critical.push({ name: 'sensitivity peak', omega: peaks.sensitivityFrequency });
  for (const c of critical) {
    const nearEdge = c.omega <= w[Math.min(1, w.length - 1)] || c.omega >= w[Math.max(0, w.length - 2)];
    if (nearEdge) {
      warnings.push({
        code: 'near_band_edge',
        message: `The ${c.name} at ${c.omega.toPrecision(4)} rad/s lies at the edge of the measured band (${min.toPrecision(3)}–${max.toPrecision(3)} rad/s); measure beyond it.`,
        value: c.omega,
        limit: null,
        source: 'common practice',
      });
    }
    const density = pointsPerDecadeNear(w, c.omega);
    const step = resolutionNear(plant, c.omega);
    if (step.phaseDeg > MAX_PHASE_STEP_DEG || step.db > MAX_DB_STEP) {
      warnings.push({
        code: 'sparse_data_near_crossover',
        message: `Around the ${c.name} at ${c.omega.toPrecision(4)} rad/s the data changes by up to ${step.phaseDeg.toFixed(1)}° and ${step.db.toFixed(1)} dB between neighbouring points: too coarse to interpolate reliably, and the reported interpolation error may understate it. Measure more densely there.`,
        value: step.phaseDeg,
        limit: MAX_PHASE_STEP_DEG,
        source: 'common practice',
      });
    } else if (density < MIN_POINTS_PER_DECADE) {
      warnings.push({
        code: 'sparse_data_near_crossover',
        message: `Only about ${density.toFixed(1)} points per decade around the ${c.name} at ${c.omega.toPrecision(4)} rad/s; interpolation may be coarse.`,
        value: density,
        limit: MIN_POINTS_PER_DECADE,
        source: 'common practice',
      });
    }
    const gamma2 = interpolateCoherence(plant, c.omega);
    if (gamma2 !== null && gamma2 < MIN_COHERENCE) {
      warnings.push({
        code: 'low_coherence_near_crossover',
        message: `Coherence γ² = ${gamma2.toFixed(3)} near the ${c.name} at ${c.omega.toPrecision(4)} rad/s: the data there is noisy or the plant is not linear.`,
        value: gamma2,
        limit: MIN_COHERENCE,
        source: BENDAT_PIERSOL,
      });
    }
  }
  if (margins.gainCrossovers.length === 0) {
    const v = loop.evaluate(max, { re: 0, im: 0 });
    if (Math.hypot(v.re, v.im) > 1) {
      warnings.push({
        code: 'crossover_outside_band',
        message: '|L| is still above 1 at the top of the measured band: the gain crossover lies outside the data.',
        value: max,
        limit: null,
        source: 'common practice',
      });
    }
  }
  if (plant.data.largestPhaseStepDeg > 90) {
    warnings.push({
      code: 'phase_jump',
      message: `The measured phase jumps by ${plant.data.largestPhaseStepDeg.toFixed(0)}° between neighbouring points; the unwrapping there is a guess. Measure more densely or check for wrapping errors.`,
      value: plant.data.largestPhaseStepDeg,
      limit: 90,
      source: 'common practice',
    });
  }
  const top = loop.evaluate(max, { re: 0, im: 0 });
  warnings.push({
    code: 'measured_nyquist_assumption',
    message: `The stability verdict assumes |L| stays below 1 beyond the measured band and the open-loop pole count given (|L| = ${Math.hypot(top.re, top.im).toPrecision(3)} at the top of the band).`,
    value: Math.hypot(top.re, top.im),
    limit: 1,
    source: 'Nyquist criterion on a finite sweep (common practice)',
  });
  return {
    band: { min, max, points: w.length },
    interpolation: INTERPOLATION,
    interpolationError,
    uncertainty,
    averages: nd,
    warnings,
  };
}
