/**
 * Plants given directly in discrete time, as a transfer function in z or
 * by zeros, poles and gain in the z-plane, with sample period Ts.
 *
 * - transfer-function, coefficientOrder "descending-powers-of-z" (default):
 *   N(z)/D(z) with coefficients of z^n, ..., z^0 as for continuous plants;
 * - transfer-function, coefficientOrder "ascending-powers-of-inverse-z":
 *   (b0 + b1·z⁻¹ + ... + bM·z^(−M))/(a0 + a1·z⁻¹ + ... + aN·z^(−N)), the form
 *   of a difference equation a0·y_k + a1·y_{k−1} + ... = b0·u_k + b1·u_{k−1} + ...;
 * - zeros-poles: k·Π(z − z_i)/Π(z − p_i).
 * A delay must be a whole number of samples (it becomes z^(−d)); a plant
 * that would need future inputs (more zeros than poles in z, or a0 = 0) is
 * refused.
 */
import type { Complex } from '../../numeric/complex.js';
import { trimLeading, zeroRootMultiplicity } from '../../numeric/polynomial.js';
import { ModelError } from '../model-error.js';
import type { Root } from '../plant-description.js';
import { zerosPolesModel } from '../plants/zeros-poles.js';
import { discreteRationalModel, type DiscreteModel } from './discrete-model.js';
import { splitDelay } from './zero-order-hold.js';

export type CoefficientOrder = 'descending-powers-of-z' | 'ascending-powers-of-inverse-z';

export interface DiscreteTransferFunctionPlant {
  kind: 'transfer-function';
  numerator: number[];
  denominator: number[];
  samplePeriod: number;
  coefficientOrder?: CoefficientOrder;
  delay?: number;
}

export interface DiscreteZerosPolesPlant {
  kind: 'zeros-poles';
  zeros: Root[];
  poles: Root[];
  gain: number;
  samplePeriod: number;
  delay?: number;
}

export type DiscretePlant = DiscreteTransferFunctionPlant | DiscreteZerosPolesPlant;

type Path = (string | number)[];

function delaySamples(plant: DiscretePlant, path: Path): number {
  const { samples, fraction } = splitDelay(plant.delay ?? 0, plant.samplePeriod);
  if (fraction > 0) {
    throw new ModelError(
      'fractional_sample_delay',
      `A discrete plant's delay must be a whole number of samples (got ${plant.delay} s with Ts = ${plant.samplePeriod} s); give the continuous plant to have a fractional delay sampled exactly.`,
      [...path, 'delay'],
    );
  }
  return samples;
}

/** Both polynomials in descending powers of z, with common factors of z removed. */
function descending(plant: DiscreteTransferFunctionPlant, path: Path): { numerator: number[]; denominator: number[] } {
  let num = plant.numerator.slice();
  let den = plant.denominator.slice();
  if (plant.coefficientOrder === 'ascending-powers-of-inverse-z') {
    if (den[0] === 0) {
      throw new ModelError(
        'discrete_plant_non_causal',
        'The first denominator coefficient a0 (of z^0) is zero: the difference equation does not determine y_k.',
        [...path, 'denominator', 0],
      );
    }
    const k = Math.max(num.length, den.length);
    num = num.concat(new Array<number>(k - num.length).fill(0));
    den = den.concat(new Array<number>(k - den.length).fill(0));
  }
  num = trimLeading(num);
  den = trimLeading(den);
  const common = Math.min(zeroRootMultiplicity(num), zeroRootMultiplicity(den));
  return { numerator: num.slice(0, num.length - common), denominator: den.slice(0, den.length - common) };
}

const asComplex = (r: Root): Complex => (typeof r === 'number' ? { re: r, im: 0 } : { re: r.re, im: r.im });

export function discretePlantModel(plant: DiscretePlant, path: Path = ['plant']): DiscreteModel {
  const d = delaySamples(plant, path);
  let model: DiscreteModel;
  if (plant.kind === 'transfer-function') {
    if (plant.denominator.every((c) => c === 0)) {
      throw new ModelError('zero_denominator', 'The denominator is empty or identically zero.', [...path, 'denominator']);
    }
    if (plant.numerator.every((c) => c === 0)) {
      throw new ModelError('zero_numerator', 'The numerator is identically zero: the plant has no gain to analyse.', [...path, 'numerator']);
    }
    const { numerator, denominator } = descending(plant, path);
    model = discreteRationalModel({ samplePeriod: plant.samplePeriod, numerator, denominator, delaySamples: d }, path);
  } else {
    // The continuous zeros-poles model checks conjugate pairs and a non-zero gain with the same paths.
    zerosPolesModel({ kind: 'zeros-poles', zeros: plant.zeros, poles: plant.poles, gain: plant.gain }, path);
    const offsets = (roots: Root[]) => roots.map(asComplex).map((r) => ({ re: r.re - 1, im: r.im }));
    model = discreteRationalModel(
      {
        samplePeriod: plant.samplePeriod,
        numerator: { leading: plant.gain, rootsMinusOne: offsets(plant.zeros) },
        denominator: { leading: 1, rootsMinusOne: offsets(plant.poles) },
        delaySamples: d,
      },
      path,
    );
  }
  if (model.relativeDegree !== null && model.relativeDegree < 0) {
    throw new ModelError(
      'discrete_plant_non_causal',
      'The discrete plant has more zeros than poles in z: its output would depend on future inputs.',
      [...path, plant.kind === 'transfer-function' ? 'numerator' : 'zeros'],
    );
  }
  return model;
}
