/**
 * Which requests describe a sampled loop (a controller with an
 * `implementation`, or a plant with variable "z"), and the checks such a
 * request must pass before any model is built (413/422).
 */
import { ModelError } from '../model/model-error.js';
import { LoopgateError, type ErrorCode } from './errors.js';
import type { AnalysisRequest } from './schemas/analysis-request.js';

type Path = (string | number)[];
type Plant = AnalysisRequest['plant'];
type Controller = NonNullable<AnalysisRequest['controller']>;

/** Whole samples of delay beyond which a sampled loop is refused (its grid and polynomials would be too large). */
export const MAX_DELAY_SAMPLES = 5000;

const fail = (code: ErrorCode, message: string, path: Path): never => {
  throw new LoopgateError(code, message, [{ path, message }]);
};

export const isDiscretePlant = (plant: Plant): boolean =>
  (plant.kind === 'transfer-function' || plant.kind === 'zeros-poles') && plant.variable === 'z';

/** Throws (422) for a plant given in z: callers that only handle continuous loops use it. */
export function refuseDiscretePlant(plant: Plant): void {
  if (!isDiscretePlant(plant)) return;
  throw new ModelError(
    'discrete_plant_not_supported_here',
    'A plant given in z (variable "z") is analysed only by the sampled-loop review of POST /v1/analyses; give the continuous plant here.',
    ['plant', 'variable'],
  );
}

export const implementationOf = (c: AnalysisRequest['controller']): Controller['implementation'] | undefined => c?.implementation;

export const isSampledRequest = (r: AnalysisRequest): boolean => isDiscretePlant(r.plant) || implementationOf(r.controller) !== undefined;

/** The sample period the loop runs at. */
export function samplePeriodOf(r: AnalysisRequest): number {
  const impl = implementationOf(r.controller);
  if (impl) return impl.samplePeriod;
  return (r.plant as { samplePeriod: number }).samplePeriod;
}

function checkPlantFields(plant: Plant): void {
  if (plant.kind !== 'transfer-function' && plant.kind !== 'zeros-poles') return;
  if (plant.variable === 'z') {
    if (plant.samplePeriod === undefined) fail('sample_period_missing', 'A plant with variable "z" needs its samplePeriod (seconds).', ['plant', 'samplePeriod']);
    return;
  }
  if (plant.samplePeriod !== undefined) {
    fail('discrete_fields_without_z', 'samplePeriod belongs to discrete plants: set variable to "z", or drop it for a continuous plant.', ['plant', 'samplePeriod']);
  }
  if (plant.kind === 'transfer-function' && plant.coefficientOrder !== undefined) {
    fail('discrete_fields_without_z', 'coefficientOrder belongs to discrete plants: set variable to "z", or drop it for a continuous plant.', ['plant', 'coefficientOrder']);
  }
}

export function checkSampledRequest(r: AnalysisRequest): void {
  checkPlantFields(r.plant);
  if (!isSampledRequest(r)) return;
  const impl = implementationOf(r.controller);
  const discrete = isDiscretePlant(r.plant);
  if (discrete && r.controller && !impl) {
    fail(
      'controller_implementation_missing',
      'The plant is given in z, so the controller must be sampled too: give controller.implementation (samplePeriod and method).',
      ['controller', 'implementation'],
    );
  }
  const ts = samplePeriodOf(r);
  if (discrete && impl) {
    const plantTs = (r.plant as { samplePeriod: number }).samplePeriod;
    if (Math.abs(plantTs - impl.samplePeriod) > 1e-12 * plantTs) {
      fail('sample_period_mismatch', `The controller runs at Ts = ${impl.samplePeriod} s but the plant is given at ${plantTs} s.`, ['controller', 'implementation', 'samplePeriod']);
    }
  }
  if (impl) {
    const d = impl.computationDelay ?? 0;
    if (d < 0) fail('negative_time', `controller.implementation.computationDelay is ${d}; times must not be negative.`, ['controller', 'implementation', 'computationDelay']);
    if (impl.method === 'tustin-prewarp' && !(impl.prewarpFrequency < Math.PI / ts)) {
      fail(
        'prewarp_frequency_too_high',
        `prewarpFrequency ${impl.prewarpFrequency} rad/s must lie below the Nyquist frequency π/Ts = ${Math.PI / ts} rad/s.`,
        ['controller', 'implementation', 'prewarpFrequency'],
      );
    }
  }
  const plantDelay = 'delay' in r.plant && typeof r.plant.delay === 'number' ? r.plant.delay : 0;
  const total = plantDelay + (impl?.computationDelay ?? 0);
  if (total / ts > MAX_DELAY_SAMPLES) {
    fail(
      'too_many_delay_samples',
      `The delay is ${(total / ts).toFixed(0)} samples long; at most ${MAX_DELAY_SAMPLES} are allowed. Sample more slowly or check the delay.`,
      ['plant', 'delay'],
    );
  }
}
