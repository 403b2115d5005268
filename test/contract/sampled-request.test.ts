/**
 * Requests for sampled loops that cannot be analysed get the catalogue's
 * codes and paths (DESIGN.md: 400 for the shape, 413 for size, 422 for what
 * cannot be analysed), and a plant in z is never read as a plant in s.
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/index.js';
import { buildLoop } from '../../src/contract/build-loop.js';
import type { AnalysisRequest } from '../../src/contract/schemas/analysis-request.js';
import { LoopgateError } from '../../src/contract/errors.js';

const lag = { kind: 'transfer-function', numerator: [2], denominator: [0.5, 1] };
const pi = (implementation: Record<string, unknown>, extra: Record<string, unknown> = {}) => ({ kind: 'pid', form: 'parallel', kp: 1, ki: 0.5, implementation, ...extra });

function failure(body: unknown): LoopgateError {
  try {
    analyze(body);
  } catch (e) {
    if (e instanceof LoopgateError) return e;
    throw e;
  }
  throw new Error('expected a LoopgateError');
}

describe('sampled-loop request errors', () => {
  const cases: [string, unknown, number, string, (string | number)[]][] = [
    ['tustin-prewarp without prewarpFrequency', { plant: lag, controller: pi({ samplePeriod: 0.1, method: 'tustin-prewarp' }) }, 400, 'validation_failed', ['controller', 'implementation', 'prewarpFrequency']],
    ['samplePeriod of zero', { plant: lag, controller: pi({ samplePeriod: 0, method: 'tustin' }) }, 400, 'validation_failed', ['controller', 'implementation', 'samplePeriod']],
    ['prewarp frequency at the Nyquist frequency', { plant: lag, controller: pi({ samplePeriod: 0.1, method: 'tustin-prewarp', prewarpFrequency: Math.PI / 0.1 }) }, 422, 'prewarp_frequency_too_high', ['controller', 'implementation', 'prewarpFrequency']],
    ['negative computation delay', { plant: lag, controller: pi({ samplePeriod: 0.1, method: 'tustin', computationDelay: -0.1 }) }, 422, 'negative_time', ['controller', 'implementation', 'computationDelay']],
    ['forward Euler of an unfiltered derivative', { plant: lag, controller: { kind: 'pid', form: 'parallel', kp: 1, kd: 0.1, implementation: { samplePeriod: 0.1, method: 'forward-euler' } } }, 422, 'discrete_controller_non_causal', ['controller', 'implementation', 'method']],
    ['a delay of more than 5000 samples', { plant: { ...lag, delay: 600 }, controller: pi({ samplePeriod: 0.1, method: 'tustin' }) }, 413, 'too_many_delay_samples', ['plant', 'delay']],
    ['variable z without samplePeriod', { plant: { ...lag, variable: 'z' } }, 422, 'sample_period_missing', ['plant', 'samplePeriod']],
    ['samplePeriod on a plant in s', { plant: { ...lag, samplePeriod: 0.1 } }, 422, 'discrete_fields_without_z', ['plant', 'samplePeriod']],
    ['coefficientOrder on a plant in s', { plant: { ...lag, coefficientOrder: 'ascending-powers-of-inverse-z' } }, 422, 'discrete_fields_without_z', ['plant', 'coefficientOrder']],
    ['a plant in z with a continuous controller', { plant: { ...lag, variable: 'z', samplePeriod: 0.1 }, controller: { kind: 'pid', form: 'parallel', kp: 1 } }, 422, 'controller_implementation_missing', ['controller', 'implementation']],
    ['a plant in z at another sample period', { plant: { ...lag, variable: 'z', samplePeriod: 0.1 }, controller: pi({ samplePeriod: 0.2, method: 'tustin' }) }, 422, 'sample_period_mismatch', ['controller', 'implementation', 'samplePeriod']],
    ['a plant in z with a fractional delay', { plant: { ...lag, variable: 'z', samplePeriod: 0.1, delay: 0.15 } }, 422, 'fractional_sample_delay', ['plant', 'delay']],
    ['a plant in z with a fractional computation delay', { plant: { ...lag, variable: 'z', samplePeriod: 0.1 }, controller: pi({ samplePeriod: 0.1, method: 'tustin', computationDelay: 0.05 }) }, 422, 'fractional_sample_delay', ['controller', 'implementation', 'computationDelay']],
    ['a non-causal plant in z', { plant: { kind: 'transfer-function', variable: 'z', samplePeriod: 0.1, numerator: [1, 0, 0], denominator: [1, -0.5] } }, 422, 'discrete_plant_non_causal', ['plant', 'numerator']],
    ['a0 = 0 in powers of z⁻¹', { plant: { kind: 'transfer-function', variable: 'z', samplePeriod: 0.1, coefficientOrder: 'ascending-powers-of-inverse-z', numerator: [1], denominator: [0, 1] } }, 422, 'discrete_plant_non_causal', ['plant', 'denominator', 0]],
    ['an algebraic loop in z', { plant: { kind: 'transfer-function', variable: 'z', samplePeriod: 0.1, numerator: [-1, 0.2], denominator: [1, 0.5] } }, 422, 'discrete_loop_algebraic', ['controller']],
    ['an unpaired complex pole in z', { plant: { kind: 'zeros-poles', variable: 'z', samplePeriod: 0.1, zeros: [], poles: [{ re: 0.5, im: 0.2 }], gain: 1 } }, 422, 'unpaired_complex_root', ['plant', 'poles', 0]],
  ];
  for (const [name, body, status, code, path] of cases) {
    it(`${name}: ${status} ${code}`, () => {
      const e = failure(body);
      expect(e.statusCode).toBe(status);
      expect(e.code).toBe(code);
      expect(e.issues![0].path).toEqual(path);
    });
  }

  it('buildLoop (checks, reports) refuses a plant in z instead of reading it as a plant in s', () => {
    const request = { plant: { ...lag, variable: 'z', samplePeriod: 0.1 } } as unknown as AnalysisRequest;
    expect(() => buildLoop(request)).toThrow(expect.objectContaining({ code: 'discrete_plant_not_supported_here', statusCode: 422 }));
  });
});
