/**
 * The `sampled` block of an analysis answer and the warnings that go with
 * it: the sampled loop's own review (src/analysis/sampled/), the cost of
 * sampling against the continuous design, the discretised controller with
 * its gain at the Nyquist frequency, the sample rate against the bandwidth,
 * and, given measurementNoise, the actuator noise from A/D quantisation.
 *
 * With a continuous plant the top-level figures stay those of the continuous
 * design and the sampled loop's warnings are added with codes prefixed
 * `sampled_`; with a plant given in z there is no continuous design, and the
 * top-level figures are the sampled loop's own.
 */
import type { LoopAnalysis } from '../analysis/analyze-loop.js';
import { resolveCriteria } from '../analysis/criteria.js';
import { analyzeSampledLoop, type SampledLoopAnalysis } from '../analysis/sampled/analyze-sampled-loop.js';
import { noiseGain } from '../analysis/sampled/noise-gain.js';
import { samplingCost, type SamplingCost } from '../analysis/sampled/sampling-cost.js';
import { collectSamplingWarnings } from '../analysis/sampled/sampling-warnings.js';
import { WARNING_CODES, type Warning } from '../analysis/warnings.js';
import type { FrequencyModel } from '../model/frequency-model.js';
import type { Complex } from '../numeric/complex.js';
import { asContractError, type BuiltLoop } from './build-loop.js';
import { buildSampledLoop, type SampledLoop } from './build-sampled-loop.js';
import { isSampledRequest } from './sampled-request.js';
import type { AnalysisRequest } from './schemas/analysis-request.js';

const SAMPLED_PREFIX = 'sampled_';

export interface SampledBlock {
  samplePeriod: number;
  nyquistFrequency: number;
  samplingFrequency: number;
  implementation: { method: SampledLoop['method']; prewarpFrequency: number | null; computationDelay: number };
  plant: SampledLoop['plantKind'];
  stability: SampledLoopAnalysis['stability'];
  margins: SampledLoopAnalysis['margins'];
  peaks: SampledLoopAnalysis['peaks'];
  bandwidth: SampledLoopAnalysis['bandwidth'];
  grid: SampledLoopAnalysis['grid'];
  continuousDesign: SamplingCost | null;
  controller: {
    numerator: number[];
    denominator: number[];
    poles: Complex[];
    zeros: Complex[];
    unstablePoles: number;
    gainAtNyquistFrequency: { ratio: number | null; db: number | null; relativeToProportional: number | null };
  } | null;
  plantModel: { numerator: number[]; denominator: number[]; delaySamples: number } | null;
  sampleRate: { samplesPerBandwidth: number | null; bandwidth: number | null; bandwidthOf: string | null };
  noise: { quantisationStep: number; measurementNoiseRms: number; noiseGain: number | null; actuatorNoiseRms: number | null; converged: boolean } | null;
  notes: string[];
  response?: SampledLoopAnalysis['response'];
}

interface ContinuousDesign {
  loop: FrequencyModel;
  result: LoopAnalysis;
}

/** |C(e^{jπ})|, Infinity when the controller has a pole at z = −1. */
function nyquistGain(s: SampledLoop): number | null {
  if (!s.controller) return null;
  const poleAtMinusOne = s.controller.discrete.poles.some((p) => Math.hypot(p.re + 1, p.im) <= 1e-12);
  if (poleAtMinusOne) return Infinity;
  const v = s.controller.evaluate(Math.PI / s.samplePeriod, { re: 0, im: 0 });
  return Math.hypot(v.re, v.im);
}

function controllerFigures(s: SampledLoop, gain: number | null): SampledBlock['controller'] {
  if (!s.controller || !s.pid || gain === null) return null;
  const kp = Math.abs(s.pid.parallelGains.kp);
  const finite = Number.isFinite(gain);
  return {
    numerator: s.controller.discrete.numerator,
    denominator: s.controller.discrete.denominator,
    poles: s.controller.discrete.poles,
    zeros: s.controller.discrete.zeros,
    unstablePoles: s.controller.unstablePoles,
    gainAtNyquistFrequency: {
      ratio: finite ? gain : null,
      db: finite ? 20 * Math.log10(gain) : null,
      relativeToProportional: finite && kp > 0 ? gain / kp : null,
    },
  };
}

/** The bandwidth the sample rate is judged against: the continuous design's closed-loop bandwidth, else the sampled loop's, else a crossover. */
function judgedBandwidth(continuous: ContinuousDesign | null, sampled: SampledLoopAnalysis): { frequency: number; what: string } | null {
  const options: [number | null | undefined, string][] = [
    [continuous?.result.bandwidth.closedLoop, 'closed-loop bandwidth of the continuous design'],
    [sampled.bandwidth.closedLoop, 'closed-loop bandwidth of the sampled loop'],
    [continuous?.result.bandwidth.crossover, 'crossover frequency of the continuous design'],
    [sampled.bandwidth.crossover, 'crossover frequency of the sampled loop'],
  ];
  for (const [frequency, what] of options) if (frequency !== null && frequency !== undefined && frequency > 0) return { frequency, what };
  return null;
}

function noiseFigures(request: AnalysisRequest, s: SampledLoop, a: SampledLoopAnalysis): SampledBlock['noise'] {
  const q = request.measurementNoise?.quantisationStep;
  if (q === undefined || !s.controller) return null;
  const rms = q / Math.sqrt(12);
  if (!a.stability.closedLoopStable) return { quantisationStep: q, measurementNoiseRms: rms, noiseGain: null, actuatorNoiseRms: null, converged: true };
  const g = noiseGain(s.controller, s.loop, s.samplePeriod);
  return { quantisationStep: q, measurementNoiseRms: rms, noiseGain: g.gain, actuatorNoiseRms: rms * g.gain, converged: g.converged };
}

/** Loop-quality warnings of the sampled loop beside a continuous design: prefixed codes, and no repeat of the derivative warning. */
function asSampledLoopWarnings(warnings: Warning[]): Warning[] {
  return warnings
    .filter((w) => w.code !== WARNING_CODES.unfilteredDerivative)
    .map((w) => ({ ...w, code: SAMPLED_PREFIX + w.code, message: `Sampled loop: ${w.message}` }));
}

function sampledPart(request: AnalysisRequest, s: SampledLoop, continuous: ContinuousDesign | null, unfilteredDerivative: boolean) {
  const analysis = asContractError(() =>
    analyzeSampledLoop(s.loop, {
      criteria: resolveCriteria(request.criteria ?? {}),
      samplePeriod: s.samplePeriod,
      includeResponse: (request.detail ?? 'full') === 'full',
      responseGrid: request.frequency,
      unfilteredDerivative,
    }),
  );
  const gain = nyquistGain(s);
  const controller = controllerFigures(s, gain);
  const noise = noiseFigures(request, s, analysis);
  const bandwidth = judgedBandwidth(continuous, analysis);
  const limit = request.measurementNoise?.actuatorNoiseLimit;
  const samplingWarnings = collectSamplingWarnings({
    samplePeriod: s.samplePeriod,
    bandwidth,
    nyquistGainRatio: controller ? (Number.isFinite(gain!) ? controller.gainAtNyquistFrequency.relativeToProportional : Infinity) : null,
    nyquistGain: gain,
    controllerUnstablePoles: controller?.unstablePoles ?? 0,
    actuatorNoise: noise && noise.actuatorNoiseRms !== null && limit !== undefined ? { rms: noise.actuatorNoiseRms, limit } : null,
  });
  const notes: string[] = [];
  if (s.plantKind === 'zero-order-hold-exact') {
    notes.push(
      `The plant is sampled exactly behind a zero-order hold (no aliasing approximation)${s.computationDelay > 0 ? `, with the computation delay of ${s.computationDelay} s added to its input delay` : ''}.`,
    );
  }
  if (s.plantKind === 'hold-response-without-aliasing') {
    notes.push(
      `This plant has no rational model, so it cannot be sampled exactly: the loop is C(e^{jωTs})·H(jω)·P(jω) with the hold's exact response H = (1 − e^{−jωTs})/(jωTs)${s.computationDelay > 0 ? ` and the computation delay e^{−jω·${s.computationDelay}}` : ''}, neglecting aliasing (exact only when |P| is negligible above π/Ts); no closed-loop poles in z are computed.`,
    );
  }
  notes.push(`The response of a sampled loop repeats above the Nyquist frequency π/Ts = ${analysis.nyquistFrequency.toPrecision(6)} rad/s; it is examined on (0, π/Ts].`);
  notes.push(
    continuous
      ? 'The top-level figures describe the continuous design C(s)·P(s); this block describes the loop as the firmware runs it.'
      : 'The plant is given in z: the top-level figures are those of this sampled loop (closed-loop poles in z are in sampled.stability).',
  );
  if (!continuous && request.timeResponse) notes.push('timeResponse is not computed for a plant given in z.');
  const block: SampledBlock = {
    samplePeriod: s.samplePeriod,
    nyquistFrequency: analysis.nyquistFrequency,
    samplingFrequency: (2 * Math.PI) / s.samplePeriod,
    implementation: { method: s.method, prewarpFrequency: s.prewarpFrequency, computationDelay: s.computationDelay },
    plant: s.plantKind,
    stability: analysis.stability,
    margins: analysis.margins,
    peaks: analysis.peaks,
    bandwidth: analysis.bandwidth,
    grid: analysis.grid,
    continuousDesign: continuous
      ? samplingCost(continuous.loop, continuous.result.margins, s.loop, analysis.margins, s.samplePeriod, s.computationDelay)
      : null,
    controller,
    plantModel: s.plant ? { numerator: s.plant.discrete.numerator, denominator: s.plant.discrete.denominator, delaySamples: s.plant.discrete.delaySamples } : null,
    sampleRate: {
      samplesPerBandwidth: bandwidth ? (2 * Math.PI) / s.samplePeriod / bandwidth.frequency : null,
      bandwidth: bandwidth?.frequency ?? null,
      bandwidthOf: bandwidth?.what ?? null,
    },
    noise,
    notes,
    ...(analysis.response ? { response: analysis.response } : {}),
  };
  return { analysis, block, samplingWarnings };
}

/** For a continuous plant with a sampled controller: adds `sampled` and its warnings to the continuous answer. */
export function attachSampledAnalysis(request: AnalysisRequest, built: BuiltLoop, result: LoopAnalysis): void {
  if (!isSampledRequest(request)) return;
  const s = buildSampledLoop(request, built.plant);
  const { analysis, block, samplingWarnings } = sampledPart(request, s, { loop: built.loop, result }, false);
  result.warnings.push(...asSampledLoopWarnings(analysis.warnings), ...samplingWarnings);
  (result as LoopAnalysis & { sampled?: SampledBlock }).sampled = block;
}

/** For a plant given in z: the sampled loop is the only loop; its figures are the answer's. */
export function analyzeDiscreteRequest(request: AnalysisRequest): LoopAnalysis & { sampled: SampledBlock } {
  const s = buildSampledLoop(request, null);
  const unfilteredDerivative = s.pid?.unfilteredDerivative ?? false;
  const { analysis, block, samplingWarnings } = sampledPart(request, s, null, unfilteredDerivative);
  const st = analysis.stability;
  return {
    stability: {
      closedLoopStable: st.closedLoopStable,
      openLoopUnstablePoles: st.openLoopUnstablePoles,
      openLoopUnstablePolesAssumed: false,
      integrators: st.integrators,
      imaginaryAxisPoles: st.unitCirclePoles,
      method: st.method === 'unit-circle-nyquist-and-roots' ? 'nyquist-and-roots' : 'nyquist',
      nyquist: {
        clockwiseEncirclements: st.nyquist.clockwiseEncirclements,
        closedLoopUnstablePoles: st.nyquist.closedLoopUnstablePoles,
        sweepTo: analysis.nyquistFrequency,
        closestApproachToCritical: st.nyquist.closestApproachToCritical,
      },
    },
    margins: analysis.margins,
    peaks: analysis.peaks,
    bandwidth: analysis.bandwidth,
    warnings: [...analysis.warnings, ...samplingWarnings],
    grid: analysis.grid,
    ...(analysis.response ? { response: analysis.response } : {}),
    sampled: block,
  };
}
