/** Dispatch from a plant description to the model of its kind (one file per kind under plants/). */
import type { FrequencyModel } from './frequency-model.js';
import type { PlantDescription } from './plant-description.js';
import { frequencyResponseModel } from './plants/frequency-response.js';
import { transferFunctionModel } from './plants/transfer-function.js';
import { zerosPolesModel } from './plants/zeros-poles.js';
import { stateSpaceModel } from './plants/state-space.js';
import { expressionModel } from './plants/expression.js';

export function plantModel(plant: PlantDescription, path: (string | number)[] = ['plant']): FrequencyModel {
  switch (plant.kind) {
    case 'transfer-function':
      return transferFunctionModel(plant, path);
    case 'zeros-poles':
      return zerosPolesModel(plant, path);
    case 'state-space':
      return stateSpaceModel(plant, path);
    case 'expression':
      return expressionModel(plant, path);
    case 'frequency-response':
      return frequencyResponseModel(plant, path);
  }
}
