/**
 * The product of two discrete models with the same sample period (the
 * sampled loop C(z)·P(z)): the FrequencyModel part as for continuous
 * factors (productModel), and the z-polynomials multiplied out for the
 * closed-loop characteristic polynomial.
 */
import { multiply } from '../../numeric/polynomial.js';
import { productModel } from '../loop.js';
import { ModelError } from '../model-error.js';
import type { DiscreteModel } from './discrete-model.js';

export function discreteProduct(a: DiscreteModel, b: DiscreteModel): DiscreteModel {
  const ts = a.discrete.samplePeriod;
  if (Math.abs(b.discrete.samplePeriod - ts) > 1e-12 * ts) {
    throw new ModelError(
      'sample_period_mismatch',
      `The controller runs at Ts = ${a.discrete.samplePeriod} s but the plant is sampled at ${b.discrete.samplePeriod} s.`,
      ['controller', 'implementation', 'samplePeriod'],
    );
  }
  const continuousPart = productModel(a, b);
  return {
    ...continuousPart,
    rational: null,
    // Coefficients in s, not z: never to be fused as a continuous product.
    rationalFactors: undefined,
    // Bounds on |G| above ω mean nothing on the unit circle; none is claimed.
    magnitudeBoundAbove: () => Infinity,
    deviationBoundAbove: () => Infinity,
    discrete: {
      samplePeriod: ts,
      numerator: multiply(a.discrete.numerator, b.discrete.numerator),
      denominator: multiply(a.discrete.denominator, b.discrete.denominator),
      delaySamples: a.discrete.delaySamples + b.discrete.delaySamples,
      zeros: [...a.discrete.zeros, ...b.discrete.zeros],
      poles: [...a.discrete.poles, ...b.discrete.poles],
    },
  };
}
