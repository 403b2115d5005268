/**
 * A sampled-loop request → the loop in z: the plant behind a zero-order
 * hold (exact, with the computation delay added to its input delay) or as
 * given in z, and the PID controller discretised by the chosen method.
 * A plant without a rational model (measured data, an expression in s)
 * cannot be sampled exactly: its loop is C(e^{jωTs})·H(jω)·P(jω) with the
 * hold's response H and aliasing neglected.
 * Model errors become 422 answers as in build-loop.ts.
 */
import { discretePidModel } from '../model/discrete/discrete-pid.js';
import { discretePlantModel, type DiscretePlant } from '../model/discrete/discrete-plant.js';
import { discreteProduct } from '../model/discrete/discrete-product.js';
import { discreteRationalModel, type DiscreteModel } from '../model/discrete/discrete-model.js';
import type { DiscretisationMethod } from '../model/discrete/discretise-controller.js';
import { holdResponseModel } from '../model/discrete/hold-response.js';
import { heldPlantModel } from '../model/discrete/sampled-plant.js';
import { productModel } from '../model/loop.js';
import { splitDelay } from '../model/discrete/zero-order-hold.js';
import type { FrequencyModel } from '../model/frequency-model.js';
import { ModelError } from '../model/model-error.js';
import { pidModel, type PidModel } from '../model/pid.js';
import type { PidController } from '../model/plant-description.js';
import { asContractError } from './build-loop.js';
import { implementationOf, isDiscretePlant, samplePeriodOf } from './sampled-request.js';
import type { AnalysisRequest } from './schemas/analysis-request.js';

export interface SampledLoop {
  /** The loop on the unit circle; with z-polynomials unless the plant is only approximated (`plantKind`). */
  loop: FrequencyModel & { discrete?: DiscreteModel['discrete'] };
  /** The plant as the controller sees it, in z (hold and computation delay included); null when approximated. */
  plant: DiscreteModel | null;
  controller: DiscreteModel | null;
  pid: PidModel | null;
  samplePeriod: number;
  method: DiscretisationMethod | null;
  prewarpFrequency: number | null;
  computationDelay: number;
  plantKind: 'zero-order-hold-exact' | 'given-in-z' | 'hold-response-without-aliasing';
}

/** z^(−k) for a computation delay of k whole samples on a plant given in z. */
function sampleDelay(delay: number, ts: number): DiscreteModel {
  const { samples, fraction } = splitDelay(delay, ts);
  if (fraction > 0) {
    throw new ModelError(
      'fractional_sample_delay',
      `With a plant given in z the computation delay must be a whole number of samples (got ${delay} s with Ts = ${ts} s).`,
      ['controller', 'implementation', 'computationDelay'],
    );
  }
  return discreteRationalModel({ samplePeriod: ts, numerator: [1], denominator: [1], delaySamples: samples });
}

/**
 * @param continuousPlant the continuous plant's model when the plant is not given in z
 */
export function buildSampledLoop(request: AnalysisRequest, continuousPlant: FrequencyModel | null): SampledLoop {
  return asContractError(() => {
    const ts = samplePeriodOf(request);
    const impl = implementationOf(request.controller);
    const computationDelay = impl?.computationDelay ?? 0;
    let plant: DiscreteModel | null = null;
    if (isDiscretePlant(request.plant)) {
      plant = discretePlantModel(request.plant as unknown as DiscretePlant);
      if (computationDelay > 0) plant = discreteProduct(sampleDelay(computationDelay, ts), plant);
    } else if (continuousPlant!.rational) {
      plant = heldPlantModel(continuousPlant!, ts, computationDelay);
    }
    if (!request.controller || !impl) {
      return { loop: plant!, plant, controller: null, pid: null, samplePeriod: ts, method: null, prewarpFrequency: null, computationDelay, plantKind: 'given-in-z' };
    }
    const pid = pidModel(request.controller as PidController);
    const controller = discretePidModel(pid, {
      samplePeriod: ts,
      method: impl.method,
      prewarpFrequency: impl.method === 'tustin-prewarp' ? impl.prewarpFrequency : undefined,
    });
    const loop = plant ? discreteProduct(controller, plant) : productModel(productModel(controller, holdResponseModel(ts, computationDelay)), continuousPlant!);
    return {
      loop,
      plant,
      controller,
      pid,
      samplePeriod: ts,
      method: impl.method,
      prewarpFrequency: impl.method === 'tustin-prewarp' ? impl.prewarpFrequency : null,
      computationDelay,
      plantKind: isDiscretePlant(request.plant) ? 'given-in-z' : plant ? 'zero-order-hold-exact' : 'hold-response-without-aliasing',
    };
  });
}
