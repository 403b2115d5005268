/**
 * PID controllers in the three usual forms (Åström & Hägglund, Advanced PID
 * Control, ISA 2006, §3.4), each reduced to one rational function:
 *
 *   parallel  C = kp + ki/s + kd·s/(1 + Tf·s)
 *   standard  C = K·(1 + 1/(Ti·s) + Td·s/(1 + Tf·s))          (kp = K, ki = K/Ti, kd = K·Td)
 *   series    C = K·(1 + 1/(Ti·s))·(1 + Td·s)/(1 + Tf·s)
 *
 * The derivative filter is Tf = Td/N or a given time constant; without one
 * the derivative is pure and C is improper (the caller is warned).
 */
import { multiply } from '../numeric/polynomial.js';
import type { FrequencyModel } from './frequency-model.js';
import type { PidController } from './plant-description.js';
import { rationalModel } from './rational-model.js';
import { ModelError } from './model-error.js';

export interface PidModel extends FrequencyModel {
  /** True when there is derivative action without a filter. */
  unfilteredDerivative: boolean;
  /** Filter time constant, 0 when there is no filter. */
  filterTimeConstant: number;
  /** Equivalent parallel gains, for reports. */
  parallelGains: { kp: number; ki: number; kd: number };
}

function filterTimeConstant(c: PidController, derivativeTime: number, path: (string | number)[]): number {
  const f = c.derivativeFilter;
  if (!f) return 0;
  if ('timeConstant' in f) return f.timeConstant;
  if (derivativeTime === 0) return 0; // no derivative action: nothing to filter
  if (!Number.isFinite(derivativeTime)) {
    throw new ModelError(
      'derivative_filter_undefined',
      'A filter given as N needs Td = kd/kp, which is undefined when kp = 0; give derivativeFilter.timeConstant instead.',
      [...path, 'derivativeFilter', 'n'],
    );
  }
  return derivativeTime / f.n;
}

/** Numerator and denominator of kp + ki/s + kd·s/(1 + Tf·s) with the common factors present only when needed. */
function parallelRational(kp: number, ki: number, kd: number, tf: number): { num: number[]; den: number[] } {
  if (kd === 0) {
    return ki === 0 ? { num: [kp], den: [1] } : { num: [kp, ki], den: [1, 0] };
  }
  if (ki === 0) return { num: [kp * tf + kd, kp], den: [tf, 1] };
  return { num: [kp * tf + kd, kp + ki * tf, ki], den: [tf, 1, 0] };
}

export function pidModel(c: PidController, path: (string | number)[] = ['controller']): PidModel {
  let num: number[];
  let den: number[];
  let gains: { kp: number; ki: number; kd: number };
  let tf: number;
  if (c.form === 'parallel') {
    const kp = c.kp ?? 0;
    const ki = c.ki ?? 0;
    const kd = c.kd ?? 0;
    tf = filterTimeConstant(c, kd === 0 ? 0 : kp === 0 ? NaN : kd / kp, path);
    gains = { kp, ki, kd };
    ({ num, den } = parallelRational(kp, ki, kd, tf));
  } else {
    const k = c.gain;
    const ti = c.integralTime;
    const td = c.derivativeTime ?? 0;
    if (ti !== undefined && ti <= 0) {
      throw new ModelError('integral_time_not_positive', 'integralTime must be positive (omit it for no integral action).', [...path, 'integralTime']);
    }
    tf = filterTimeConstant(c, td, path);
    if (c.form === 'standard') {
      gains = { kp: k, ki: ti === undefined ? 0 : k / ti, kd: k * td };
      ({ num, den } = parallelRational(gains.kp, gains.ki, gains.kd, tf));
    } else {
      // K·(Ti s + 1)(Td s + 1) / (Ti s·(Tf s + 1)), factors dropped when absent.
      num = [k];
      den = [1];
      if (ti !== undefined) {
        num = multiply(num, [ti, 1]);
        den = multiply(den, [ti, 0]);
      }
      if (td !== 0) {
        num = multiply(num, [td, 1]);
        if (tf !== 0) den = multiply(den, [tf, 1]);
      }
      // Equivalent parallel gains of the series form (interaction factor 1 + Td/Ti).
      const f = ti === undefined ? 1 : 1 + td / ti;
      gains = { kp: k * f, ki: ti === undefined ? 0 : k / ti, kd: k * td };
    }
  }
  if (num.every((x) => x === 0)) {
    throw new ModelError('zero_controller', 'The controller has no gain at all (every term is zero).', path);
  }
  // Extends the rational model in place: spreading its twenty-odd fields into a new object cost more than building it.
  return Object.assign(rationalModel(num, den, 0), {
    unfilteredDerivative: gains.kd !== 0 && tf === 0,
    filterTimeConstant: tf,
    parallelGains: gains,
  });
}
