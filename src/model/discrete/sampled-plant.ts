/**
 * The plant a digital controller sees: a rational continuous plant behind a
 * zero-order hold and sampler, with the controller's computation delay added
 * to the plant's own input delay (both only shift the held input in time, so
 * the modified z-transform treats them alike).
 */
import type { FrequencyModel } from '../frequency-model.js';
import { ModelError } from '../model-error.js';
import { companionRealisation } from './companion-realisation.js';
import type { DiscreteModel } from './discrete-model.js';
import { zeroOrderHoldEquivalent } from './zero-order-hold.js';

export function heldPlantModel(plant: FrequencyModel, samplePeriod: number, computationDelay = 0): DiscreteModel {
  if (!plant.rational || !plant.poles) {
    throw new ModelError(
      'sampled_plant_not_rational',
      'The exact sample-and-hold equivalent needs a rational plant (transfer-function, zeros-poles or state-space).',
      ['plant', 'kind'],
    );
  }
  const realisation = companionRealisation(plant.rational.numerator, plant.rational.denominator);
  return zeroOrderHoldEquivalent({ realisation, poles: plant.poles, delay: plant.delay + computationDelay }, samplePeriod);
}
