/** Plant given as N(s)/D(s)·e^{−sT} with coefficients in descending powers of s. */
import { rationalModel } from '../rational-model.js';
import type { FrequencyModel } from '../frequency-model.js';
import type { TransferFunctionPlant } from '../plant-description.js';
import { ModelError } from '../model-error.js';

export function transferFunctionModel(plant: TransferFunctionPlant, path: (string | number)[] = ['plant']): FrequencyModel {
  if (plant.denominator.every((c) => c === 0)) {
    throw new ModelError('zero_denominator', 'The denominator is empty or identically zero.', [...path, 'denominator']);
  }
  if (plant.numerator.every((c) => c === 0)) {
    throw new ModelError('zero_numerator', 'The numerator is identically zero: the plant has no gain to analyse.', [...path, 'numerator']);
  }
  return rationalModel(plant.numerator, plant.denominator, plant.delay ?? 0);
}
