/**
 * The whole frequency-domain review of one loop: band and grid, crossings,
 * margins, peaks, bandwidths, stability (Nyquist, cross-checked by
 * closed-loop roots where the loop is rational without delay) and warnings.
 * A pure function of the loop model and the options.
 */
import type { Complex } from '../numeric/complex.js';
import { writeLogGrid } from '../numeric/write-log-grid.js';
import type { FrequencyModel } from '../model/frequency-model.js';
import { requireAnalysableLoop } from '../model/loop.js';
import { ModelError } from '../model/model-error.js';
import { computeBandwidth, type Bandwidth } from './bandwidth.js';
import { closedLoopPoles } from './closed-loop-poles.js';
import type { Criteria } from './criteria.js';
import { gainCrossings, phaseCrossings } from './crossings.js';
import { chooseBand, type AnalysisBand } from './frequency-band.js';
import { withLoopGrid } from './loop-grid.js';
import { computeMargins, type Margins } from './margins.js';
import { nyquistStability } from './nyquist.js';
import { findPeak, type Peak } from './peaks.js';
import { computeResponse, type FrequencyResponse } from './response.js';
import { collectWarnings, type Warning } from './warnings.js';

export interface ResponseGridRequest {
  min: number;
  max: number;
  points: number;
}

export interface AnalysisOptions {
  criteria: Criteria;
  /** Response grid; chosen from the loop when absent. */
  responseGrid?: ResponseGridRequest;
  /** Compute the response arrays (detail "full"). */
  includeResponse: boolean;
  /** Facts about the controller that matter for warnings. */
  unfilteredDerivative?: boolean;
}

export interface Stability {
  closedLoopStable: boolean;
  openLoopUnstablePoles: number;
  openLoopUnstablePolesAssumed: boolean;
  integrators: number;
  imaginaryAxisPoles: { frequency: number; order: number }[];
  method: 'nyquist-and-roots' | 'nyquist';
  nyquist: { clockwiseEncirclements: number; closedLoopUnstablePoles: number; sweepTo: number; closestApproachToCritical: number };
  closedLoopPoles?: Complex[];
}

export interface LoopAnalysis {
  stability: Stability;
  margins: Margins;
  peaks: { sensitivity: Peak; complementarySensitivity: Peak };
  bandwidth: Bandwidth;
  warnings: Warning[];
  grid: { min: number; max: number; points: number };
  response?: FrequencyResponse;
}

/** Default response grid: whole decades around everything of interest, 50 points per decade. */
function defaultResponseGrid(band: AnalysisBand, loop: FrequencyModel, margins: Margins): ResponseGridRequest {
  const interesting = [
    ...loop.characteristicFrequencies,
    ...margins.gainCrossovers.map((g) => g.frequency),
    ...margins.phaseCrossovers.slice(0, 3).map((p) => p.frequency),
  ].filter((w) => w > 0 && Number.isFinite(w));
  const lo = interesting.length ? Math.min(...interesting) : 1;
  const hi = interesting.length ? Math.max(...interesting) : 1;
  let min = Math.pow(10, Math.floor(Math.log10(lo)) - 1);
  let max = Math.pow(10, Math.ceil(Math.log10(hi)) + 1);
  if (max / min > 1e8) min = max / 1e8;
  min = Math.max(min, band.min);
  max = Math.max(Math.min(max, band.max), min * 10);
  const points = Math.min(2000, Math.max(200, Math.round(50 * Math.log10(max / min)) + 1));
  return { min, max, points };
}

/** Points the grid may spend on resolving a delay's phase (ωT turning by at most 60° per step). */
const DELAY_POINT_BUDGET = 30_000;

/**
 * A long delay over a wide band needs ωT/(π/3) points to keep the phase from
 * aliasing. When that exceeds the budget the band's top is lowered (phase
 * crossovers with gain margins far above 60 dB are then not all listed), but
 * never below the end of the Nyquist sweep: a loop that cannot be swept within
 * the budget is refused rather than analysed on an aliased grid.
 */
function fitDelayIntoBudget(loop: FrequencyModel, band: AnalysisBand): number | null {
  if (!(loop.phaseRate > 0)) return null;
  const needed = (loop.phaseRate * (band.max - band.min)) / (Math.PI / 3);
  if (needed <= DELAY_POINT_BUDGET) return null;
  const affordable = band.min + (DELAY_POINT_BUDGET * Math.PI) / 3 / loop.phaseRate;
  if (affordable < band.sweepTo) {
    throw new ModelError(
      'analysis_too_costly',
      `Resolving the phase of the ${loop.phaseRate} s delay up to ${band.sweepTo.toPrecision(3)} rad/s, where |L| is proven to stay below 1/2, would take more than ${DELAY_POINT_BUDGET} frequency points.`,
      ['plant', 'delay'],
    );
  }
  const cut = band.max;
  band.max = affordable;
  return cut;
}

/** A loop that evaluates to NaN or ±∞ somewhere on the grid cannot be analysed. */
function requireFiniteLoop(grid: { omega: Float64Array; re: Float64Array; im: Float64Array }): void {
  for (let i = 0; i < grid.omega.length; i++) {
    if (!Number.isFinite(grid.re[i]) || !Number.isFinite(grid.im[i])) {
      throw new ModelError(
        'loop_not_finite',
        `The loop transfer function is not finite at ${grid.omega[i].toPrecision(6)} rad/s (overflow, division by zero or a pole on the imaginary axis that the model does not declare).`,
        ['plant'],
      );
    }
  }
}

function clipToBand(r: ResponseGridRequest | undefined, band: { min: number; max: number }): ResponseGridRequest | undefined {
  if (!r) return undefined;
  const min = Math.max(r.min, band.min);
  const max = Math.min(r.max, band.max);
  return max > min ? { min, max, points: r.points } : undefined;
}

export function analyzeLoop(loop: FrequencyModel, options: AnalysisOptions): LoopAnalysis {
  requireAnalysableLoop(loop);
  const band = chooseBand(loop);
  // Measured data is not extrapolated: a requested grid is clipped to the measured band.
  const requested = loop.sampledBand ? clipToBand(options.responseGrid, loop.sampledBand) : options.responseGrid;
  const phaseCrossoversCut = fitDelayIntoBudget(loop, band);
  const gridMin = requested ? Math.min(band.min, requested.min) : band.min;
  const gridMax = requested ? Math.max(band.max, requested.max) : band.max;
  // The grid's columns are a reused buffer (loop-grid.ts): everything kept from them is copied out here.
  return withLoopGrid(loop, gridMin, gridMax, (grid) => {
    requireFiniteLoop(grid);

    const margins = computeMargins(gainCrossings(loop, grid, band.min, band.max), phaseCrossings(loop, grid, band.min, band.max));
    const sensitivity = findPeak(loop, grid, 'sensitivity');
    const complementarySensitivity = findPeak(loop, grid, 'complementarySensitivity');
    const bandwidth = computeBandwidth(loop, grid, margins.gainCrossovers[0]?.frequency ?? null);

    const nyquist = nyquistStability(loop, grid, band.sweepTo);
    const roots = closedLoopPoles(loop);
    const nyquistUnstable = nyquist.closedLoopUnstablePoles;
    const closedLoopStable = nyquistUnstable === 0 && !nyquist.marginal && (!roots || roots.unstable === 0);
    const stability: Stability = {
      closedLoopStable,
      openLoopUnstablePoles: loop.unstablePoles,
      openLoopUnstablePolesAssumed: loop.unstablePolesAssumed,
      integrators: loop.integrators,
      imaginaryAxisPoles: loop.imaginaryAxisPoles,
      method: roots ? 'nyquist-and-roots' : 'nyquist',
      nyquist: {
        clockwiseEncirclements: nyquist.clockwiseEncirclements,
        closedLoopUnstablePoles: nyquistUnstable,
        sweepTo: nyquist.sweepTo,
        closestApproachToCritical: nyquist.closestApproach,
      },
      ...(roots ? { closedLoopPoles: roots.poles } : {}),
    };

    const warnings = collectWarnings({
      criteria: options.criteria,
      closedLoopStable,
      closedLoopUnstablePoles: Math.max(nyquistUnstable, roots?.unstable ?? 0),
      margins,
      sensitivityPeak: sensitivity,
      complementaryPeak: complementarySensitivity,
      unfilteredDerivative: options.unfilteredDerivative ?? false,
      unstablePolesAssumed: loop.unstablePolesAssumed,
      assumedPoleCount: loop.unstablePoles,
      rootsDisagree: roots && roots.unstable !== nyquistUnstable ? { nyquist: nyquistUnstable, roots: roots.unstable } : null,
      marginal: nyquist.marginal,
      // Measured data says what its sweep assumes in its own warning (measured-quality.ts).
      sweepBounded: band.sweepBounded || Boolean(loop.sampledBand),
      sweepTo: nyquist.sweepTo,
      gridTruncated: grid.truncated,
    });
    if (phaseCrossoversCut !== null) {
      warnings.push({
        code: 'phase_crossovers_cut',
        message: `The delay turns the phase so fast that phase crossovers are listed only up to ${band.max.toPrecision(4)} rad/s (not ${phaseCrossoversCut.toPrecision(4)}); those beyond have gain margins far above the criteria.`,
        value: band.max,
        limit: phaseCrossoversCut,
        source: 'common practice',
      });
    }

    const result: LoopAnalysis = {
      stability,
      margins,
      peaks: { sensitivity, complementarySensitivity },
      bandwidth,
      warnings,
      grid: { min: gridMin, max: gridMax, points: grid.omega.length },
    };
    if (options.includeResponse) {
      const r = requested ?? (loop.sampledBand ? null : defaultResponseGrid(band, loop, margins));
      // Measured data without a requested grid: the response is given at the measured frequencies.
      // A plain array written in place: it becomes the answer's `frequency` as it is.
      const frequencies = r ? writtenLogGrid(r.min, r.max, r.points) : loop.sampledBand!.frequencies;
      result.response = computeResponse(loop, grid, frequencies);
    }
    return result;
  });
}

/** logGrid into a plain array (the answer's own), without a typed array to copy from. */
function writtenLogGrid(min: number, max: number, points: number): number[] {
  const out = new Array<number>(points);
  writeLogGrid(out, 0, min, max, points);
  return out;
}
