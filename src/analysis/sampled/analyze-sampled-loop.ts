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
 *
 * A loop without z-polynomials (C(e^{jωTs})·H(jω)·P(jω) for a plant with no
 * rational model, see hold-response.ts) is reviewed the same way on what it
 * covers, up to π/Ts or the end of measured data: no roots, no exact phase
 * crossover at π/Ts (it is not real there once aliasing is neglected), and
 * the unit-circle sweep is closed by the shortest turn from its last value to
 * the real axis, which is reliable only when |L| is small there (a warning
 * says when it is not).
 */
import type { Complex } from '../../numeric/complex.js';
import { logGrid } from '../../numeric/log-grid.js';
import type { DiscreteModel, DiscreteTransferFunction } from '../../model/discrete/discrete-model.js';
import type { FrequencyModel } from '../../model/frequency-model.js';
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
  /** Needed when the loop has no z-polynomials (a loop with a hold response). */
  samplePeriod?: number;
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
  /** False for a loop with a hold response, whose aliasing is neglected. */
  exact: boolean;
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
function sampledPhaseCrossings(loop: FrequencyModel, grid: LoopGrid, min: number, nyquist: number, exact: boolean): Crossing[] {
  if (!exact) return phaseCrossings(loop, grid, min, nyquist);
  const onGrid = phaseCrossings(loop, grid, min, nyquist).filter((c) => c.frequency < nyquist * (1 - 1e-6));
  if (polesAtNyquistFrequency(loop, nyquist) > 0) return onGrid;
  const v = loop.evaluate(nyquist, { re: 0, im: 0 });
  if (v.re < 0 && -v.re >= NEGLIGIBLE_LOOP_GAIN) onGrid.push({ frequency: nyquist, re: v.re, im: 0 });
  return onGrid;
}

/** A supremum "at infinity" on the unit circle is the value at π/Ts, a true maximum there. */
function sampledPeak(loop: FrequencyModel, grid: LoopGrid, which: ClosedLoopFunction): Peak {
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

/** |L| at the end of the sweep above which closing it by the shortest turn is not to be trusted. */
const CLOSURE_LOOP_GAIN = 0.5;

/** Where the stability verdict of a loop with a hold response rests on more than the data. */
function approximationWarnings(grid: LoopGrid, end: number, nyquistFrequency: number): Warning[] {
  const last = grid.omega.length - 1;
  const gain = grid.magnitude[last];
  const short = end < nyquistFrequency * (1 - 1e-9);
  if (gain < CLOSURE_LOOP_GAIN && !short) return [];
  return [
    {
      code: 'unit_circle_sweep_approximate',
      message: `The unit-circle sweep of the sampled loop ${short ? `ends with the data at ${end.toPrecision(4)} rad/s, below the Nyquist frequency ${nyquistFrequency.toPrecision(4)} rad/s,` : 'ends at the Nyquist frequency'} with |L| = ${gain.toPrecision(3)}; it is closed by the shortest turn to the real axis, and aliasing is neglected, so the stability verdict is an approximation.`,
      value: gain,
      limit: CLOSURE_LOOP_GAIN,
      source: 'common practice',
    },
  ];
}

function defaultResponseFrequencies(min: number, nyquist: number): Float64Array {
  const lo = Math.max(min, nyquist * 1e-5);
  const points = Math.min(2000, Math.max(200, Math.round(50 * Math.log10(nyquist / lo)) + 1));
  return logGrid(lo, nyquist, points);
}

export function analyzeSampledLoop(loop: FrequencyModel & { discrete?: DiscreteTransferFunction }, options: SampledLoopOptions): SampledLoopAnalysis {
  const exact = loop.discrete !== undefined;
  if (exact) requireCausalSampledLoop(loop as DiscreteModel);
  const ts = loop.discrete?.samplePeriod ?? options.samplePeriod!;
  const nyquistFrequency = Math.PI / ts;
  const band = loop.sampledBand
    ? { min: loop.sampledBand.min, max: Math.min(loop.sampledBand.max, nyquistFrequency) }
    : chooseSampledBand(loop, ts);
  const nyquist = band.max; // the end of the sweep: π/Ts, or the end of measured data below it
  const requested = options.responseGrid;
  const min = requested && requested.min < nyquist && !loop.sampledBand ? Math.min(band.min, requested.min) : band.min;
  const grid = buildLoopGrid(loop, min, nyquist);

  const margins = computeMargins(gainCrossings(loop, grid, min, nyquist), sampledPhaseCrossings(loop, grid, min, nyquist, exact));
  const sensitivity = sampledPeak(loop, grid, 'sensitivity');
  const complementarySensitivity = sampledPeak(loop, grid, 'complementarySensitivity');
  const bandwidth = computeBandwidth(loop, grid, margins.gainCrossovers[0]?.frequency ?? null);

  const nyq = unitCircleNyquist(loop, grid, nyquistFrequency, !exact);
  const roots = loop.discrete ? zClosedLoopPoles(loop.discrete) : null;
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
    unstablePolesAssumed: loop.unstablePolesAssumed,
    assumedPoleCount: loop.unstablePoles,
    rootsDisagree: roots && roots.unstable !== nyq.closedLoopUnstablePoles ? { nyquist: nyq.closedLoopUnstablePoles, roots: roots.unstable } : null,
    marginal: nyq.marginal,
    sweepBounded: true,
    sweepTo: nyquist,
    gridTruncated: grid.truncated,
  }).map((w) => reworded(w, unstable, nyq.marginal));

  if (!exact) warnings.push(...approximationWarnings(grid, nyquist, nyquistFrequency));

  const result: SampledLoopAnalysis = {
    samplePeriod: ts,
    nyquistFrequency,
    exact,
    stability,
    margins,
    peaks: { sensitivity, complementarySensitivity },
    bandwidth,
    warnings,
    grid: { min, max: nyquist, points: grid.omega.length },
  };
  if (options.includeResponse) {
    const end = polesAtNyquistFrequency(loop, nyquistFrequency) > 0 ? nyquist * (1 - 1e-6) : nyquist;
    const frequencies =
      requested && requested.min < end
        ? logGrid(Math.max(requested.min, min), Math.min(requested.max, end), requested.points)
        : loop.sampledBand
          ? loop.sampledBand.frequencies.filter((w) => w <= end)
          : defaultResponseFrequencies(min, end);
    result.response = computeResponse(loop, grid, frequencies);
  }
  return result;
}
