/**
 * A PID controller (any form, derivative filter included) as the difference
 * equation its firmware runs: the rational C(s) of pidModel, discretised
 * factor by factor by the chosen method (discretise-controller.ts).
 */
import type { PidModel } from '../pid.js';
import { discretiseController, type DiscretisationSettings } from './discretise-controller.js';
import type { DiscreteModel } from './discrete-model.js';

export function discretePidModel(pid: PidModel, settings: DiscretisationSettings): DiscreteModel {
  const { numerator, denominator } = pid.rational!;
  return discretiseController({ gain: numerator[0] / denominator[0], zeros: pid.zeros!, poles: pid.poles! }, settings);
}
