/**
 * A model at many frequencies at once, into two Float64Arrays (real and
 * imaginary parts). Rational models and products of them run one loop over
 * the frequencies (their `evaluateBatch`); any other model is called point by
 * point.
 */
import type { Complex } from '../numeric/complex.js';
import type { FrequencyModel } from './frequency-model.js';

const point: Complex = { re: 0, im: 0 };

export function evaluateAll(model: FrequencyModel, omega: ArrayLike<number>, re: Float64Array, im: Float64Array, count = omega.length): void {
  if (model.evaluateBatch) {
    model.evaluateBatch(omega, re, im, count);
    return;
  }
  for (let k = 0; k < count; k++) {
    model.evaluate(omega[k], point);
    re[k] = point.re;
    im[k] = point.im;
  }
}
