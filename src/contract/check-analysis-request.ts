/**
 * Checks a schema-valid analysis request against the size limits (413) and
 * the rules that make it analysable (422) before any model is built.
 */
import { LoopgateError, type ErrorCode } from './errors.js';
import { LIMITS } from './limits.js';
import type { AnalysisRequest } from './schemas/analysis-request.js';

type Path = (string | number)[];

const fail = (code: ErrorCode, message: string, path: Path): never => {
  throw new LoopgateError(code, message, [{ path, message }]);
};

function checkTime(value: number | undefined, path: Path): void {
  if (value !== undefined && value < 0) fail('negative_time', `${path.join('.')} is ${value}; times must not be negative.`, path);
}

function checkPolynomial(p: number[], path: Path): void {
  if (p.length - 1 > LIMITS.maxPolynomialDegree) {
    fail('polynomial_too_large', `The polynomial at ${path.join('.')} has degree ${p.length - 1}; at most ${LIMITS.maxPolynomialDegree} is allowed.`, path);
  }
}

export function checkPlantLimits(plant: AnalysisRequest['plant'], path: Path = ['plant']): void {
  switch (plant.kind) {
    case 'transfer-function':
      checkPolynomial(plant.numerator, [...path, 'numerator']);
      checkPolynomial(plant.denominator, [...path, 'denominator']);
      checkTime(plant.delay, [...path, 'delay']);
      break;
    case 'zeros-poles':
      if (plant.zeros.length > LIMITS.maxRoots) fail('too_many_roots', `At most ${LIMITS.maxRoots} zeros are allowed.`, [...path, 'zeros']);
      if (plant.poles.length > LIMITS.maxRoots) fail('too_many_roots', `At most ${LIMITS.maxRoots} poles are allowed.`, [...path, 'poles']);
      checkTime(plant.delay, [...path, 'delay']);
      break;
    case 'state-space':
      if (plant.a.length > LIMITS.maxStates || plant.a.some((r) => r.length > LIMITS.maxStates)) {
        fail('state_space_too_large', `At most ${LIMITS.maxStates} states are allowed.`, [...path, 'a']);
      }
      checkTime(plant.delay, [...path, 'delay']);
      break;
    case 'frequency-response': {
      for (const key of ['frequency', 'magnitude', 'phase', 'real', 'imag', 'coherence'] as const) {
        const column = plant[key];
        if (column && column.length > LIMITS.maxGridPoints) {
          fail('too_many_measured_points', `${key} has ${column.length} values; at most ${LIMITS.maxGridPoints} are allowed.`, [...path, key]);
        }
      }
      if (plant.csv !== undefined && plant.csv.split('\n').length > LIMITS.maxGridPoints + 100) {
        fail('too_many_measured_points', `The CSV has more than ${LIMITS.maxGridPoints} rows.`, [...path, 'csv']);
      }
      break;
    }
    case 'expression':
      if (plant.expression.length > LIMITS.maxExpressionLength) {
        fail('expression_too_long', `The expression has ${plant.expression.length} characters; at most ${LIMITS.maxExpressionLength} are allowed.`, [...path, 'expression']);
      }
      break;
  }
}

export function checkControllerTimes(c: AnalysisRequest['controller'], path: Path = ['controller']): void {
  if (!c) return;
  if (c.form !== 'parallel') {
    checkTime(c.integralTime, [...path, 'integralTime']);
    checkTime(c.derivativeTime, [...path, 'derivativeTime']);
  }
  const f = c.derivativeFilter;
  if (f && 'timeConstant' in f) checkTime(f.timeConstant, [...path, 'derivativeFilter', 'timeConstant']);
}

export function checkFrequencyGrid(g: AnalysisRequest['frequency'], path: Path = ['frequency']): void {
  if (!g) return;
  if (g.points > LIMITS.maxGridPoints) fail('too_many_points', `${g.points} points asked; at most ${LIMITS.maxGridPoints} are allowed.`, [...path, 'points']);
  if (!(g.min > 0)) fail('invalid_frequency_grid', `frequency.min must be above 0 rad/s (got ${g.min}).`, [...path, 'min']);
  if (!(g.max > g.min)) fail('invalid_frequency_grid', `frequency.max (${g.max}) must be above frequency.min (${g.min}).`, [...path, 'max']);
}

export function checkAnalysisRequest(r: AnalysisRequest): void {
  checkPlantLimits(r.plant);
  checkControllerTimes(r.controller);
  checkFrequencyGrid(r.frequency);
}
