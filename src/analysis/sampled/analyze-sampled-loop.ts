/**
 * The frequency-domain review of a sampled loop L(z) = C(z)·P(z) on the unit
 * circle, z = e^{jωTs} for 0 < ω ≤ π/Ts: crossings, margins, peaks and
 * bandwidths with the same functions as for continuous loops (on a grid
 * that ends at the Nyquist frequency), stability by the Nyquist criterion on
 * the unit circle cross-checked by the closed-loop poles in z, and the
 * loop-quality warnings against the same criteria.
 *
 * What differs from the continuous review: the response is periodic, so the
 * sweep is complete at π/Ts; there L is real, so a phase crossover sits
 * exactly at the Nyquist frequency whenever L(−1) < 0 (the usual one for a
 * P-controlled first-order plant, which is why sampled loops have a finite
 * gain margin where the continuous one has none); and peaks at π/Ts are
 * true maxima, not limits at infinity.
 */
import type { Complex } from '../../numeric/complex.js';
import { logGrid } from '../../numeric/log-grid.js';
import type { DiscreteModel } from '../../model/discrete/discrete-model.js';
import { ModelError } from '../../model/model-error.js';
import type { ResponseGridRequest } from '../analyze-loop.js';
import { computeBandwidth, type Bandwidth } from '../bandwidth.js';
import type { Criteria } from '../criteria.js';
import { gainCrossings, phaseCrossings, type Crossing } from '../crossings.js';
import { NEGLIGIBLE_LOOP_GAIN } from '../frequency-band.js';
import { buildLoopGrid, type LoopGrid } from '../loop-grid.js';
import { computeMargins, type Margins } from '../margins.js';
import { findPeak, type ClosedLoopFunction, type Peak } from '../peaks.js';
import { computeResponse, type FrequencyResponse } from '../response.js';
import { collectWarnings, WARNING_CODES, type Warning } from '../warnings.js';
import { chooseSampledBand } from './sampled-band.js';
import { polesAtNyquistFrequency, unitCircleNyquist } from './unit-circle-nyquist.js';
import { zClosedLoopPoles } from './z-closed-loop-poles.js';

export interface SampledLoopOptions {
  criteria: Criteria;
  includeResponse: boolean;
  responseGrid?: ResponseGridRequest;
  unfilteredDerivative?: boolean;
}

export interface SampledStability {
  closedLoopStable: boolean;
  /** Open-loop poles outside the unit circle. */
  openLoopUnstablePoles: number;
  /** Open-loop poles at z = 1. */
  integrators: number;
  /** Other open-loop poles on the unit circle, at frequency arg(z)/Ts. */
  unitCirclePoles: { frequency: number; order: number }[];
  method: 'unit-circle-nyquist-and-roots' | 'unit-circle-nyquist';
  nyquist: { clockwiseEncirclements: number; closedLoopUnstablePoles: number; closestApproachToCritical: number };
  /** Roots of the characteristic polynomial in z, largest modulus first. */
  closedLoopPoles?: Complex[];
  largestClosedLoopPoleMagnitude?: number;
}

export interface SampledLoopAnalysis {
  samplePeriod: number;
  nyquistFrequency: number;
  stability: SampledStability;
  margins: Margins;
  peaks: { sensitivity: Peak; complementarySensitivity: Peak };
  bandwidth: Bandwidth;
  /** Loop-quality warnings (codes as for continuous loops). */
  warnings: Warning[];
  grid: { min: number; max: number; points: number };
  response?: FrequencyResponse;
}

/** Refuses sampled loops that cannot be run: non-causal ones and those whose closed loop has an algebraic loop. */
export function requireCausalSampledLoop(loop: DiscreteModel): void {
  if (loop.relativeDegree !== null && loop.relativeDegree < 0) {
    throw new ModelError('discrete_loop_non_causal', 'The sampled loop C(z)·P(z) has more zeros than poles: it would need future samples.', ['controller']);
  }
  if (loop.relativeDegree === 0 && Math.abs(1 + loop.highFrequencyGain) < 1e-12) {
    throw new ModelError(
      'discrete_loop_algebraic',
      'The direct feedthrough of the sampled loop is −1: the closed loop 1/(1 + L) cannot be computed sample by sample (an algebraic loop).',
      ['controller'],
    );
  }
}

/** Phase crossings on the grid, with the one exactly at π/Ts (where L is real) put in by hand. */
function sampledPhaseCrossings(loop: DiscreteModel, grid: LoopGrid, min: number, nyquist: number): Crossing[] {
  const onGrid = phaseCrossings(loop, grid, min, nyquist).filter((c) => c.frequency < nyquist * (1 - 1e-6));
  if (polesAtNyquistFrequency(loop, nyquist) > 0) return onGrid;
  const v = loop.evaluate(nyquist, { re: 0, im: 0 });
  if (v.re < 0 && -v.re >= NEGLIGIBLE_LOOP_GAIN) onGrid.push({ frequency: nyquist, re: v.re, im: 0 });
  return onGrid;
}

/** A supremum "at infinity" on the unit circle is the value at π/Ts, a true maximum there. */
function sampledPeak(loop: DiscreteModel, grid: LoopGrid, which: ClosedLoopFunction): Peak {
  const p = findPeak(loop, grid, which);
  if (p.frequency !== null) return p;
  const last = grid.omega.length - 1;
  const re = grid.re[last];
  const im = grid.im[last];
  const d = Math.hypot(1 + re, im);
  const value = which === 'sensitivity' ? 1 / d : Math.hypot(re, im) / d;
  return { value, db: 20 * Math.log10(value), frequency: grid.omega[last] };
}

/** The unit-circle wording of the loop-quality warnings. */
function reworded(w: Warning, unstable: number, marginal: boolean): Warning {
  if (w.code !== WARNING_CODES.closedLoopUnstable) return w;
  return {
    ...w,
    message: marginal
      ? 'The sampled closed loop is not asymptotically stable: L(e^{jωTs}) passes through −1 (a closed-loop pole on the unit circle).'
      : `The sampled closed loop is unstable: ${unstable} closed-loop pole(s) outside the unit circle (Nyquist on the unit circle, Z = N + P).`,
    source: 'Åström & Wittenmark, Computer-Controlled Systems, 3rd ed., §3.3 (Nyquist criterion for sampled systems)',
  };
}

function defaultResponseFrequencies(min: number, nyquist: number): Float64Array {
  const lo = Math.max(min, nyquist * 1e-5);
  const points = Math.min(2000, Math.max(200, Math.round(50 * Math.log10(nyquist / lo)) + 1));
  return logGrid(lo, nyquist, points);
}

export function analyzeSampledLoop(loop: DiscreteModel, options: SampledLoopOptions): SampledLoopAnalysis {
  requireCausalSampledLoop(loop);
  const ts = loop.discrete.samplePeriod;
  const band = chooseSampledBand(loop, ts);
  const nyquist = band.max;
  const requested = options.responseGrid;
  const min = requested && requested.min < nyquist ? Math.min(band.min, requested.min) : band.min;
  const grid = buildLoopGrid(loop, min, nyquist);

  const margins = computeMargins(gainCrossings(loop, grid, min, nyquist), sampledPhaseCrossings(loop, grid, min, nyquist));
  const sensitivity = sampledPeak(loop, grid, 'sensitivity');
  const complementarySensitivity = sampledPeak(loop, grid, 'complementarySensitivity');
  const bandwidth = computeBandwidth(loop, grid, margins.gainCrossovers[0]?.frequency ?? null);

  const nyq = unitCircleNyquist(loop, grid, nyquist);
  const roots = zClosedLoopPoles(loop.discrete);
  const closedLoopStable = nyq.closedLoopUnstablePoles === 0 && !nyq.marginal && (!roots || roots.unstable === 0);
  const stability: SampledStability = {
    closedLoopStable,
    openLoopUnstablePoles: loop.unstablePoles,
    integrators: loop.integrators,
    unitCirclePoles: loop.imaginaryAxisPoles,
    method: roots ? 'unit-circle-nyquist-and-roots' : 'unit-circle-nyquist',
    nyquist: {
      clockwiseEncirclements: nyq.clockwiseEncirclements,
      closedLoopUnstablePoles: nyq.closedLoopUnstablePoles,
      closestApproachToCritical: nyq.closestApproach,
    },
    ...(roots ? { closedLoopPoles: roots.poles, largestClosedLoopPoleMagnitude: roots.largestMagnitude } : {}),
  };
  const unstable = Math.max(nyq.closedLoopUnstablePoles, roots?.unstable ?? 0);
  const warnings = collectWarnings({
    criteria: options.criteria,
    closedLoopStable,
    closedLoopUnstablePoles: unstable,
    margins,
    sensitivityPeak: sensitivity,
    complementaryPeak: complementarySensitivity,
    unfilteredDerivative: options.unfilteredDerivative ?? false,
    unstablePolesAssumed: false,
    assumedPoleCount: 0,
    rootsDisagree: roots && roots.unstable !== nyq.closedLoopUnstablePoles ? { nyquist: nyq.closedLoopUnstablePoles, roots: roots.unstable } : null,
    marginal: nyq.marginal,
    sweepBounded: true,
    sweepTo: nyquist,
    gridTruncated: grid.truncated,
  }).map((w) => reworded(w, unstable, nyq.marginal));

  const result: SampledLoopAnalysis = {
    samplePeriod: ts,
    nyquistFrequency: nyquist,
    stability,
    margins,
    peaks: { sensitivity, complementarySensitivity },
    bandwidth,
    warnings,
    grid: { min, max: nyquist, points: grid.omega.length },
  };
  if (options.includeResponse) {
    const frequencies =
      requested && requested.min < nyquist
        ? logGrid(requested.min, Math.min(requested.max, nyquist), requested.points)
        : defaultResponseFrequencies(min, nyquist);
    result.response = computeResponse(loop, grid, frequencies);
  }
  return result;
}
