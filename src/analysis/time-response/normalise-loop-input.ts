import type { RationalPart } from './closed-loop-stability.js';
import { TimeResponseInputError } from './time-response-input-error.js';
import { isZeroPolynomial, trimLeadingZeros } from './polynomial.js';
import type { ClosedLoopSimulationInput } from './types.js';

export const DEFAULT_POINTS = 1000;
/** Output samples are evaluated one by one with a matrix exponential; keep that bounded. */
export const MAX_POINTS = 20000;

export interface NormalisedLoop {
  plant: RationalPart;
  controller: RationalPart;
  delay: number;
  duration: number | null;
  points: number;
}

/**
 * Checks a loop description and brings each transfer function to a monic
 * denominator with leading zeros removed. Throws TimeResponseInputError for
 * non-finite numbers, zero denominators, improper transfer functions, a
 * negative delay, or a non-positive duration.
 */
export function normaliseLoopInput(input: ClosedLoopSimulationInput): NormalisedLoop {
  const plant = normaliseRational(input.plant.numerator, input.plant.denominator, 'plant');
  const controller = normaliseRational(input.controller.numerator, input.controller.denominator, 'controller');
  const delay = input.plant.delay;
  if (!Number.isFinite(delay) || delay < 0) {
    throw new TimeResponseInputError('INVALID_DELAY', 'plant.delay', `the delay must be a finite number ≥ 0 s, got ${delay}`);
  }
  let duration: number | null = null;
  if (input.duration !== undefined) {
    if (!Number.isFinite(input.duration) || input.duration <= 0) {
      throw new TimeResponseInputError('INVALID_DURATION', 'duration', `the duration must be a finite number > 0 s, got ${input.duration}`);
    }
    duration = input.duration;
  }
  const points = input.points ?? DEFAULT_POINTS;
  if (!Number.isInteger(points) || points < 2 || points > MAX_POINTS) {
    throw new TimeResponseInputError('INVALID_POINTS', 'points', `points must be an integer from 2 to ${MAX_POINTS}, got ${points}`);
  }
  return { plant, controller, delay, duration, points };
}

function normaliseRational(numerator: readonly number[], denominator: readonly number[], path: string): RationalPart {
  for (const [field, coefficients] of [
    ['numerator', numerator],
    ['denominator', denominator],
  ] as const) {
    if (coefficients.length === 0) {
      throw new TimeResponseInputError('EMPTY_COEFFICIENTS', `${path}.${field}`, `${path} ${field} has no coefficients`);
    }
    coefficients.forEach((c, i) => {
      if (!Number.isFinite(c)) {
        throw new TimeResponseInputError('NON_FINITE_NUMBER', `${path}.${field}.${i}`, `${path} ${field} coefficient ${i} is not a finite number`);
      }
    });
  }
  if (isZeroPolynomial(denominator)) {
    throw new TimeResponseInputError('ZERO_DENOMINATOR', `${path}.denominator`, `${path} denominator is zero`);
  }
  const den = trimLeadingZeros(denominator);
  const num = trimLeadingZeros(numerator);
  if (!isZeroPolynomial(num) && num.length > den.length) {
    throw new TimeResponseInputError(
      'IMPROPER_TRANSFER_FUNCTION',
      `${path}.numerator`,
      `${path} is improper: numerator degree ${num.length - 1} exceeds denominator degree ${den.length - 1}`,
    );
  }
  const lead = den[0];
  return { numerator: num.map((c) => c / lead), denominator: den.map((c) => c / lead) };
}
