/** Plant and controller descriptions → the loop model, with model errors turned into 422 answers. */
import type { FrequencyModel } from '../model/frequency-model.js';
import { ModelError } from '../model/model-error.js';
import { plantModel } from '../model/plant-model.js';
import { pidModel, type PidModel } from '../model/pid.js';
import { productModel, requireAnalysableLoop } from '../model/loop.js';
import { LoopgateError, isErrorCode } from './errors.js';
import type { AnalysisRequest } from './schemas/analysis-request.js';
import { refuseDiscretePlant } from './sampled-request.js';

export interface BuiltLoop {
  loop: FrequencyModel;
  plant: FrequencyModel;
  controller: PidModel | null;
  unfilteredDerivative: boolean;
}

/** Runs `f`, turning a ModelError into the catalogue's LoopgateError (422). */
export function asContractError<T>(f: () => T, pathPrefix: (string | number)[] = []): T {
  try {
    return f();
  } catch (err) {
    if (err instanceof ModelError) {
      const code = isErrorCode(err.code) ? err.code : 'validation_failed';
      const path = [...pathPrefix, ...err.path];
      throw new LoopgateError(code, err.message, [{ path, message: err.message }]);
    }
    // Numeric routines throw RangeError when a bracket is lost (NaN inside the model, say):
    // that is a property of what the caller sent, not a fault of ours.
    if (err instanceof RangeError) {
      const message = `The loop could not be analysed numerically: ${err.message}`;
      throw new LoopgateError('numerically_unanalysable', message, [{ path: [...pathPrefix, 'plant'], message }]);
    }
    throw err;
  }
}

export function buildLoop(request: Pick<AnalysisRequest, 'plant' | 'controller'>, pathPrefix: (string | number)[] = []): BuiltLoop {
  return asContractError(() => {
    // A plant in z read as a plant in s would be silently wrong; only the sampled-loop review takes it.
    refuseDiscretePlant(request.plant);
    const plant = plantModel(request.plant);
    if (!request.controller) {
      requireAnalysableLoop(plant);
      return { loop: plant, plant, controller: null, unfilteredDerivative: false };
    }
    const controller = pidModel(request.controller);
    const loop = productModel(plant, controller);
    requireAnalysableLoop(loop);
    return { loop, plant, controller, unfilteredDerivative: controller.unfilteredDerivative };
  }, pathPrefix);
}
